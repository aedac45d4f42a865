/**
 * Uncertainty band of a forecast (MODEL.md §5.2): an ensemble of forecasts over the ranges of
 * the engine's parameter table and over feeding, drawn by Latin hypercube sampling with a
 * seed, summarised as 10th, 50th and 90th percentiles per output day. The same seed gives the
 * same band.
 *
 * Sampled by default: every parameter of ../parameters whose range is not a single point,
 * except
 * - `lengthWeightB`: with the catalogue's `a` held fixed, b's range 2.5–3.5 is the spread
 *   between species (Froese 2006), not the uncertainty of one fish's mass — sampling it alone
 *   would swing a 3.5 cm fish's mass 3.5-fold;
 * - `feedPercent`: feeding is sampled instead as a multiplier on whatever the scenario feeds,
 *   so the two are not counted twice.
 * Ranges spanning ten times or more are sampled log-uniformly (see ./latin-hypercube).
 */
import type { Scenario } from '../scenario';
import { forecastParsed, type Forecast, type ForecastOptions } from '../forecast';
import { PARAMETERS, PARAMETER_KEYS, type ParameterKey, type ParameterOverrides } from '../parameters';
import { latinHypercube, rangeScale, scaleUnit } from './latin-hypercube';
import { seriesQuantiles } from './quantiles';
import { seededRandom } from './random';

/** Smallest ensemble the band is given for (issue 4: ≥ 64 members). */
export const MIN_BAND_MEMBERS = 64;
export const DEFAULT_SEED = 20240601;
/** Feeding multiplier range: keepers misjudge a pinch of food by about a quarter (common practice). */
export const DEFAULT_FEEDING_RANGE: readonly [number, number] = [0.75, 1.25];
export const EXCLUDED_BY_DEFAULT: readonly ParameterKey[] = ['lengthWeightB', 'feedPercent'];

export interface EnsembleSpec {
  members?: number;
  seed?: number;
  /** Values held fixed (not sampled), e.g. calibrated ones. */
  fixed?: ParameterOverrides;
  /** Parameters to sample; default: every ranged one except EXCLUDED_BY_DEFAULT and `fixed`. */
  sample?: readonly ParameterKey[];
  /** Feeding multiplier range; [1, 1] holds feeding fixed. */
  feedingRange?: readonly [number, number];
}

/** One draw: parameter values and the feeding multiplier. */
export interface EnsembleMember {
  index: number;
  parameters: ParameterOverrides;
  feedingMultiplier: number;
}

/** Parameters sampled for a spec. */
export function sampledKeys(spec: EnsembleSpec = {}): ParameterKey[] {
  const fixed = spec.fixed ?? {};
  const keys = spec.sample ?? PARAMETER_KEYS.filter((k) => !EXCLUDED_BY_DEFAULT.includes(k));
  return keys.filter((k) => !(k in fixed) && PARAMETERS[k].max > PARAMETERS[k].min);
}

/** The ensemble's draws: one Latin hypercube over the sampled parameters and feeding. */
export function sampleEnsemble(spec: EnsembleSpec = {}): EnsembleMember[] {
  const n = spec.members ?? MIN_BAND_MEMBERS;
  const keys = sampledKeys(spec);
  const [fLo, fHi] = spec.feedingRange ?? DEFAULT_FEEDING_RANGE;
  if (!(fLo > 0 && fHi >= fLo)) throw new RangeError(`feeding range must be positive and ordered, got [${fLo}, ${fHi}]`);
  const rows = latinHypercube(n, keys.length + 1, seededRandom(spec.seed ?? DEFAULT_SEED));
  return rows.map((u, index) => {
    const parameters: ParameterOverrides = { ...spec.fixed };
    keys.forEach((k, j) => {
      const { min, max } = PARAMETERS[k];
      parameters[k] = scaleUnit(u[j], min, max, rangeScale(min, max));
    });
    return { index, parameters, feedingMultiplier: scaleUnit(u[keys.length], fLo, fHi, 'linear') };
  });
}

/** The member's forecast options: its parameters, and its feeding draw on top of any multiplier given. */
export function memberOptions(member: EnsembleMember, options: ForecastOptions = {}): ForecastOptions {
  return { ...options, parameters: member.parameters, feedingMultiplier: (options.feedingMultiplier ?? 1) * member.feedingMultiplier };
}

/** The forecast of one member (the engine called directly). */
export function forecastMember(scenario: Scenario, member: EnsembleMember, options: ForecastOptions = {}): Forecast {
  return forecastParsed(scenario, memberOptions(member, options));
}

export interface Band {
  p10: number[];
  p50: number[];
  p90: number[];
}

export interface EnsembleBand {
  days: number[];
  tanMgN: Band;
  freeNh3MgL: Band;
  no2MgN: Band;
  no3MgN: Band;
  /** total capacities at the water temperature, mg N/day */
  aoMgNPerDay: Band;
  noMgNPerDay: Band;
  /** 10–50–90 % of the members' spare capacity at day 0 (null when no member has one) */
  spareTimes: { p10: number; p50: number; p90: number } | null;
}

