import { describe, expect, it } from 'vitest';
import { forecast } from '@/simulation/forecast';
import { matureWithPlaties, tank } from './scenarios';

const HORIZON = 45;

describe("a tank's routine water change", () => {
  it('is exactly the same as writing each water change into the timeline (MODEL.md §7.1: water changes dilute dissolved species exactly)', () => {
    const routine = forecast({ ...matureWithPlaties(30, [], { routineWaterChange: { percent: 25, everyDays: 7 } }), horizonDays: HORIZON });
    const written = forecast({
      ...matureWithPlaties(
        30,
        [7, 14, 21, 28, 35, 42].map((day) => ({ type: 'water-change' as const, day, percent: 25 })),
      ),
      horizonDays: HORIZON,
    });
    for (const key of ['tanMgN', 'no2MgN', 'no3MgN'] as const) {
      routine.series[key].forEach((v, i) => expect(v).toBeCloseTo(written.series[key][i], 9));
    }
  });

  it('keeps nitrate lower than no water changes and still closes the nitrogen balance to 1e-6 (MODEL.md §8.4)', () => {
    const none = forecast({ ...matureWithPlaties(30), horizonDays: HORIZON });
    const weekly = forecast({ ...matureWithPlaties(30, [], { routineWaterChange: { percent: 25, everyDays: 7 } }), horizonDays: HORIZON });
    expect(weekly.series.no3MgN.at(-1)!).toBeLessThan(0.8 * none.series.no3MgN.at(-1)!);
    expect(Math.abs(weekly.summary.nitrogenBalance.relativeResidual)).toBeLessThan(1e-6);
  });

  it('runs to whatever horizon the forecast has, without counting as a timeline event past it', () => {
    const short = forecast({ tank: tank({ routineWaterChange: { percent: 30, everyDays: 10 } }), start: { kind: 'mature' }, fish: [{ species: 'platy', count: 10 }], horizonDays: 5 });
    expect(short.series.days.at(-1)).toBe(5);
  });

  it('keeps the pH of a low-KH tank from sliding as nitrification uses up alkalinity (7.14 mg CaCO3 per mg N, US EPA 1975)', () => {
    const lowKh = { khDegrees: 4, ph: 7.2 };
    const none = forecast({ ...matureWithPlaties(10, [], lowKh), horizonDays: 60 });
    const weekly = forecast({ ...matureWithPlaties(10, [], { ...lowKh, routineWaterChange: { percent: 30, everyDays: 7 } }), horizonDays: 60 });
    expect(weekly.series.ph.at(-1)!).toBeGreaterThan(none.series.ph.at(-1)! + 0.1);
  });
});
