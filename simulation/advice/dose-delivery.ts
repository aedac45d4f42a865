/**
 * How a daily supplementary dose goes in while fish stay in the tank (issue 13, item 5). A
 * day's dose poured in at once lifts total ammonia by the whole dose, and the nitrite-eating
 * nitrifiers, which grow more slowly, then lag behind each pulse: the fish meet a daily spike.
 * Split into n parts (24/n h apart) each part lifts ammonia by 1/n of the dose; a dosing pump
 * or drip (continuous) spreads it evenly over the day, the gentlest way.
 *
 * The choice: the first of once, 2, 4 or 8 times a day, or continuous, whose forecast keeps
 * under every limit while dosing (day 0 to the restock) — judged on the ensemble members at
 * and above its 90th percentile for once a day (see ./judge: a member's peak bounds its every
 * day), most pessimistic first. 2, 4 and 8 parts all land a part on the advice's 12 h samples.
 * A choice whose timeline would exceed the work budget is skipped; continuous always fits.
 * When none keeps the full dose under the limits, the dose itself is lowered (largestDoseUnder).
 */
import type { Forecast, ForecastOptions } from '../forecast';
import type { AmmoniaDoseEvent, Scenario } from '../scenario';
import { countTimelineEntries, MAX_TIMELINE_ENTRIES } from '../work-budget';
import { forecastMember, type EnsembleMember, type EnsembleResult } from './ensemble';
import { EDGE_QUANTILE, judgeSeries, type ForecastVerdict } from './judge';
import { quantileSorted } from './quantiles';
import { truncateEvents } from './scenario-edit';
import type { AppliedLimit } from './tank-limits';

export type DeliveryChoice = { method: 'once-a-day' } | { method: 'split'; timesPerDay: number } | { method: 'continuous' };

/** Gentler and gentler, in the order tried. */
export const DELIVERY_CANDIDATES: readonly DeliveryChoice[] = Object.freeze([
  { method: 'once-a-day' },
  { method: 'split', timesPerDay: 2 },
  { method: 'split', timesPerDay: 4 },
  { method: 'split', timesPerDay: 8 },
  { method: 'continuous' },
]);

/** The dose event's fields for a choice (once a day: none, as doses were written before). */
export function deliveryFields(choice: DeliveryChoice): Pick<AmmoniaDoseEvent, 'timesPerDay' | 'delivery'> {
  if (choice.method === 'split') return { timesPerDay: choice.timesPerDay };
  if (choice.method === 'continuous') return { delivery: 'continuous' };
  return {};
}

/** Parts a day's dose is given in (1 for once a day; null for a steady flow). */
export function partsPerDay(choice: DeliveryChoice): number | null {
  return choice.method === 'split' ? choice.timesPerDay : choice.method === 'once-a-day' ? 1 : null;
}

/** A forecast judged on its samples up to `untilDay` only (the dosing period). */
export function verdictUntil(f: Forecast, limits: readonly AppliedLimit[], untilDay: number): ForecastVerdict {
  const s = f.series;
  let end = s.days.length;
  while (end > 1 && s.days[end - 1] > untilDay + 1e-9) end--;
  const cut = <T>(xs: readonly T[]) => xs.slice(0, end);
  return judgeSeries({ days: cut(s.days), tanMgN: cut(s.tanMgN), freeNh3MgL: cut(s.freeNh3MgL), no2MgN: cut(s.no2MgN), ph: cut(s.ph), temperatureC: cut(s.temperatureC) }, limits);
}

/** The 90th percentile of the members' peak ratios up to `untilDay` (the band's upper edge there, relative to the limits). */
export function edgeRatioUntil(forecasts: readonly Forecast[], limits: readonly AppliedLimit[], untilDay: number): number {
  return quantileSorted(Float64Array.from(forecasts.map((f) => verdictUntil(f, limits, untilDay).peakRatio)).sort(), EDGE_QUANTILE);
}

export interface DeliverySearch {
  /** the ensemble of the plan dosed once a day (whole horizon) */
  onceADay: EnsembleResult;
  /** the plan with the dose given as `choice` */
  scenarioFor(choice: DeliveryChoice): Scenario;
  limits: readonly AppliedLimit[];
  options: ForecastOptions;
  /** the last dosing day's end (the restock day) */
  untilDay: number;
  /** the whole forecast's horizon, for the work budget */
  horizonDays: number;
  /** members judged per candidate (default 2) */
  boundingSize?: number;
  /** candidates before this index were already found wanting */
  from?: number;
}

