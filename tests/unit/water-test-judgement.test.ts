/**
 * One judgement of a water test (simulation/water-test.ts): the home screen's levels
 * (shared/tank-status.ts judgeLatest) and the alert e-mail's findings (server/jobs/alerts.ts)
 * come from it, so the same reading never gets two verdicts — including at and beyond the
 * ranges the home screen used to clamp pH (4–10) and temperature (0–40 °C) to.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { judgeLatest } from '@/shared/tank-status';
import { judgeReading, limitFindings } from '@/server/jobs/alert-findings';
import { freeAmmoniaMgNH3 } from '@/simulation/chemistry';
import { judgeWaterTest, levelFor } from '@/simulation/water-test';
import { tankLimits } from '@/simulation/limits';
import { READING_LIMITS } from '@/shared/schemas/reading';

// pH and temperature across everything a test may record, with the old clamp edges and the
// recordable bounds drawn often.
const ph = fc.oneof(fc.double({ min: READING_LIMITS.phMin, max: READING_LIMITS.phMax, noNaN: true }), fc.constantFrom(0, 3.99, 4, 4.01, 9.99, 10, 10.01, 14));
const temperatureC = fc.oneof(
  fc.double({ min: READING_LIMITS.temperatureMinC, max: READING_LIMITS.temperatureMaxC, noNaN: true }),
  fc.constantFrom(0, 0.01, 39.99, 40, 40.01, 45),
);
const nitrogen = fc.option(fc.oneof(fc.double({ min: 0, max: 20, noNaN: true }), fc.constantFrom(0, 0.05, 0.1, 0.1000001)), { nil: null });
const reading = fc.record({ tanMgN: nitrogen, no2MgN: nitrogen, ph, temperatureC });

describe('the water-test judgement', () => {
  it('gives the home screen and the alert e-mail the same level for every reading', () => {
    fc.assert(
      fc.property(reading, (r) => {
        const screen = judgeLatest(r, { ph: 7, temperatureC: 25 });
        const mail = limitFindings(r);
        const overOnScreen = screen.filter((j) => j.level === 'over').map((j) => j.key);
        const overInMail = mail.map((f) => (f.startsWith('Free ammonia') ? 'tanMgN' : 'no2MgN'));
        expect(overInMail).toEqual(overOnScreen);
        expect(judgeReading(r).judged).toEqual(screen);
      }),
      { numRuns: 2000 },
    );
  });

  it('is over on total ammonia exactly when the free ammonia is over its limit in mg NH3/L', () => {
    fc.assert(
      fc.property(reading, (r) => {
        const j = judgeWaterTest(r, { ph: 7, temperatureC: 25 });
        if (r.tanMgN === null) {
          expect(j.freeNh3).toBeNull();
          return;
        }
        const tan = j.judged.find((v) => v.key === 'tanMgN')!;
        const free = freeAmmoniaMgNH3(r.tanMgN, r.temperatureC, r.ph);
        expect(j.freeNh3!.valueMgNH3).toBe(free);
        // The same inequality in two units; only a rounding hair from the boundary may differ.
        if (Math.abs(free / j.freeNh3!.limitMgNH3 - 1) > 1e-9) expect(tan.level === 'over').toBe(free > j.freeNh3!.limitMgNH3);
      }),
      { numRuns: 2000 },
    );
  });

  it('judges at the measured pH and temperature, never clamped (pH 10.5 is harsher than pH 10)', () => {
    const at = (p: number, t: number) => judgeWaterTest({ tanMgN: 0.05, no2MgN: null, ph: p, temperatureC: t }, { ph: 7, temperatureC: 25 }).judged[0];
    expect(at(10.5, 25).limit.value).toBeLessThan(at(10, 25).limit.value);
    expect(at(10.5, 25).limit.basis).toContain('pH 10.5, 25 °C');
    expect(at(8, 44).limit.value).toBeLessThan(at(8, 40).limit.value);
    expect(at(3.5, 25).limit.value).toBeGreaterThan(at(4, 25).limit.value);
  });

  it("takes the tank's pH and temperature for a test without them, and the keeper's limit settings when given", () => {
    const j = judgeWaterTest({ tanMgN: null, no2MgN: 0.06, ph: null, temperatureC: null }, { ph: 8, temperatureC: 28 });
    expect([j.ph, j.temperatureC]).toEqual([8, 28]);
    expect(j.judged[0]).toMatchObject({ key: 'no2MgN', level: 'watch', limit: { value: 0.1 } });
    const strict = judgeWaterTest({ tanMgN: null, no2MgN: 0.06, ph: 8, temperatureC: 28 }, { ph: 8, temperatureC: 28 }, { overrides: { nitrite: 0.05 } });
    expect(strict.judged[0]).toMatchObject({ level: 'over', limit: { value: 0.05 } });
    expect(strict.judged[0].limit.basis).toMatch(/set for this tank/);
    const halved = judgeWaterTest({ tanMgN: 0.2, no2MgN: null, ph: 8, temperatureC: 28 }, { ph: 8, temperatureC: 28 }, { sensitivityFactor: 0.5 });
    const full = tankLimits({ ph: 8, temperatureC: 28 }).find((l) => l.key === 'freeNh3')!.value;
    expect(halved.freeNh3!.limitMgNH3).toBeCloseTo(full / 2, 15);
    expect(halved.judged[0].level).toBe(levelFor(0.2, halved.judged[0].limit.value));
  });

  it('words the findings from the judgement: measured values as a kit reads them, the rest as plain figures', () => {
    expect(limitFindings({ tanMgN: 1, no2MgN: 0.5, ph: 8.2, temperatureC: 28 })).toEqual([
      'Free ammonia 0.12 mg NH3/L (from total ammonia 1 mg N/L at pH 8.2, 28 °C) is over the limit of 0.019 mg NH3/L.',
      'Nitrite 0.5 mg N/L is over the limit of 0.1 mg N/L.',
    ]);
  });
});
