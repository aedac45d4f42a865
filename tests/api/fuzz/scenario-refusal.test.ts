import fs from 'node:fs';
import path from 'node:path';
import fc from 'fast-check';
import { afterAll, describe, expect, it } from 'vitest';
import { ScenarioError, parseScenario } from '../../../simulation/scenario.js';
import { forecast } from '../../../simulation/forecast/index.js';
import { FUZZ_SEED, caseCounter } from './seed.js';
import { setAt } from '../helpers/schema-edges.js';

// Tests run from the repository root (vitest's root).
const examplesDir = path.resolve(process.cwd(), 'simulation/examples');
const examples = fs
  .readdirSync(examplesDir)
  .filter((f) => f.endsWith('.json'))
  .map((f) => JSON.parse(fs.readFileSync(path.join(examplesDir, f), 'utf8')) as Record<string, unknown>);

/** Every numeric leaf of a scenario, as a path. */
function numericPaths(value: unknown, at: (string | number)[] = []): (string | number)[][] {
  if (typeof value === 'number') return [at];
  if (Array.isArray(value)) return value.flatMap((v, i) => numericPaths(v, [...at, i]));
  if (value && typeof value === 'object') return Object.entries(value).flatMap(([k, v]) => numericPaths(v, [...at, k]));
  return [];
}

/**
 * Values no tank can have, whatever the field: negative amounts (every number in the format
 * is a size, a rate, a share, a day or a concentration, all ≥ 0 — common practice), not a
 * number, infinite. A pH of 15 and a temperature of 150 °C are checked by name below.
 */
const nonPhysical = fc.oneof(
  fc.double({ min: -1e9, max: -1e-6, noNaN: true }),
  fc.constant(Number.NaN),
  fc.constant(Number.POSITIVE_INFINITY),
  fc.constant(Number.NEGATIVE_INFINITY),
);

afterAll(() => console.log(`[fuzz] scenario refusal: ${caseCounter.n} cases, seed ${FUZZ_SEED}`));

describe('the engine refuses non-physical scenarios, naming the field, before computing', () => {
  it('any numeric field made negative, NaN or infinite → ScenarioError on that field', () => {
    const cases = examples.flatMap((scenario) => numericPaths(scenario).map((at) => ({ scenario, at })));
    expect(cases.length).toBeGreaterThan(20);
    fc.assert(
      fc.property(fc.constantFrom(...cases), nonPhysical, ({ scenario, at }, bad) => {
        caseCounter.n++;
        let error: unknown;
        try {
          forecast(setAt(scenario, at, bad) as never, { horizonDays: 5 });
        } catch (err) {
          error = err;
        }
        expect(error, `accepted ${bad} at ${at.join('.')}`).toBeInstanceOf(ScenarioError);
        const fields = Object.keys((error as ScenarioError).fields);
        expect(fields, `${at.join('.')} = ${bad}`).toContain(at.join('.'));
        expect((error as ScenarioError).message).toContain(at.join('.'));
        // Refused by the schema alone, before any solver step: parsing by itself throws the same refusal.
        expect(() => parseScenario(setAt(scenario, at, bad))).toThrow(ScenarioError);
      }),
      { seed: FUZZ_SEED, numRuns: 1500 },
    );
  });

  it('names pH 15, 150 °C and a zero-litre tank', () => {
    const base = examples[0]!;
    for (const [at, bad] of [
      [['tank', 'ph'], 15],
      [['tank', 'temperatureC'], 150],
      [['tank', 'volumeL'], 0],
    ] as const) {
      caseCounter.n++;
      expect(() => forecast(setAt(base, [...at], bad) as never)).toThrowError(new RegExp(`tank\\.${at[1]}`));
    }
  });
});
