import { beforeAll, describe, expect, it } from 'vitest';
import type { Scenario } from '../../../simulation/scenario';
import { fastestSafeSchedule, splitCount, type AdditionAdvice } from '../../../simulation/advice/addition-schedule';
import { runConditionedEnsemble } from '../../../simulation/advice/ensemble';
import { settledTankAccepts } from '../../../simulation/advice/judge';
import { additionResponseSchema } from '../../../simulation/advice/schemas';
import { tankLimits } from '../../../simulation/advice/tank-limits';
import { DEVELOPER_WORDS, matureTank, p90, peakRatio, resimulate, type Member } from './fixtures';

const fish = { species: 'platy', count: 40 };

function plan(base: Scenario, batches: { day: number; count: number }[]): Scenario {
  return { ...base, events: [...base.events, ...batches.map((b) => ({ type: 'add-fish' as const, day: b.day, fish: [{ ...fish, count: b.count }] }))] };
}

describe('fastestSafeSchedule (40 platies into a 200 L tank holding 10; common practice: stage large additions)', () => {
  const base = matureTank();
  let advice: AdditionAdvice;
  let members: Member[];
  let horizon: number;
  beforeAll(() => {
    advice = fastestSafeSchedule({ scenario: base, fish });
    horizon = advice.staged!.band.days[advice.staged!.band.days.length - 1];
    // The ensemble's draws (parameter sets only); every forecast below is the engine's, judged by fixtures.ts.
    const limits = tankLimits({ ph: 7.4, temperatureC: 25, chlorideMgL: 25 });
    members = runConditionedEnsemble(base, { members: 64, seed: advice.judgement.seed }, { horizonDays: 1, stepDays: 0.5 }, settledTankAccepts(base, limits)).members;
  });

  it('stages the addition and returns it beside all at once', () => {
    expect(advice.status).toBe('staged');
    expect(advice.batches.length).toBeGreaterThan(1);
    expect(advice.batches.reduce((s, b) => s + b.count, 0)).toBe(40);
    expect(advice.allAtOnce.members).toBeGreaterThanOrEqual(64);
    expect(additionResponseSchema.safeParse(advice).success).toBe(true);
  });

  it('all at once crosses a limit on the upper edge when re-simulated by the engine', () => {
    const ratios = members.map((m) => peakRatio(resimulate(plan(base, [{ day: 0, count: 40 }]), m, horizon)));
    expect(p90(ratios)).toBeGreaterThan(1);
  });

  it('the schedule stays under every limit on the upper edge when re-simulated by the engine', () => {
    const ratios = members.map((m) => peakRatio(resimulate(plan(base, advice.batches), m, horizon)));
    expect(p90(ratios)).toBeLessThanOrEqual(1);
  });

  it('is tight: the last batch one day earlier crosses a limit on the bounding draws it was judged on', () => {
    const b = advice.batches;
    const earlier = b.map((x, i) => (i === b.length - 1 ? { ...x, day: x.day - 1 } : x));
    expect(earlier[earlier.length - 1].day).toBeGreaterThan(earlier[earlier.length - 2].day);
    const ratios = advice.judgement.boundingDraws.map((m) => peakRatio(resimulate(plan(base, earlier), m, earlier[earlier.length - 1].day + 28)));
    expect(Math.max(...ratios)).toBeGreaterThan(1);
    const onTime = advice.judgement.boundingDraws.map((m) => peakRatio(resimulate(plan(base, b), m, horizon)));
    expect(Math.max(...onTime)).toBeLessThanOrEqual(1);
  });

  it('explains the schedule, names the binding limit with its source, and carries cautions', () => {
    expect(advice.explanation.join(' ')).toMatch(/earliest day/);
    expect(advice.binding.source.length).toBeGreaterThan(0);
    expect(advice.cautions.join(' ')).toMatch(/water tests decide/);
  });

  it('explains itself in the keeper\'s words: filter bacteria, the worst 1 in 10 forecasts, no seed (issue 15)', () => {
    for (const line of advice.explanation) expect(line).not.toMatch(DEVELOPER_WORDS);
    const text = advice.explanation.join(' ');
    expect(text).toMatch(/the worst 1 in 10 forecasts\. Between batches the filter bacteria grow/);
    expect(text).toMatch(/of the \d+ forecasts in the band cross a limit/);
  });
});

describe('fastestSafeSchedule constraints', () => {
  it('reports no safe schedule when the smallest batch is the whole addition and it crosses', () => {
    const advice = fastestSafeSchedule({ scenario: matureTank(), fish, constraints: { minBatch: 40 } });
    expect(advice.status).toBe('no-safe-schedule');
    expect(advice.batches).toEqual([]);
  });

  it('adds a small group at once when the biofilter can take it (common practice)', () => {
    const advice = fastestSafeSchedule({ scenario: matureTank(), fish: { species: 'platy', count: 2 } });
    expect(advice.status).toBe('all-at-once-is-safe');
    expect(advice.batches).toEqual([{ day: 0, count: 2 }]);
  });
});

describe('splitCount', () => {
  it('splits whole fish as evenly as possible, larger batches first', () => {
    expect(splitCount(40, 3)).toEqual([14, 13, 13]);
    expect(splitCount(5, 5)).toEqual([1, 1, 1, 1, 1]);
  });
});

describe('fastestSafeSchedule with a single possible day', () => {
  it('judges the one allowed day (day 0) without a search horizon of 0 days (common practice: small groups go in at once)', () => {
    const advice = fastestSafeSchedule({ scenario: matureTank(), fish: { species: 'platy', count: 2 }, constraints: { allowedDays: [0] } });
    expect(advice.status).toBe('all-at-once-is-safe');
    expect(advice.batches).toEqual([{ day: 0, count: 2 }]);
  });
});
