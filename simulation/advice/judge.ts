/**
 * Judging a forecast against a tank's limits, and judging a plan on the band's upper edge.
 *
 * A forecast's "peak ratio" for a limit is the largest value/limit over its samples (TAN
 * limits follow the water's pH and temperature sample by sample, as the engine's own summary
 * does, unless the keeper set a value). Limits are treated as ceilings never to be touched —
 * stricter than the EPA's averaging periods (1 hour acute, 30 days chronic).
 *
 * Upper edge. Re-running a 64-member ensemble for every candidate plan would cost hundreds of
 * forecasts per candidate, so a plan is judged on a small *bounding set* of ensemble members:
 * the reference plan (e.g. all fish at once) is run for the whole ensemble, members are
 * ranked by their peak ratio, and the set is the members ranked at and just above the 90th
 * percentile. Why that bounds the band: each member's value at any time is at most its own
 * peak, so the ensemble's 90th percentile on any day is at most the 90th percentile of the
 * members' peaks — the peak of the member at that rank. Member ranks can shift between plans,
 * so the advisor checks its final answer against the whole ensemble and widens the set with
 * any member that breaks the bound.
 */
import type { Scenario } from '../scenario';
import { epaAcuteTan, epaChronicTan } from '../chemistry';
import type { Forecast, ForecastOptions } from '../forecast';
import { forecastMember, runConditionedEnsemble, type EnsembleMember, type EnsembleResult, type EnsembleSpec } from './ensemble';
import { quantileSorted } from './quantiles';
import { truncateEvents } from './scenario-edit';
import type { AppliedLimit, LimitKey } from './tank-limits';

export interface LimitVerdict {
  key: LimitKey;
  /** largest value/limit */
  peakRatio: number;
  peakValue: number;
  peakDay: number;
  /** first sampled day over the limit, or null */
  firstDayOver: number | null;
  /** sampled time over the limit, days (sample spacing × samples over) */
  daysOver: number;
}

export interface ForecastVerdict {
  safe: boolean;
  /** the worst limit (highest peak ratio) */
  binding: LimitKey;
  peakRatio: number;
  limits: LimitVerdict[];
}

/** The series a verdict needs: a forecast's, or a band edge's with the pH and temperature of a forecast. */
export interface JudgedSeries {
  days: readonly number[];
  tanMgN: readonly number[];
  freeNh3MgL: readonly number[];
  no2MgN: readonly number[];
  ph: readonly number[];
  temperatureC: readonly number[];
}

function seriesOf(s: JudgedSeries, limit: AppliedLimit): readonly number[] {
  return limit.series === 'freeNh3' ? s.freeNh3MgL : limit.series === 'tan' ? s.tanMgN : s.no2MgN;
}

/** The limit's value at sample i: TAN limits follow pH and temperature unless the keeper fixed them. */
function limitAt(limit: AppliedLimit, s: JudgedSeries, i: number): number {
  if (limit.fixedByKeeper) return limit.value;
  const factor = limit.value / limit.defaultValue;
  if (limit.key === 'tanChronic') return epaChronicTan(s.ph[i], s.temperatureC[i]) * factor;
  if (limit.key === 'tanAcute') return epaAcuteTan(s.ph[i], s.temperatureC[i]) * factor;
  return limit.value;
}

/** Peak ratios and days over each limit of one forecast. */
export function judgeForecast(f: Forecast, limits: readonly AppliedLimit[]): ForecastVerdict {
  return judgeSeries(f.series, limits);
}

/** Peak ratios and days over each limit of a set of series. */
export function judgeSeries(f: JudgedSeries, limits: readonly AppliedLimit[]): ForecastVerdict {
  const days = f.days;
  const step = days.length > 1 ? days[1] - days[0] : 0;
  const verdicts = limits.map((limit): LimitVerdict => {
    const values = seriesOf(f, limit);
    let peakRatio = -Infinity;
    let peakValue = 0;
    let peakDay = 0;
    let firstDayOver: number | null = null;
    let over = 0;
    // The limit follows pH and temperature, which change seldom with a fixed pH: recompute on change only.
    let ph = NaN;
    let temp = NaN;
    let lim = 0;
    for (let i = 0; i < values.length; i++) {
      if (f.ph[i] !== ph || f.temperatureC[i] !== temp) {
        ph = f.ph[i];
        temp = f.temperatureC[i];
        lim = limitAt(limit, f, i);
      }
      const r = values[i] / lim;
      if (r > peakRatio) {
        peakRatio = r;
        peakValue = values[i];
        peakDay = days[i];
      }
      if (r > 1) {
        over++;
        if (firstDayOver === null) firstDayOver = days[i];
      }
    }
    return { key: limit.key, peakRatio, peakValue, peakDay, firstDayOver, daysOver: over * step };
  });
  let worst = verdicts[0];
  for (const v of verdicts) if (v.peakRatio > worst.peakRatio) worst = v;
  return { safe: worst.peakRatio <= 1, binding: worst.key, peakRatio: worst.peakRatio, limits: verdicts };
}

