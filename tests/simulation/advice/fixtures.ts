/**
 * Invented tanks for the advice tests, and an independent re-simulation of a plan on the
 * ensemble: each member forecast by the engine directly, with its own peak-ratio arithmetic
 * (not the advisor's judge).
 */
import { parseScenario, type Scenario } from '../../../simulation/scenario';
import { SPECIES_IDS } from '../../../simulation/catalogue';
import { epaAcuteTan, epaChronicTan } from '../../../simulation/chemistry';
import { forecastParsed, type Forecast } from '../../../simulation/forecast';
import { DEFAULT_PARAMETERS, type ParameterOverrides } from '../../../simulation/parameters';

/** A 200 L community tank with a sponge filter and gravel, 25 °C, pH 7.4, 25 mg/L chloride (invented). */
export const tank = {
  volumeL: 200,
  temperatureC: 25,
  ph: 7.4,
  chlorideMgL: 25,
  tapWater: { tanMgN: 0.1, no3MgN: 2 },
  zones: [
    { id: 'filter', kind: 'filter' as const, media: { type: 'sponge-coarse' as const, volumeL: 1.5 } },
    { id: 'gravel', kind: 'substrate' as const, media: { type: 'gravel' as const, volumeL: 20 } },
  ],
};

export function matureTank(extra: Record<string, unknown> = {}): Scenario {
  return parseScenario({ tank, start: { kind: 'mature' }, fish: [{ species: 'platy', count: 10 }], ...extra });
}

export interface Member {
  index: number;
  parameters: ParameterOverrides;
  feedingMultiplier: number;
}

/** The member's scenario: feeding multiplied, written out here rather than borrowed from the advisor. */
export function memberScenario(s: Scenario, m: Member): Scenario {
  const scale = (f: Scenario['feeding']): Scenario['feeding'] =>
    f.mode === 'grams'
      ? { ...f, gramsPerDay: f.gramsPerDay * m.feedingMultiplier }
      : { ...f, percentPerDay: (f.percentPerDay ?? DEFAULT_PARAMETERS.feedPercent) * m.feedingMultiplier };
  return { ...s, feeding: scale(s.feeding), events: s.events.map((e) => (e.type === 'feeding' ? { ...e, feeding: scale(e.feeding) } : e)) };
}

/** Limits of the fixture tank, computed here from the published formulas (US EPA 2013; CCME 0.019 mg NH3/L; Tomasso et al. 1979 16:1). */
export const FREE_NH3_LIMIT = 0.019;
export const NITRITE_LIMIT = ((25 / 35.453) / 16) * 14.007;

/** Largest value/limit of a forecast over free NH3, TAN (EPA chronic and acute at each sample's pH, T) and nitrite. */
export function peakRatio(f: Forecast): number {
  let worst = 0;
  const s = f.series;
  for (let i = 0; i < s.days.length; i++) {
    const tanLimit = Math.min(epaChronicTan(s.ph[i], s.temperatureC[i]), epaAcuteTan(s.ph[i], s.temperatureC[i]));
    worst = Math.max(worst, s.freeNh3MgL[i] / FREE_NH3_LIMIT, s.tanMgN[i] / tanLimit, s.no2MgN[i] / NITRITE_LIMIT);
  }
  return worst;
}

export function resimulate(s: Scenario, m: Member, horizonDays: number): Forecast {
  return forecastParsed(memberScenario(s, m), { horizonDays, stepDays: 0.5, tolerances: { relative: 1e-4 }, parameters: m.parameters });
}

/** 90th percentile, linear between order statistics (Hyndman & Fan 1996, definition 7), written out independently. */
export function p90(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const h = (sorted.length - 1) * 0.9;
  const lo = Math.floor(h);
  return sorted[lo] + (h - lo) * ((sorted[Math.min(lo + 1, sorted.length - 1)] ?? 0) - sorted[lo]);
}

/**
 * Words that must not reach a keeper in an advisor's sentences: the model's own names (issue 15),
 * a random seed, a request path, a catalogue id with its hyphen.
 */
export const DEVELOPER_WORDS = new RegExp(
  [
    'nitrifier', 'plausible', 'pessimistic', 'colour steps', 'capacity', '\\bzones?\\b', 'ensemble', '\\bseed\\b', 'solver',
    '\\b[a-z]+\\.\\d+\\.[a-zA-Z]+', // a request path such as events.0.fish.lengthCm
    ...SPECIES_IDS.filter((id) => id.includes('-')).map((id) => `\\b${id}\\b`),
  ].join('|'),
  'i',
);
