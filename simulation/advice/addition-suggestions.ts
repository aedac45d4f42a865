/**
 * When no schedule of the fish is safe within the keeper's limits: what stands in the way
 * (which limit, from which day, and whether the tank could ever carry them), and what would
 * make it possible — each suggestion found by the same search and checked on the whole
 * ensemble like the answer itself, so a suggestion is a schedule that works, never a guess.
 *
 * Each changes one thing: more (smaller) batches, a later finish, a
 * stricter routine water change (dilution holds ammonia and nitrite down while the
 * nitrifiers grow), and the largest number of these fish that can go in within the limits.
 */
import type { FishGroup, Scenario, ScenarioEvent } from '../scenario';
import { ScenarioError } from '../scenario-error';
import { steadyStateCapacity } from '../capacity';
import { batchEvents, SETTLE_DAYS, splitCount, searchSchedule, type Batch, type ReusedJudge, type ScheduleQuery, type ScheduleSearch } from './addition-search';
import { limitByKey } from './explain';
import type { Forecast } from '../forecast';
import { EDGE_QUANTILE, ensembleForecasts, judgeForecast } from './judge';
import { planOutcome } from './plan-outcome';
import { withEvents } from './scenario-edit';
import { dayWords, fishName, scheduleWords } from './schedule-words';
import type { AppliedLimit, LimitKey } from './tank-limits';

/** Most batches and longest search a request may ask for (additionRequestSchema). */
export const MAX_BATCHES = 20;
export const MAX_SEARCH_DAYS = 365;

/**
 * Routine water changes tried, gentlest first: every few days up to half the water every
 * other day (common practice: changes above about half the water at once stress fish).
 */
export const ROUTINE_LADDER: readonly { percent: number; everyDays: number }[] = [
  { percent: 25, everyDays: 3 },
  { percent: 30, everyDays: 2 },
  { percent: 50, everyDays: 2 },
];

/** Most searches spent on the largest safe total (the work stays bounded for any count asked). */
export const FEWER_FISH_SEARCHES = 7;
/** …then at most this many with each count's own ensemble, to tighten it. */
export const FEWER_FISH_OWN_SEARCHES = 3;

/** Share of a limit the plan reaches without the new fish above which the blocker says so. */
const HEADROOM_NOTE_SHARE = 0.8;

export type SuggestionKind = 'more-batches' | 'later-finish' | 'water-changes' | 'fewer-fish';
const SUGGESTION_ORDER: readonly SuggestionKind[] = ['more-batches', 'later-finish', 'water-changes', 'fewer-fish'];

export interface AdditionSuggestion {
  kind: SuggestionKind;
  /** One line: what to change and the schedule it gives. */
  summary: string;
  /** Fish in the schedule (fewer than asked for a "fewer-fish" suggestion). */
  count: number;
  batches: Batch[];
  finishDay: number;
  events: ScenarioEvent[];
  /** The search limits that give it (the keeper's fields). */
  maxBatches: number;
  searchDays: number;
  /** The routine water change it needs (the tank's setting), or null for the tank's own. */
  routineWaterChange: { percent: number; everyDays: number } | null;
}

export interface AdditionBlocker {
  /**
   * "capacity": even fully grown, the tank's nitrifiers cannot carry the fish (the engine's
   * steady state has none); "first-batch": the smallest batch allowed already crosses a
   * limit; "pace": batches fit one at a time but the nitrifiers cannot grow into them all
   * within the search.
   */
  kind: 'capacity' | 'first-batch' | 'pace';
  limit: LimitKey;
  /** First day the limit is crossed on the band's upper edge (by the plan that shows it), or null. */
  day: number | null;
  /** The smallest batch the search tried. */
  smallestBatch: number;
  words: string;
}

function suggestionFrom(kind: SuggestionKind, found: ScheduleSearch, fish: FishGroup, summary: string, routine: AdditionSuggestion['routineWaterChange']): AdditionSuggestion {
  const r = found.result!;
  return {
    kind,
    summary,
    count: r.batches.reduce((n, b) => n + b.count, 0),
    batches: r.batches,
    finishDay: r.finishDay,
    events: batchEvents(fish, r.batches),
    maxBatches: found.maxBatches,
    searchDays: found.searchDays,
    routineWaterChange: routine,
  };
}

/**
 * Forecasts the suggestions may run, in all: about eight searches on a 64-member ensemble (a
 * second or so on a quiet machine), so the answer stays bounded whatever the request. The searches on the same
 * tank reuse the answer's ensemble; a different routine needs its own.
 */
export const SUGGESTION_FORECASTS = 1000;

interface Budget {
  left: number;
}

