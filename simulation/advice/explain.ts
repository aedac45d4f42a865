/** Keeper-facing sentences shared by the advisors (and the screens that show their answers). */
import type { PlanOutcome } from './plan-outcome';
import { formatValue, type AppliedLimit, type LimitKey } from './tank-limits';

/** The one-line meaning of "filter bacteria", the name the advice and screens use for the nitrifiers. */
export const FILTER_BACTERIA_MEANING =
  'Filter bacteria live in the filter and on every wet surface of the tank; they turn the ammonia from fish waste into nitrite, and nitrite into nitrate.';

/** The band's upper edge in words: what advice judges by. */
export const WORST_TENTH = 'the worst 1 in 10 forecasts';

/** How many of the band's forecasts cross a limit (see bandExplanation in ./ensemble). */
export function crossingShare(membersCrossing: number, members: number): string {
  return `${membersCrossing} of the ${members} forecasts in the band cross a limit`;
}

export function limitByKey(limits: readonly AppliedLimit[], key: LimitKey): AppliedLimit {
  const l = limits.find((x) => x.key === key);
  if (!l) throw new RangeError(`no limit "${key}"`);
  return l;
}

/** "nitrite (0.1 mg N/L; culture practice …; source …)" */
export function describeLimit(limit: AppliedLimit): string {
  return `${limit.label} limit ${formatValue(limit.value)} ${limit.unit} (${limit.basis}; source: ${limit.source})`;
}

/** Why a limit binds: the species and what it does to fish. */
export function whyLimitMatters(key: LimitKey): string {
  switch (key) {
    case 'freeNh3':
      return 'Free ammonia (NH3) is the form that burns gills; its share of total ammonia rises with pH and temperature, so in this water it is the first ammonia limit reached.';
    case 'tanAcute':
      return 'The short-term total-ammonia limit is the level at which even a brief spike harms sensitive fish at this pH and temperature.';
    case 'tanChronic':
      return 'The long-term total-ammonia limit protects fish exposed for weeks; advice keeps the forecast under it at every moment, which is stricter than the 30-day average it is written for.';
    case 'nitrite':
      return 'Nitrite stops blood carrying oxygen. The filter bacteria that clear nitrite grow more slowly than the ones that clear ammonia, so after an addition nitrite often peaks later and limits the pace.';
  }
}

/** One sentence on a plan's outcome judged on the ensemble (see ./plan-outcome). */
export function describeOutcome(o: PlanOutcome, limits: readonly AppliedLimit[], what: string): string {
  const v = o.upperEdge;
  const l = limitByKey(limits, v.binding);
  const lv = v.limits.find((x) => x.key === v.binding)!;
  const share = crossingShare(o.membersCrossing, o.members);
  const closest = `${l.label.charAt(0).toUpperCase()}${l.label.slice(1)} comes closest: 9 in 10 forecasts peak below ${formatValue(lv.peakValue)} ${l.unit} (limit ${formatValue(l.value)}), around day ${formatValue(lv.peakDay)}`;
  return o.upperEdge.safe
    ? `${what}: ${share} — within the 1 in 10 allowed. ${closest}.`
    : `${what}: ${share} — more than the 1 in 10 allowed. ${closest}.`;
}