export interface DeliveryPick {
  /** index into DELIVERY_CANDIDATES */
  index: number;
  choice: DeliveryChoice;
  /** whether the bounding members stay under every limit while dosing (false: even continuous does not) */
  underLimits: boolean;
  /** forecasts run */
  forecasts: number;
}

/** Whether a candidate's timeline fits the engine's work budget. */
export function fitsBudget(scenario: Scenario, horizonDays: number): boolean {
  return countTimelineEntries(scenario, horizonDays).entries <= MAX_TIMELINE_ENTRIES;
}

/** The members at and above the 90th percentile of the once-a-day plan's peak ratios while dosing, most pessimistic first. */
export function boundingMembers(onceADay: EnsembleResult, limits: readonly AppliedLimit[], untilDay: number, size = 2): EnsembleMember[] {
  const ratios = onceADay.forecasts.map((f, i) => ({ member: onceADay.members[i], ratio: verdictUntil(f, limits, untilDay).peakRatio })).sort((a, b) => a.ratio - b.ratio);
  const n = ratios.length;
  const k = Math.max(1, Math.min(size, n));
  const start = Math.min(Math.ceil(EDGE_QUANTILE * (n - 1)), n - k);
  return ratios.slice(start, start + k).map((r) => r.member).reverse();
}

/** Whether every bounding member stays under every limit while dosing; counts the forecasts it runs. */
export function boundedUnder(scenario: Scenario, bounding: readonly EnsembleMember[], search: Pick<DeliverySearch, 'limits' | 'options' | 'untilDay'>, count: { forecasts: number }): boolean {
  const run = truncateEvents(scenario, search.untilDay);
  const options = { ...search.options, horizonDays: search.untilDay };
  for (const m of bounding) {
    count.forecasts++;
    if (verdictUntil(forecastMember(run, m, options), search.limits, search.untilDay).peakRatio > 1) return false;
  }
  return true;
}

/** The first candidate (from `from`) whose bounding members stay under every limit while dosing; else the last that fits. */
export function chooseDelivery(search: DeliverySearch): DeliveryPick {
  const { onceADay, limits, untilDay } = search;
  const first = search.from ?? 0;
  if (first === 0 && edgeRatioUntil(onceADay.forecasts, limits, untilDay) <= 1) return { index: 0, choice: DELIVERY_CANDIDATES[0], underLimits: true, forecasts: 0 };
  const bounding = boundingMembers(onceADay, limits, untilDay, search.boundingSize);
  const count = { forecasts: 0 };
  let last: DeliveryPick | null = null;
  for (let i = Math.max(1, first); i < DELIVERY_CANDIDATES.length; i++) {
    const choice = DELIVERY_CANDIDATES[i];
    const scenario = search.scenarioFor(choice);
    if (!fitsBudget(scenario, search.horizonDays)) continue;
    const under = boundedUnder(scenario, bounding, search, count);
    last = { index: i, choice, underLimits: under, forecasts: count.forecasts };
    if (under) return last;
  }
  // Continuous always fits the budget (two entries), so `last` is set.
  return { ...(last as DeliveryPick), forecasts: count.forecasts };
}

/**
 * The largest daily dose, up to `dose`, whose bounding members stay under every limit while
 * dosing (bisection to 1 %, or 0.005 mg N/L); 0 when the plan crosses even without a dose. For
 * when no delivery keeps the full dose under the limits with fish in the tank: a smaller
 * biofilter at the restock is the lesser harm.
 */
export function largestDoseUnder(
  dose: number,
  scenarioWith: (dose: number) => Scenario,
  bounding: readonly EnsembleMember[],
  search: Pick<DeliverySearch, 'limits' | 'options' | 'untilDay'>,
  count: { forecasts: number },
): number {
  if (!boundedUnder(scenarioWith(0), bounding, search, count)) return 0;
  let lo = 0;
  let hi = dose;
  while (hi - lo > Math.max(0.01 * hi, 0.005)) {
    const mid = 0.5 * (lo + hi);
    if (boundedUnder(scenarioWith(mid), bounding, search, count)) lo = mid;
    else hi = mid;
  }
  return lo;
}