/** A search that refuses its input (a load no draw can carry) counts as no schedule; its forecasts count against the budget. */
function tryTo(budget: Budget, query: ScheduleQuery, reuse?: ReusedJudge): ScheduleSearch | null {
  const before = reuse?.judge.forecastsRun ?? 0;
  let found: ScheduleSearch | null = null;
  try {
    found = searchSchedule(query, reuse);
  } catch (e) {
    if (!(e instanceof RangeError || e instanceof ScenarioError)) throw e;
  }
  budget.left -= found ? found.judge.forecastsRun - before : (reuse?.judge.forecastsRun ?? 0) - before;
  return found?.result ? found : null;
}

function routineRate(r: Scenario['tank']['routineWaterChange']): number {
  return r ? r.percent / r.everyDays : 0;
}

/** What would make the addition possible: every suggestion is a schedule the search found safe. */
export function additionSuggestions(query: ScheduleQuery, found: ScheduleSearch, startDate?: string): AdditionSuggestion[] {
  const { fish, scenario } = query;
  const c = query.constraints ?? {};
  const minBatch = c.minBatch ?? 1;
  const out: AdditionSuggestion[] = [];
  const name = fishName(fish);
  const budget: Budget = { left: SUGGESTION_FORECASTS };
  const reuse: ReusedJudge = { ctx: found.ctx, judge: found.judge, allAtOnce: found.allAtOnce };

  const possibleBatches = Math.min(MAX_BATCHES, Math.floor(fish.count / minBatch));
  if (found.maxBatches < possibleBatches) {
    const more = tryTo(budget, { ...query, constraints: { ...c, maxBatches: possibleBatches } }, reuse);
    if (more) out.push(suggestionFrom('more-batches', more, fish, `In up to ${possibleBatches} smaller batches it works: ${scheduleWords(more.result!.batches, startDate)}.`, null));
  }

  if (found.searchDays < MAX_SEARCH_DAYS && budget.left > 0) {
    const searchDays = Math.min(MAX_SEARCH_DAYS, 2 * found.searchDays);
    const later = tryTo(budget, { ...query, searchDays, constraints: { ...c, latestFinishDay: undefined } }, reuse);
    if (later) out.push(suggestionFrom('later-finish', later, fish, `Allowing ${searchDays} days instead of ${found.searchDays}, it works: ${scheduleWords(later.result!.batches, startDate)}.`, null));
  }

  // A fresh ensemble costs about what the answer's own did.
  const ensembleCost = found.judge.ensemble.forecasts.length + found.judge.ensemble.dropped;

  // The largest number of these fish with a safe schedule within the same limits (bisection:
  // fewer fish never make a plan less safe), in at most FEWER_FISH_SEARCHES searches and
  // within the budget: past that the largest safe count found so far is the answer (a safe
  // one, perhaps not the largest).
  // First on the answer's own bounding draws (cheap, and on the safe side: they were ranked for
  // the full count and only grow), then up from there with each count's own ensemble ranking.
  const fewerQuery = (count: number): ScheduleQuery => ({ ...query, fish: { ...fish, count }, constraints: { ...c, minBatch: Math.min(minBatch, count) } });
  let lo = 1;
  let hi = fish.count - 1;
  let best: ScheduleSearch | null = null;
  for (let step = 0; lo <= hi && step < FEWER_FISH_SEARCHES && budget.left > 0; step++) {
    const mid = (lo + hi) >> 1;
    const fewer = tryTo(budget, fewerQuery(mid), reuse);
    if (fewer) {
      best = fewer;
      lo = mid + 1;
    } else hi = mid - 1;
  }
  hi = fish.count - 1;
  for (let step = 0; lo <= hi && step < FEWER_FISH_OWN_SEARCHES && budget.left >= 2 * ensembleCost; step++) {
    // With nothing safe yet, the smallest count first: "up to 1" says more than nothing.
    const mid = best ? (lo + hi) >> 1 : lo;
    const fewer = tryTo(budget, fewerQuery(mid));
    if (fewer) {
      best = fewer;
      lo = mid + 1;
    } else hi = mid - 1;
  }
  if (best) {
    const n = best.result!.batches.reduce((s, b) => s + b.count, 0);
    out.push(
      suggestionFrom('fewer-fish', best, { ...fish, count: n }, `Up to ${n} ${name} can go in safely within ${found.searchDays} days: ${scheduleWords(best.result!.batches, startDate)}.`, null),
    );
  }
  // A routine changes the tank, so each try runs its own ensemble: tried while the budget
  // still covers two more of them.
  const current = routineRate(scenario.tank.routineWaterChange);
  for (const routine of ROUTINE_LADDER.filter((r) => routineRate(r) > current)) {
    if (budget.left < 2 * ensembleCost) break;
    const withRoutine: Scenario = { ...scenario, tank: { ...scenario.tank, routineWaterChange: routine } };
    const changed = tryTo(budget, { ...query, scenario: withRoutine });
    if (!changed) continue;
    out.push(
      suggestionFrom(
        'water-changes',
        changed,
        fish,
        `With a ${routine.percent} % water change every ${routine.everyDays} days (set as the tank's routine) it works: ${scheduleWords(changed.result!.batches, startDate)}.`,
        routine,
      ),
    );
    break;
  }

  // Shown in this order whatever order they were found in (the cheap searches first).
  return out.sort((x, y) => SUGGESTION_ORDER.indexOf(x.kind) - SUGGESTION_ORDER.indexOf(y.kind));
}