export interface EnsembleResult {
  members: EnsembleMember[];
  forecasts: Forecast[];
  band: EnsembleBand;
  /** Members whose forecast failed (e.g. a load the zones cannot carry with those values). */
  failed: { index: number; message: string }[];
}

const QS = [0.1, 0.5, 0.9] as const;

function band(series: number[][]): Band {
  const [p10, p50, p90] = seriesQuantiles(series, QS);
  return { p10, p50, p90 };
}

function totalOf(f: Forecast, key: 'ao' | 'no'): number[] {
  const out = new Array<number>(f.series.days.length).fill(0);
  for (const z of f.series.zones) for (let i = 0; i < out.length; i++) out[i] += z[key][i];
  return out;
}

/** Runs the ensemble and its 10–50–90 % band. Forecast options apply to every member. */
export function runEnsemble(scenario: Scenario, spec: EnsembleSpec = {}, options: ForecastOptions = {}): EnsembleResult {
  const members = sampleEnsemble(spec);
  const forecasts: Forecast[] = [];
  const kept: EnsembleMember[] = [];
  const failed: { index: number; message: string }[] = [];
  for (const m of members) {
    try {
      forecasts.push(forecastMember(scenario, m, options));
      kept.push(m);
    } catch (e) {
      failed.push({ index: m.index, message: (e as Error).message });
    }
  }
  // Keeper-facing (the API answers it as the refusal's message); the first failure stays in `cause`.
  if (forecasts.length === 0) throw new RangeError('No forecast could be worked out for these values. Check for extreme numbers, or shorten the plan.', { cause: failed[0]?.message });
  return { members: kept, forecasts, failed, band: bandOf(forecasts) };
}

/**
 * An ensemble kept to members whose forecast passes `accept` (e.g. a tank described as settled
 * must test under its limits today). Rejected members are replaced by fresh Latin hypercube
 * draws with derived seeds (member index = round·100 000 + i) until `members` are kept or
 * four rounds have run; the result says how many were dropped.
 */
export function runConditionedEnsemble(
  scenario: Scenario,
  spec: EnsembleSpec,
  options: ForecastOptions,
  accept: (f: Forecast) => boolean,
): EnsembleResult & { dropped: number } {
  const target = spec.members ?? MIN_BAND_MEMBERS;
  const seed = spec.seed ?? DEFAULT_SEED;
  const members: EnsembleMember[] = [];
  const forecasts: Forecast[] = [];
  const failed: { index: number; message: string }[] = [];
  let dropped = 0;
  for (let round = 0; round < 4 && members.length < target; round++) {
    const want = round === 0 ? target : Math.max(8, 2 * (target - members.length));
    const draws = sampleEnsemble({ ...spec, members: want, seed: seed + round * 7919 });
    for (const m of draws) {
      if (members.length >= target) break;
      const member = { ...m, index: round * 100_000 + m.index };
      try {
        const f = forecastMember(scenario, member, options);
        if (accept(f)) {
          members.push(member);
          forecasts.push(f);
        } else dropped++;
      } catch (e) {
        failed.push({ index: member.index, message: (e as Error).message });
      }
    }
  }
  if (forecasts.length === 0) throw new RangeError(
      "As described, this tank's water would already be over a limit today, however its filter bacteria behave, so there is no safe start to judge a change from. Check the tank's details (tap-water ammonia, fish, filter) and today's water.",
    );
  return { members, forecasts, failed, dropped, band: bandOf(forecasts) };
}

/** The 10–50–90 % band of a set of forecasts of equal length. */
export function bandOf(forecasts: readonly Forecast[]): EnsembleBand {
  const pick = (f: (x: Forecast) => number[]) => band(forecasts.map(f));
  return {
    days: forecasts[0].series.days,
    tanMgN: pick((f) => f.series.tanMgN),
    freeNh3MgL: pick((f) => f.series.freeNh3MgL),
    no2MgN: pick((f) => f.series.no2MgN),
    no3MgN: pick((f) => f.series.no3MgN),
    aoMgNPerDay: pick((f) => totalOf(f, 'ao')),
    noMgNPerDay: pick((f) => totalOf(f, 'no')),
    spareTimes: spareQuantiles(forecasts),
  };
}

function spareQuantiles(forecasts: readonly Forecast[]): EnsembleBand['spareTimes'] {
  const values = forecasts.flatMap((f) => (f.summary.spareCapacity ? [[f.summary.spareCapacity.times]] : []));
  if (values.length === 0) return null;
  const [p10, p50, p90] = seriesQuantiles(values, QS);
  return { p10: p10[0], p50: p50[0], p90: p90[0] };
}

/** Keeper-facing words for what the band means (the draws' seed stays in the answer, not in the words). */
export function bandExplanation(membersRun: number): string {
  return (
    `The shaded band comes from ${membersRun} forecasts. Nobody knows exactly how fast your filter bacteria grow and die back, ` +
    `how they take to oxygen, ammonia and temperature, or how much food the fish really get, so each forecast takes ` +
    `different values for these from the ranges measured in published studies. In 8 of 10 cases the water should sit ` +
    `inside the band; at its upper edge only 1 in 10 forecasts goes higher. Your own test readings narrow it.`
  );
}
