import { describe, expect, it } from 'vitest';
import { forecast, forecastParsed } from '@/simulation/forecast';
import { DEFAULT_PARAMETERS } from '@/simulation/parameters';
import { parseScenario, type ScenarioEvent, type ScenarioInput } from '@/simulation/scenario';
import { buildTimeline, doseParts } from '@/simulation/timeline';
import { countTimelineEntries } from '@/simulation/work-budget';
import { expectClose } from './helpers';
import { matureWithPlaties } from './scenarios';

/**
 * How a dose enters the tank (simulation/timeline.ts `doseParts`, forecast/events.ts): at once,
 * split into n parts through the day, or as a steady flow (a dosing pump or drip). Written as
 * relations (ratios, steadiness, balance) so they hold whatever the nitrifier kinetics.
 */
type Dose = Extract<ScenarioEvent, { type: 'ammonia-dose' }>;
const dose = (value: number, extra: Partial<Dose> = {}): Dose => ({ type: 'ammonia-dose', day: 1, amount: { unit: 'mgN-per-L', value }, ...extra });

describe('the timeline of a split or continuous dose', () => {
  it('splits each dose into n equal pulses 24/n h apart, for every repeat', () => {
    const parts = doseParts(dose(2, { timesPerDay: 4, repeatEveryDays: 1, repeatCount: 3 }), 30);
    expect(parts.map((p) => p.start)).toEqual([1, 1.25, 1.5, 1.75, 2, 2.25, 2.5, 2.75, 3, 3.25, 3.5, 3.75]);
    expect(parts.every((p) => p.end === undefined)).toBe(true);
  });

  it('gives daily continuous doses as one stretch, doses further apart as one stretch per day, and drops what lies past the horizon', () => {
    expect(doseParts(dose(1, { delivery: 'continuous', repeatEveryDays: 1, repeatCount: 5 }), 30)).toEqual([{ start: 1, end: 6 }]);
    expect(doseParts(dose(1, { delivery: 'continuous', repeatEveryDays: 3, repeatCount: 3 }), 30)).toEqual([
      { start: 1, end: 2 },
      { start: 4, end: 5 },
      { start: 7, end: 8 },
    ]);
    expect(doseParts(dose(1, { delivery: 'continuous' }), 30)).toEqual([{ start: 1, end: 2 }]);
    expect(doseParts(dose(1, { timesPerDay: 4, repeatEveryDays: 1, repeatCount: 5 }), 2).map((p) => p.start)).toEqual([1, 1.25, 1.5, 1.75, 2]);
  });

  it('the work budget counts at least the entries the timeline builds', () => {
    const events = [
      dose(1, { timesPerDay: 8, repeatEveryDays: 1, repeatCount: 20 }),
      dose(1, { delivery: 'continuous', repeatEveryDays: 1 }),
      dose(1, { delivery: 'continuous', repeatEveryDays: 2, repeatCount: 4 }),
      dose(1, { timesPerDay: 3 }),
    ];
    const s = parseScenario({ ...matureWithPlaties(10), events });
    const built = buildTimeline(s, 40, DEFAULT_PARAMETERS).breakpoints.reduce((n, bp) => n + bp.actions.length, 0);
    const counted = countTimelineEntries(s, 40);
    expect(counted.entries).toBeGreaterThanOrEqual(built);
    expect(counted.entries).toBe(160 + 2 + 8 + 3);
    expect(counted.largest.path).toEqual(['events', 0, 'timesPerDay']);
  });
});

