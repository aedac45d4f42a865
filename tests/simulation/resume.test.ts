import { describe, expect, it } from 'vitest';
import { parseScenario, ScenarioError, type Scenario, type ScenarioInput } from '@/simulation/scenario';
import { createForecastSession, forecastParsed, type Forecast, type ForecastOptions } from '@/simulation/forecast';
import { expectClose } from './helpers';
import { matureWithPlaties, tank } from './scenarios';

/** Every reported series of `part` against the same days of `full` (solver tolerance: rtol 1e-6 → 1e-5 here). */
function expectSameFrom(part: Forecast, full: Forecast, rel = 1e-5): void {
  const offset = full.series.days.indexOf(part.series.days[0]);
  expect(offset).toBeGreaterThanOrEqual(0);
  expect(part.series.days).toEqual(full.series.days.slice(offset));
  const keys = ['tanMgN', 'no2MgN', 'no3MgN', 'orgMgN', 'freeNh3MgL', 'ph', 'loadMgNPerDay'] as const;
  for (const key of keys) part.series[key].forEach((v, i) => expectClose(v, full.series[key][offset + i], rel, 1e-9));
  part.series.zones.forEach((z, j) => {
    z.ao.forEach((v, i) => expectClose(v, full.series.zones[j].ao[offset + i], rel, 1e-9));
    z.no.forEach((v, i) => expectClose(v, full.series.zones[j].no[offset + i], rel, 1e-9));
  });
}

/** A cycling tank (invented) whose events straddle the resume day: a medication and an aeration loss run across it. */
const busy: ScenarioInput = {
  tank: tank({ khDegrees: 6 }),
  start: { kind: 'new' },
  events: [
    { type: 'ammonia-dose', day: 0, amount: { unit: 'mgN-per-L', value: 1 }, repeatEveryDays: 1 },
    { type: 'medication', day: 8, durationDays: 6, oxidationMultiplier: 0.5 },
    { type: 'aeration-loss', day: 9, durationDays: 3, oxygenShare: 0.6 },
    { type: 'temperature', day: 4, temperatureC: 27 },
    { type: 'water-change', day: 11, percent: 40 },
  ],
};

