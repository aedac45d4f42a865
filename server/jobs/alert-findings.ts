/**
 * What an alert e-mail says about a reading (pure): the one judgement of a water test
 * (simulation/water-test.ts, the home screen's too) put into words, and the comparison with the
 * active plan's forecast. No database here, so the unit tests check it beside the home screen.
 */
import { formatConcentration, formatFigure } from '../../simulation/format-number.js';
import { judgeWaterTest, type WaterTestJudgement } from '../../simulation/water-test.js';

/**
 * "Far above the forecast": the reading is more than FORECAST_FACTOR times the forecast value
 * and above it by at least FORECAST_MARGIN_SHARE of the limit, so tiny values near zero do not
 * alarm (common practice: test kits read in steps of about 0.25 mg/L at the low end).
 */
export const FORECAST_FACTOR = 2;
export const FORECAST_MARGIN_SHARE = 0.5;

export interface ReadingValues {
  tanMgN: number | null;
  no2MgN: number | null;
  ph: number;
  temperatureC: number;
}

/**
 * The one judgement of a reading (simulation/water-test.ts, the home screen's too) at its pH
 * and temperature. The tank stores no limit settings of its own, so these are the defaults.
 */
export function judgeReading(r: ReadingValues): WaterTestJudgement {
  return judgeWaterTest(r, { ph: r.ph, temperatureC: r.temperatureC });
}

/**
 * The judgement's "over" values in words. Measured values read as a kit reads them
 * (formatConcentration, as the readings table shows them); computed free ammonia and the
 * limits as plain figures.
 */
export function limitFindings(r: ReadingValues, judgement: WaterTestJudgement = judgeReading(r)): string[] {
  const out: string[] = [];
  for (const j of judgement.judged) {
    if (j.level !== 'over') continue;
    if (j.key === 'tanMgN') {
      const fa = judgement.freeNh3!;
      out.push(
        `Free ammonia ${formatFigure(fa.valueMgNH3)} mg NH3/L (from total ammonia ${formatConcentration(j.valueMgN)} mg N/L at pH ${judgement.ph}, ${judgement.temperatureC} °C) is over the limit of ${formatFigure(fa.limitMgNH3)} mg NH3/L.`,
      );
    } else {
      out.push(`Nitrite ${formatConcentration(j.valueMgN)} mg N/L is over the limit of ${formatFigure(j.limit.value)} mg N/L.`);
    }
  }
  return out;
}

/** Findings against the active plan's forecast on the reading's plan day; "far" is measured in shares of the judgement's limits. */
export function forecastFindings(judgement: WaterTestJudgement, forecastTan: number, forecastNo2: number): string[] {
  const out: string[] = [];
  for (const j of judgement.judged) {
    const expected = j.key === 'tanMgN' ? forecastTan : forecastNo2;
    if (!(j.valueMgN > FORECAST_FACTOR * expected && j.valueMgN - expected > FORECAST_MARGIN_SHARE * j.limit.value)) continue;
    const name = j.key === 'tanMgN' ? 'Total ammonia' : 'Nitrite';
    out.push(`${name} ${formatConcentration(j.valueMgN)} mg N/L is far above the forecast of ${formatConcentration(expected)} mg N/L for that day.`);
  }
  return out;
}