/** A plan judged on the bounding set: safe only if every member in it stays under every limit. */
export interface EdgeVerdict extends ForecastVerdict {
  /** the member (index into the ensemble) with the highest peak ratio */
  worstMember: number;
  /** verdict of that member's forecast */
  forecast: Forecast;
}

/** How an advice answer was judged, with the bounding draws so anyone can re-run them. */
export interface Judgement {
  method: 'bounding-set';
  ensembleMembers: number;
  seed: number;
  boundingMembers: number[];
  /** the bounding set's draws, so anyone can re-run them */
  boundingDraws: { index: number; parameters: Record<string, number>; feedingMultiplier: number }[];
  forecastsRun: number;
}

/** The judgement record of an answer reached with `judge` (ensemble drawn with `seed`). */
export function judgementOf(judge: UpperEdgeJudge, seed: number): Judgement {
  return {
    method: 'bounding-set',
    ensembleMembers: judge.ensemble.forecasts.length,
    seed,
    boundingMembers: judge.bounding.map((m) => m.index),
    boundingDraws: judge.bounding.map((m) => ({ index: m.index, parameters: { ...m.parameters } as Record<string, number>, feedingMultiplier: m.feedingMultiplier })),
    forecastsRun: judge.forecastsRun,
  };
}

export interface UpperEdgeJudge {
  limits: readonly AppliedLimit[];
  options: ForecastOptions;
  /** The bounding set (grows when a final check finds a member breaking the bound). */
  bounding: EnsembleMember[];
  ensemble: EnsembleResult & { dropped: number };
  /** Number of forecasts run through the judge (cost accounting). */
  forecastsRun: number;
  judge(scenario: Scenario, horizonDays?: number): EdgeVerdict;
  /** Every bounding member's verdict (no early exit), for searches that need the earliest crossing. */
  judgeAll(scenario: Scenario): ForecastVerdict[];
}

/** Upper-edge quantile and the number of members at and above it kept in the bounding set. */
export const EDGE_QUANTILE = 0.9;
export const DEFAULT_BOUNDING_SIZE = 2;

export interface JudgeSpec {
  ensemble?: EnsembleSpec;
  boundingSize?: number;
}

/**
 * A settled tank sits well under its limits (common practice: a cycled tank tests "0" for
 * ammonia and nitrite on a hobby kit); at most this share of each limit on day 0.
 */
export const SETTLED_MAX_SHARE_OF_LIMIT = 0.5;

/**
 * A tank described as settled (mature start) is taken to test clean today: draws whose steady
 * state would already sit near or over a limit (slow or weak-affinity nitrite oxidisers that
 * would hold nitrite there forever) contradict that and are replaced. `share` is the part of
 * each limit allowed on day 0. Other starts give the day-0 water explicitly, so every draw
 * agrees on it.
 */
export function settledTankAccepts(scenario: Scenario, limits: readonly AppliedLimit[], share = SETTLED_MAX_SHARE_OF_LIMIT): (f: Forecast) => boolean {
  if (scenario.start.kind !== 'mature') return () => true;
  return (f) => {
    const first: JudgedSeries = {
      days: [0],
      tanMgN: [f.series.tanMgN[0]],
      freeNh3MgL: [f.series.freeNh3MgL[0]],
      no2MgN: [f.series.no2MgN[0]],
      ph: [f.series.ph[0]],
      temperatureC: [f.series.temperatureC[0]],
    };
    return judgeSeries(first, limits).peakRatio <= share;
  };
}

/**
 * The conditioned ensemble of a settled tank: draws reading well under the limits today, or —
 * when the tank's own water (tap ammonia, low pH or temperature) leaves no such draw — draws
 * merely under them.
 */
function settledEnsemble(reference: Scenario, limits: readonly AppliedLimit[], options: ForecastOptions, spec: JudgeSpec) {
  try {
    return runConditionedEnsemble(reference, spec.ensemble ?? {}, options, settledTankAccepts(reference, limits));
  } catch (e) {
    if (!(e instanceof RangeError)) throw e;
    return runConditionedEnsemble(reference, spec.ensemble ?? {}, options, settledTankAccepts(reference, limits, 1));
  }
}

