/**
 * Guided capacity test for a tank without a test history (issue 4, point 6): dose a known
 * amount of ammonia, read total ammonia at set times, and estimate the ammonia oxidisers'
 * capacity from how fast it falls.
 *
 * Protocol: the dose is what the prior model says the tank clears in about a day (so the fall
 * spans several colour steps), rounded to 0.25 mg N/L and kept within 0.5–4 mg N/L
 * (common practice for fishless tests); with fish in the tank it is capped at 80 % of the
 * lowest total-ammonia limit. Readings at 0 (after mixing), 4, 8 and 24 hours.
 * Estimator: calibration (./calibration) of the capacity factors alone on those readings,
 * with the dose as an event at hour 0.
 */
import type { Scenario } from '../scenario';
import { ammoniaSolutionForDose, ammoniumChlorideForDose, type AmmoniaSolution } from '../dosing';
import { forecastParsed, spareSentence } from '../forecast';
import { DOSING_CAUTIONS, ESTIMATE_CAUTIONS } from './cautions';
import { calibrate, type CalibrationResult } from './calibration';
import type { KitSpec } from './kit-error';
import { withEvents } from './scenario-edit';
import { formatValue, tankLimits, type LimitSettings } from './tank-limits';

export const READING_HOURS = [0, 4, 8, 24] as const;

export interface CapacityTestProtocol {
  doseMgNPerL: number;
  ammoniumChlorideG: number;
  ammoniaSolutionMl: number | null;
  readingHours: readonly number[];
  expectedTanMgN: number[];
  steps: string[];
  cautions: string[];
}

export function capacityTestProtocol(scenario: Scenario, solution?: AmmoniaSolution, limits?: LimitSettings): CapacityTestProtocol {
  const V = scenario.tank.volumeL;
  const prior = forecastParsed(scenario, { horizonDays: 0.01, stepDays: 0.01 });
  const capacity = prior.series.zones.reduce((s, z) => s + z.ao[0], 0);
  let dose = Math.min(4, Math.max(0.5, Math.round((capacity / V) * 4) / 4));
  if (scenario.fish.length > 0) {
    const ls = tankLimits({ ph: scenario.tank.ph, temperatureC: scenario.tank.temperatureC, chlorideMgL: scenario.tank.chlorideMgL }, limits);
    const tanCap = Math.min(...ls.filter((l) => l.key !== 'nitrite').map((l) => (l.key === 'freeNh3' ? freeAsTan(scenario, l.value) : l.value)));
    dose = Math.min(dose, Math.floor(0.8 * tanCap * 4) / 4 || 0.25);
  }
  const expected = forecastParsed(withEvents(scenario, [{ type: 'ammonia-dose', day: 0, amount: { unit: 'mgN-per-L', value: dose } }]), {
    horizonDays: 1,
    stepDays: 1 / 24,
  });
  const expectedTanMgN = READING_HOURS.map((h) => expected.series.tanMgN[h]);
  const grams = ammoniumChlorideForDose(dose, V);
  const ml = solution ? ammoniaSolutionForDose(dose, solution, V) : null;
  return {
    doseMgNPerL: dose,
    ammoniumChlorideG: grams,
    ammoniaSolutionMl: ml,
    readingHours: READING_HOURS,
    expectedTanMgN,
    steps: [
      `Dose ${formatValue(dose)} mg N/L: ${formatValue(grams)} g of ammonium chloride${ml !== null ? ` or ${formatValue(ml)} mL of your ${solution!.percentNH3} % ammonia solution` : ''}, dissolved in tank water and poured where the flow mixes it.`,
      'Do not feed and do not change water during the test.',
      `Test total ammonia 15 minutes after dosing (hour 0), then at hours 4, 8 and 24; enter each reading with its time.`,
    ],
    cautions: [...DOSING_CAUTIONS, ...ESTIMATE_CAUTIONS],
  };
}

function freeAsTan(scenario: Scenario, mgNH3: number): number {
  const probe = forecastParsed(withEvents(scenario, [{ type: 'ammonia-dose', day: 0, amount: { unit: 'mgN-per-L', value: 1 } }]), { horizonDays: 0.01, stepDays: 0.01 });
  const fraction = probe.series.freeNh3MgL[0] / probe.series.tanMgN[0];
  return mgNH3 / fraction;
}

/** Capacity from the test's readings (hours after the dose, total ammonia mg N/L). */
export function estimateCapacityFromTest(
  scenario: Scenario,
  doseMgNPerL: number,
  readings: { hour: number; tanMgN: number; no2MgN?: number }[],
  kit?: KitSpec,
): CalibrationResult {
  // The prior is the tank as it stands (a settled tank at its own load), held as explicit
  // capacities: feeding stops for the test, which must not shrink the prior to nothing.
  const now = forecastParsed(scenario, { horizonDays: 0.01, stepDays: 0.01 });
  const standing: Scenario = {
    ...scenario,
    start: { kind: 'explicit', capacities: now.series.zones.map((z) => ({ zoneId: z.zoneId, aoMgNPerDay: z.ao[0], noMgNPerDay: z.no[0] })) },
    initialWater: { ...scenario.initialWater, tanMgN: now.series.tanMgN[0], no2MgN: now.series.no2MgN[0] },
  };
  const dosed = withEvents(standing, [{ type: 'ammonia-dose', day: 0, amount: { unit: 'mgN-per-L', value: doseMgNPerL } }]);
  const hasNitrite = readings.some((r) => r.no2MgN !== undefined);
  const fit = calibrate({
    scenario: { ...dosed, feeding: { mode: 'grams', gramsPerDay: 0 } },
    readings: readings.map((r) => ({ day: r.hour / 24, tanMgN: r.tanMgN, no2MgN: r.no2MgN })),
    kits: kit ? { tan: kit, no2: kit } : undefined,
    fit: hasNitrite ? ['ao', 'no'] : ['ao'],
    forecastDays: 7,
  });
  // Spare capacity at the tank's own fish and feeding, from the fitted capacities.
  const settled = forecastParsed({ ...scenario, start: fit.calibratedScenario.start, initialWater: { tanMgN: 0, no2MgN: 0 }, events: [] }, { horizonDays: 0.01, stepDays: 0.01, parameters: fit.calibratedParameters });
  const spare = settled.summary.spareCapacity;
  return { ...fit, spareCapacity: spare, explanation: spare ? [...fit.explanation, spareSentence(spare)] : fit.explanation };
}