describe('resumable forecasts (createForecastSession, options.from)', () => {
  const options: ForecastOptions = { horizonDays: 30, stepDays: 0.5 };

  it('continuing from a saved state gives the full run’s series, with medication and aeration loss still active', () => {
    const s = parseScenario(busy);
    const full = forecastParsed(s, options);
    const state = createForecastSession(s, options).advanceTo(10);
    expect(state.medications.length).toBe(1);
    expect(state.aerationLosses.length).toBe(1);
    const rest = forecastParsed(s, { ...options, from: state });
    expect(rest.series.days[0]).toBe(10);
    expectSameFrom(rest, full);
  });

  it('continuing from a saved state inside a continuous dose keeps the dose flowing to its end', () => {
    const s = parseScenario(matureWithPlaties(20, [
      { type: 'ammonia-dose', day: 3, amount: { unit: 'mgN-per-L', value: 0.6 }, delivery: 'continuous', repeatEveryDays: 1, repeatCount: 10 },
    ]));
    const full = forecastParsed(s, options);
    const state = createForecastSession(s, options).advanceTo(7);
    expect(state.doseFlows).toEqual([[0, 0.6]]);
    expectSameFrom(forecastParsed(s, { ...options, from: state }), full);
  });

  it('an event added on the saved day is applied by the continued run (the state is taken before that day’s events)', () => {
    const s = parseScenario(matureWithPlaties(20));
    const added: Scenario = { ...s, events: [...s.events, { type: 'add-fish', day: 6, fish: [{ species: 'platy', count: 30 }] }] };
    const full = forecastParsed(added, { horizonDays: 25, stepDays: 0.5 });
    const state = createForecastSession(s, { horizonDays: 25, stepDays: 0.5 }).advanceTo(6);
    const rest = forecastParsed(added, { horizonDays: 25, stepDays: 0.5, from: state });
    expectSameFrom(rest, full);
    expect(rest.summary.peaks.tan.value).toBeGreaterThan(rest.series.tanMgN[0] * 1.5); // the addition shows (MODEL.md §9.2)
  });

  it('a session’s samples before the day and the continued run together make up the full series', () => {
    const s = parseScenario(busy);
    const full = forecastParsed(s, options);
    const session = createForecastSession(s, options);
    session.advanceTo(3);
    session.advanceTo(12.5);
    expect(session.samples).toBe(25); // days 0, 0.5, …, 12
    full.series.tanMgN.slice(0, 25).forEach((v, i) => expectClose(session.series.tanMgN[i], v, 1e-12));
    expectSameFrom(session.finish(), full, 1e-12);
  });

  it('keeps nitrogen balanced over the continued part', () => {
    const s = parseScenario(busy);
    const state = createForecastSession(s, options).advanceTo(10);
    const rest = forecastParsed(s, { ...options, from: state });
    expect(Math.abs(rest.summary.nitrogenBalance.relativeResidual)).toBeLessThan(1e-6);
  });

  it('refuses a state from another scenario, other parameters or another feeding multiplier', () => {
    const s = parseScenario(busy);
    const state = createForecastSession(s, options).advanceTo(10);
    const otherEvent: Scenario = { ...s, events: s.events.map((e) => (e.type === 'water-change' ? { ...e, day: 9 } : e)) };
    const refused = (sc: Scenario, o: ForecastOptions) => {
      try {
        forecastParsed(sc, { ...options, ...o, from: state });
      } catch (e) {
        return e instanceof ScenarioError && 'options.from' in e.fields;
      }
      return false;
    };
    expect(refused(otherEvent, {})).toBe(true);
    expect(refused(s, { parameters: { muMaxAo: 0.5 } })).toBe(true);
    expect(refused(s, { feedingMultiplier: 1.2 })).toBe(true);
    // An event added after the saved day is fine.
    expect(refused({ ...s, events: [...s.events, { type: 'water-change', day: 20, percent: 10 }] }, {})).toBe(false);
  });

  it('refuses to go back in time', () => {
    const session = createForecastSession(parseScenario(busy), options);
    session.advanceTo(5);
    expect(() => session.advanceTo(4)).toThrow(RangeError);
  });
});

describe('feedingMultiplier', () => {
  it('equals feeding that much more food, in grams or as a share of body mass', () => {
    const grams = parseScenario({ ...matureWithPlaties(15), feeding: { mode: 'grams', gramsPerDay: 0.4 } });
    const moreGrams = parseScenario({ ...matureWithPlaties(15), feeding: { mode: 'grams', gramsPerDay: 0.4 * 1.25 } });
    const a = forecastParsed(grams, { horizonDays: 10, feedingMultiplier: 1.25 });
    const b = forecastParsed(moreGrams, { horizonDays: 10 });
    a.series.tanMgN.forEach((v, i) => expectClose(v, b.series.tanMgN[i], 1e-12, 1e-15));
    const share = parseScenario({ ...matureWithPlaties(15), feeding: { mode: 'body-mass', percentPerDay: 2 } });
    const moreShare = parseScenario({ ...matureWithPlaties(15), feeding: { mode: 'body-mass', percentPerDay: 2 * 0.8 } });
    const c = forecastParsed(share, { horizonDays: 10, feedingMultiplier: 0.8 });
    const d = forecastParsed(moreShare, { horizonDays: 10 });
    c.series.no2MgN.forEach((v, i) => expectClose(v, d.series.no2MgN[i], 1e-12, 1e-15));
  });

  it('rejects a negative multiplier with the option named', () => {
    expect(() => forecastParsed(parseScenario(matureWithPlaties(5)), { feedingMultiplier: -1 })).toThrow(ScenarioError);
  });
});