/** Member indices ordered by the peak ratio of their forecast, ascending. */
export function rankByPeakRatio(ensemble: EnsembleResult, limits: readonly AppliedLimit[]): { member: EnsembleMember; ratio: number }[] {
  return ensemble.forecasts
    .map((f, i) => ({ member: ensemble.members[i], ratio: judgeForecast(f, limits).peakRatio }))
    .sort((a, b) => a.ratio - b.ratio);
}

/** The 90th percentile of the members' peak ratios: ≥ the band's upper edge on every day, relative to the limit. */
export function edgePeakRatio(forecasts: readonly Forecast[], limits: readonly AppliedLimit[]): number {
  const ratios = Float64Array.from(forecasts.map((f) => judgeForecast(f, limits).peakRatio)).sort();
  return quantileSorted(ratios, EDGE_QUANTILE);
}

/** Builds the judge from the ensemble of a reference plan. */
export function createJudge(reference: Scenario, limits: readonly AppliedLimit[], options: ForecastOptions, spec: JudgeSpec = {}): UpperEdgeJudge {
  const ensemble = settledEnsemble(reference, limits, options, spec);
  const ranked = rankByPeakRatio(ensemble, limits);
  const n = ranked.length;
  const size = Math.max(1, Math.min(spec.boundingSize ?? DEFAULT_BOUNDING_SIZE, n));
  // Rank of the member at the 90th percentile (rounded up, so its peak is ≥ the quantile).
  const start = Math.min(Math.ceil(EDGE_QUANTILE * (n - 1)), n - size);
  // Most pessimistic first: an unsafe candidate is usually settled by the first forecast.
  const bounding = ranked.slice(start, start + size).map((r) => r.member).reverse();
  const judgeObj: UpperEdgeJudge = {
    limits,
    options,
    bounding,
    ensemble,
    forecastsRun: ensemble.forecasts.length + ensemble.dropped,
    judge(scenario: Scenario, horizonDays?: number): EdgeVerdict {
      let worst: EdgeVerdict | null = null;
      const opts = horizonDays === undefined ? options : { ...options, horizonDays };
      const run = horizonDays === undefined ? scenario : truncateEvents(scenario, horizonDays);
      for (const m of judgeObj.bounding) {
        judgeObj.forecastsRun++;
        const f = forecastMember(run, m, opts);
        const v = judgeForecast(f, limits);
        if (!worst || v.peakRatio > worst.peakRatio) worst = { ...v, worstMember: m.index, forecast: f };
        if (!v.safe) break; // one unsafe member settles it
      }
      return worst as EdgeVerdict;
    },
    judgeAll(scenario: Scenario): ForecastVerdict[] {
      return judgeObj.bounding.map((m) => {
        judgeObj.forecastsRun++;
        return judgeForecast(forecastMember(scenario, m, options), limits);
      });
    },
  };
  return judgeObj;
}

/** Forecasts of every ensemble member for a plan (to `horizonDays`, default the judge's). */
export function ensembleForecasts(judge: UpperEdgeJudge, scenario: Scenario, horizonDays?: number): Forecast[] {
  const opts = horizonDays === undefined ? judge.options : { ...judge.options, horizonDays };
  const run = horizonDays === undefined ? scenario : truncateEvents(scenario, horizonDays);
  judge.forecastsRun += judge.ensemble.members.length;
  return judge.ensemble.members.map((m) => forecastMember(run, m, opts));
}

/**
 * Checks a plan against the whole ensemble: the 90th percentile of the members' peak ratios
 * must stay ≤ 1. When it does not, the member ranked at that percentile for this plan is
 * returned (if not yet in the bounding set) so the caller can add it and search again.
 */
export function checkAgainstEnsemble(
  judge: UpperEdgeJudge,
  scenario: Scenario,
  horizonDays?: number,
): { edgeRatio: number; forecasts: Forecast[]; breaking: EnsembleMember[] } {
  const forecasts = ensembleForecasts(judge, scenario, horizonDays);
  const ratios = forecasts.map((f, i) => ({ m: judge.ensemble.members[i], r: judgeForecast(f, judge.limits).peakRatio }));
  const edgeRatio = quantileSorted(Float64Array.from(ratios.map((x) => x.r)).sort(), EDGE_QUANTILE);
  if (edgeRatio <= 1) return { edgeRatio, forecasts, breaking: [] };
  ratios.sort((a, b) => a.r - b.r);
  const inSet = new Set(judge.bounding.map((m) => m.index));
  const breaking = ratios.slice(Math.ceil(EDGE_QUANTILE * (ratios.length - 1))).find((x) => x.r > 1 && !inSet.has(x.m.index));
  return { edgeRatio, forecasts, breaking: breaking ? [breaking.m] : [] };
}