/**
 * The day from which more than 1 in 10 of the forecasts are over a limit (the answer's own
 * criterion: a member counts from its first crossing of any limit); null when that never happens.
 */
function overOneInTen(forecasts: readonly Forecast[], limits: readonly AppliedLimit[]): number | null {
  const firsts = forecasts
    .map((f) => judgeForecast(f, limits).limits.reduce<number | null>((m, l) => (l.firstDayOver === null ? m : m === null ? l.firstDayOver : Math.min(m, l.firstDayOver)), null))
    .filter((d): d is number => d !== null)
    .sort((a, b) => a - b);
  return firsts[Math.floor((1 - EDGE_QUANTILE) * forecasts.length)] ?? null; // 0-based: the crossing that makes it more than 1 in 10
}

/** Which limit stands in the way, from when, and why (see AdditionBlocker). */
export function additionBlocker(query: ScheduleQuery, found: ScheduleSearch, startDate?: string): AdditionBlocker {
  const { fish, scenario } = query;
  const { judge, days } = found;
  const name = fishName(fish);
  const first = days[0];
  const smallestBatch = splitCount(fish.count, found.maxBatches)[0];
  // The smallest batch alone, on the whole ensemble (the same judgement as every answer).
  const aloneForecasts = ensembleForecasts(judge, withEvents(scenario, batchEvents(fish, [{ day: first, count: smallestBatch }])), first + SETTLE_DAYS);
  const alone = planOutcome(aloneForecasts, found.ctx.limits, aloneForecasts[0]).upperEdge;
  const crossing = alone.safe ? found.allAtOnce.upperEdge : alone;
  const limit = limitByKey(found.ctx.limits, crossing.binding);
  const day = overOneInTen(alone.safe ? judge.ensemble.forecasts : aloneForecasts, found.ctx.limits);
  const when = day === null ? '' : ` from ${dayWords(Math.floor(day), startDate)}`;

  // How close the plan already comes without these fish: 9 in 10 of the whole ensemble's
  // forecasts, the same judgement as every answer, to the same horizon.
  const withoutForecasts = ensembleForecasts(judge, scenario, first + SETTLE_DAYS);
  const without = planOutcome(withoutForecasts, found.ctx.limits, withoutForecasts[0]).upperEdge;
  const nearest = limitByKey(found.ctx.limits, without.binding).label;
  const share = `${Math.round(without.peakRatio * 100)} %`;
  const headroom = !without.safe
    ? ` Even without them more than 1 in 10 forecasts cross a limit (${nearest}: 9 in 10 peak below ${share} of it), so there is no room.`
    : without.peakRatio >= HEADROOM_NOTE_SHARE
      ? ` Without them 9 in 10 forecasts already peak below ${share} of the ${nearest} limit, so there is little room.`
      : '';

  // With the central values, can the tank carry the fish at all once its nitrifiers have grown?
  let carry: string | null = null;
  try {
    steadyStateCapacity({ ...scenario, fish: [...scenario.fish, fish] });
  } catch (e) {
    if (!(e instanceof ScenarioError)) throw e;
    carry = Object.values(e.fields)[0] ?? e.message;
  }
  if (carry !== null) {
    return {
      kind: 'capacity',
      limit: limit.key,
      day,
      smallestBatch,
      words: `Even once its filter bacteria have grown, this tank cannot carry ${fish.count} more ${name}: ${carry} However slowly they go in, ${limit.label} would climb over its limit${when}.`,
    };
  }
  if (!alone.safe) {
    return {
      kind: 'first-batch',
      limit: limit.key,
      day,
      smallestBatch,
      words: `Even ${smallestBatch} ${name} at once — ${found.maxBatches === 1 ? 'everything in one batch, as you allowed' : `the smallest batch in at most ${found.maxBatches} batches`} — put more than 1 in 10 forecasts over a limit${when}; ${limit.label} is the one in the way.${headroom}`,
    };
  }
  return {
    kind: 'pace',
    limit: limit.key,
    day,
    smallestBatch,
    words: `Batches of ${smallestBatch} ${name} fit one at a time, but the filter bacteria cannot grow into all ${fish.count} by ${dayWords(days[days.length - 1], startDate)}: ${limit.label} is the limit in the way (all at once, more than 1 in 10 forecasts cross a limit${when}).${headroom}`,
  };
}