describe('a split dose in a mature tank (invented 100 L tank, 25 platies)', () => {
  const base = matureWithPlaties(25);
  const options = { horizonDays: 3, stepDays: 0.05 };
  const undosed = forecast(base, options);
  const run = (events: ScenarioEvent[]) => forecast({ ...base, events }, options);
  const day1 = undosed.series.days.indexOf(1);

  it('each part raises total ammonia by exactly 1/n of the single pulse', () => {
    for (const n of [1, 2, 4, 8]) {
      const jump = run([dose(0.5, { timesPerDay: n })]).series.tanMgN[day1] - undosed.series.tanMgN[day1];
      expectClose(jump, 0.5 / n, 1e-6, 1e-9);
    }
  });

  it("the day's peak rise falls as n grows: at least 1/n of the single pulse's (parts add up while the filter clears them), below it", () => {
    const rise = (extra: Partial<Dose>) => run([dose(0.5, extra)]).summary.peaks.tan.value - undosed.series.tanMgN[0];
    const single = rise({});
    expectClose(single, 0.5, 0.02);
    let previous = single;
    for (const n of [2, 4, 8]) {
      const split = rise({ timesPerDay: n });
      expect(split).toBeGreaterThanOrEqual(single / n - 1e-6);
      expect(split).toBeLessThan(previous);
      previous = split;
    }
    // A steady flow is the limit of ever finer parts.
    expect(rise({ delivery: 'continuous' })).toBeLessThan(previous);
  });

  it('doses the same nitrogen in all: pulses, split or continuous (the balance counts each as an input and closes)', () => {
    const deliveries: Partial<Dose>[] = [{}, { timesPerDay: 4 }, { delivery: 'continuous' }];
    for (const d of deliveries) {
      const f = forecast({ ...base, events: [dose(0.5, { repeatEveryDays: 1, repeatCount: 6, ...d })] }, { horizonDays: 10 });
      expectClose(f.summary.nitrogenBalance.dosedMg, 0.5 * 6 * 100, 1e-12);
      expect(Math.abs(f.summary.nitrogenBalance.relativeResidual)).toBeLessThan(1e-6);
    }
  });
});

describe('a continuous dose (dosing pump or drip)', () => {
  const q = 0.5;
  const scenario: ScenarioInput = matureWithPlaties(25, [dose(q, { delivery: 'continuous', repeatEveryDays: 1, repeatCount: 60 })]);
  const f = forecast(scenario, { horizonDays: 63, stepDays: 0.25 });
  const undosed = forecast(matureWithPlaties(25), { horizonDays: 63, stepDays: 0.25 });
  const at = (day: number) => f.series.tanMgN[f.series.days.indexOf(day)];

  it('settles to a steady level above the undosed tank: total ammonia on days 50 and 60 within 1 %, as the nitrifiers grow into the new load', () => {
    expectClose(at(60), at(50), 0.01);
    expect(at(60)).toBeGreaterThan(undosed.series.tanMgN[0]);
  });

  it('peaks below the same daily amount given at once, once a day', () => {
    const pulsed = forecast(matureWithPlaties(25, [dose(q, { repeatEveryDays: 1, repeatCount: 60 })]), { horizonDays: 61, stepDays: 0.25 });
    expect(f.summary.peaks.tan.value).toBeLessThan(pulsed.summary.peaks.tan.value);
  });

  it('is counted as dosed, not as the fish load, and in the recent dose while it flows', () => {
    // The load differs only by the ORG the larger biofilm's decay returns: far less than the dose's q·V a day.
    f.series.loadMgNPerDay.forEach((v, i) => expect(Math.abs(v - undosed.series.loadMgNPerDay[i])).toBeLessThan(0.01 * q * 100));
    expectClose(f.summary.nitrogenBalance.dosedMg, q * 100 * 60, 1e-12);
    expect(Math.abs(f.summary.nitrogenBalance.relativeResidual)).toBeLessThan(1e-6);
    // Flowing from day 1 to day 61 at q·V a day: the last 7 days of the 63 hold 5 days of flow.
    expectClose(f.summary.final.recentDoseMgNPerDay, (q * 100 * 5) / 7, 1e-12);
  });

  it('is a forecast the parsed scenario gives unchanged (optional fields only: older plans parse as before)', () => {
    const s = parseScenario(matureWithPlaties(5, [dose(1)]));
    expect(s.events[0]).toEqual(dose(1));
    expect(forecastParsed(s, { horizonDays: 2 }).summary.nitrogenBalance.dosedMg).toBeCloseTo(100, 9);
  });
});
