import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { forecast } from '@/simulation/forecast';
import { createOdexIntegrator, type SegmentIntegrator, type SegmentRequest } from '@/simulation/solver';
import { createMathjsIntegrator } from './reference-solver';
import { matureWithPlaties, startUp } from './scenarios';

const tolerances = (n: number, relative = 1e-8) => ({ relative, absolute: new Array<number>(n).fill(1e-12) });

/** y' = −y from y(0) = 1 over [0, 5], sampled daily: the known answer is e^(−t). */
function decay(integrator: SegmentIntegrator, overrides: Partial<SegmentRequest> = {}) {
  const times = [0, 1, 2, 3, 4, 5];
  const samples: number[] = [];
  const y = [1];
  const result = integrator.integrate({
    f: (_t, s) => [-s[0]],
    from: 0,
    to: 5,
    y,
    times,
    first: 0,
    end: times.length,
    sink: (k, s) => (samples[k] = s[0]),
    ...overrides,
  });
  return { result, samples, y };
}

describe('the segment integrator', () => {
  for (const sampling of ['restart', 'dense'] as const) {
    it(`solves y' = −y to its known answer e^(−t) at every sample (${sampling} sampling)`, () => {
      const { result, samples, y } = decay(createOdexIntegrator(1, { tolerances: tolerances(1), sampling }));
      expect(result.outcome).toEqual({ ok: true });
      samples.forEach((v, t) => expect(Math.abs(v - Math.exp(-t)) / Math.exp(-t)).toBeLessThan(1e-7));
      expect(y[0]).toBeCloseTo(Math.exp(-5), 9);
      expect(result.stats.evaluations).toBeGreaterThan(0);
      expect(result.stats.accepted + result.stats.rejected).toBe(result.stats.steps);
    });
  }

  it('agrees with the mathjs reference on the same problem', () => {
    const odex = decay(createOdexIntegrator(1, { tolerances: tolerances(1) }));
    const mathjs = decay(createMathjsIntegrator(1, tolerances(1, 1e-9)));
    expect(mathjs.result.outcome.ok).toBe(true);
    odex.samples.forEach((v, k) => expect(Math.abs(v - mathjs.samples[k]) / v).toBeLessThan(1e-6));
  });

  it('returns the step limit as an outcome with the work done, instead of throwing', () => {
    const { result } = decay(createOdexIntegrator(1, { tolerances: tolerances(1), maxSteps: 2 }));
    expect(result.outcome.ok).toBe(false);
    if (result.outcome.ok) return;
    expect(result.outcome.reason).toBe('max-steps');
    expect(result.outcome.message).toMatch(/step limit \(2 steps\)/);
    expect(result.stats.steps).toBeGreaterThan(0);
  });

  it('returns a state that stops being finite as an outcome', () => {
    // y' = y² from y(0) = 1 blows up at t = 1.
    const { result } = decay(createOdexIntegrator(1, { tolerances: tolerances(1) }), { f: (_t, s) => [s[0] * s[0]] });
    expect(result.outcome.ok).toBe(false);
  });

  it('checks its options up front, naming the one that is wrong', () => {
    expect(() => createOdexIntegrator(0, { tolerances: tolerances(0) })).toThrow(RangeError);
    expect(() => createOdexIntegrator(1, { tolerances: { relative: 0, absolute: [1e-9] } })).toThrow(/tolerances\.relative/);
    expect(() => createOdexIntegrator(2, { tolerances: { relative: 1e-6, absolute: [1e-9] } })).toThrow(/tolerances\.absolute needs one value/);
    expect(() => createOdexIntegrator(1, { tolerances: { relative: 1e-6, absolute: [-1] } })).toThrow(/tolerances\.absolute\[0\]/);
    expect(() => createOdexIntegrator(1, { tolerances: tolerances(1), maxSteps: 0 })).toThrow(/maxSteps/);
    expect(() => createOdexIntegrator(1, { tolerances: tolerances(1), sampling: 'euler' as 'dense' })).toThrow(/sampling/);
  });

  it('refuses a segment request it cannot integrate (backwards, wrong state size, samples off the grid)', () => {
    const integrator = createOdexIntegrator(1, { tolerances: tolerances(1) });
    expect(() => decay(integrator, { from: 5, to: 0 })).toThrow(/runs forward/);
    expect(() => decay(integrator, { y: [1, 2] })).toThrow(/2 components/);
    expect(() => decay(integrator, { end: 9 })).toThrow(/do not lie on the grid/);
  });
});

describe('pinned work of the forecast (a regression guard: a change here means the numerics changed)', () => {
  // Figures measured on this engine; a refactor must keep them, a model or solver change updates them knowingly.
  const example = JSON.parse(readFileSync(join(__dirname, '../../simulation/examples/half-rehoming-with-dosing.json'), 'utf8'));
  const cases = [
    { name: 'a new tank starting up, 40 days', run: () => forecast(startUp(), { horizonDays: 40 }), stats: { steps: 141, accepted: 135, rejected: 4, evaluations: 3202, segments: 40 } },
    {
      name: 'a mature tank with a water change, a dose, a medication and a filter rinse, 30 days',
      run: () =>
        forecast(
          matureWithPlaties(20, [
            { type: 'water-change', day: 3, percent: 30 },
            { type: 'ammonia-dose', day: 5, amount: { unit: 'mgN-per-L', value: 1 } },
            { type: 'medication', day: 8, durationDays: 4, oxidationMultiplier: 0.5 },
            { type: 'filter-clean', day: 10, zoneId: 'filter', action: 'rinse', shareLost: 0.3 },
          ]),
          { horizonDays: 30 },
        ),
      stats: { steps: 81, accepted: 78, rejected: 3, evaluations: 1142, segments: 6 },
    },
    {
      name: 'dense-output sampling, 20 days',
      run: () => forecast(matureWithPlaties(25, [{ type: 'water-change', day: 2.5, percent: 30 }]), { horizonDays: 20, sampling: 'dense' }),
      stats: { steps: 44, accepted: 42, rejected: 2, evaluations: 614, segments: 2 },
    },
    { name: 'the half-rehoming-with-dosing example', run: () => forecast(example), stats: { steps: 267, accepted: 257, rejected: 7, evaluations: 6200, segments: 38 } },
  ];
  for (const c of cases) {
    it(c.name, () => {
      expect(c.run().stats).toEqual(c.stats);
    });
  }
});
