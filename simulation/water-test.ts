/**
 * The one judgement of a water test (pure): each tested value with its level, the limit it was
 * judged against and that limit's basis. The home screen, the readings table and the alert
 * e-mails all judge through `judgeWaterTest`, so one reading never gets two verdicts.
 *
 * Two rules used to disagree; this one settles them:
 * - No clamping of pH or temperature. The home screen used to clamp the test's pH to 4–10 and
 *   its temperature to 0–40 °C (the ranges a tank's settings accept) before picking limits,
 *   while a test may record pH 0–14 and 0–45 °C. Clamping a pH of 10.5 down to 10 shrinks the
 *   free-ammonia share (Emerson et al. 1975 holds across the range) and calls toxic water
 *   safer than it is; the measured water is what the fish live in, so it is judged as measured.
 * - Total ammonia is compared with the free-ammonia limit expressed as TAN at the test's pH and
 *   temperature (the e-mails compared the computed free ammonia with the limit in mg NH3/L).
 *   Both are the same inequality; comparing in the value the kit reads gives the watch share
 *   its meaning ("half the limit" of what the keeper measured) and one comparison, so a value
 *   on the boundary cannot fall on different sides in floating point.
 */
import { freeAmmoniaMgNH3 } from './chemistry';
import { freeAmmoniaLimitAsTan, tankLimits, type LimitSettings } from './limits';

/** A value at or above this share of its limit is "watch" — Shoalshift's own margin, not a published one. */
export const WATCH_SHARE = 0.5;

export type LimitLevel = 'ok' | 'watch' | 'over';

export function levelFor(value: number, limit: number): LimitLevel {
  if (value > limit) return 'over';
  if (value >= limit * WATCH_SHARE) return 'watch';
  return 'ok';
}

/** What a test recorded; null = not tested (pH and temperature then come from the tank). */
export interface WaterTestValues {
  tanMgN: number | null;
  no2MgN: number | null;
  ph: number | null;
  temperatureC: number | null;
}

/** The tank's own water: stands in for a test's missing pH and temperature. */
export interface TankWater {
  ph: number;
  temperatureC: number;
  chlorideMgL?: number;
}

export interface JudgedTestValue {
  key: 'tanMgN' | 'no2MgN';
  valueMgN: number;
  level: LimitLevel;
  limit: { value: number; unit: 'mg N/L'; basis: string; source: string };
}

export interface WaterTestJudgement {
  /** The pH and temperature the test was judged at (the test's, else the tank's). */
  ph: number;
  temperatureC: number;
  /** Free ammonia at that pH and temperature and its limit, when total ammonia was tested. */
  freeNh3: { valueMgNH3: number; limitMgNH3: number } | null;
  /** Tested values in the order tanMgN, no2MgN; untested ones are left out. */
  judged: JudgedTestValue[];
}

/**
 * Judges a test against the tank's limits (simulation/limits.ts `tankLimits`, with the keeper's
 * limit settings when given). Nitrate has no limit there and is not judged.
 */
export function judgeWaterTest(test: WaterTestValues, tank: TankWater, settings?: LimitSettings): WaterTestJudgement {
  const ph = test.ph ?? tank.ph;
  const temperatureC = test.temperatureC ?? tank.temperatureC;
  const limits = tankLimits({ ph, temperatureC, chlorideMgL: tank.chlorideMgL }, settings);
  const freeNh3Limit = limits.find((l) => l.key === 'freeNh3')!;
  const nitriteLimit = limits.find((l) => l.key === 'nitrite')!;
  const judged: JudgedTestValue[] = [];
  let freeNh3: WaterTestJudgement['freeNh3'] = null;
  if (test.tanMgN !== null) {
    const value = freeAmmoniaLimitAsTan(freeNh3Limit.value, ph, temperatureC);
    judged.push({
      key: 'tanMgN',
      valueMgN: test.tanMgN,
      level: levelFor(test.tanMgN, value),
      limit: { value, unit: 'mg N/L', basis: `${freeNh3Limit.basis} as TAN at pH ${ph}, ${temperatureC} °C`, source: `${freeNh3Limit.source}; Emerson et al. (1975) free-ammonia fraction` },
    });
    freeNh3 = { valueMgNH3: freeAmmoniaMgNH3(test.tanMgN, temperatureC, ph), limitMgNH3: freeNh3Limit.value };
  }
  if (test.no2MgN !== null) {
    judged.push({
      key: 'no2MgN',
      valueMgN: test.no2MgN,
      level: levelFor(test.no2MgN, nitriteLimit.value),
      limit: { value: nitriteLimit.value, unit: 'mg N/L', basis: nitriteLimit.basis, source: nitriteLimit.source },
    });
  }
  return { ph, temperatureC, freeNh3, judged };
}
