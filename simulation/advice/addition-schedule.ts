/**
 * "How fast can these fish go in" (issue 4, point 2; issue 14, point 3): the fastest safe
 * schedule (./addition-search), never starting before the earliest day the keeper allows
 * (the plan's own day for the fish), told in one line with its calendar date; or, when no
 * schedule within the limits is safe, the limit in the way and what would make it possible
 * (./addition-suggestions).
 */
import type { FishGroup } from '../scenario';
import { addDays } from '../calendar';
import { bandExplanation } from './ensemble';
import { describeLimit, describeOutcome, limitByKey, whyLimitMatters } from './explain';
import { judgementOf, type Judgement } from './judge';
import type { PlanOutcome } from './plan-outcome';
import { ESTIMATE_CAUTIONS, WATER_CHANGE_CAUTIONS } from './cautions';
import { batchEvents, searchSchedule, type AdditionConstraints, type Batch, type ScheduleQuery } from './addition-search';
import { additionBlocker, additionSuggestions, type AdditionBlocker, type AdditionSuggestion } from './addition-suggestions';
import { dayWords, fishName, scheduleSummary } from './schedule-words';
import type { AppliedLimit } from './tank-limits';
import type { ScenarioEvent } from '../scenario';

export { splitCount, SETTLE_DAYS, type AdditionConstraints, type Batch } from './addition-search';
export type { AdditionBlocker, AdditionSuggestion } from './addition-suggestions';

export interface AdditionRequest extends ScheduleQuery {
  /** The plan's start date (YYYY-MM-DD): days are then also told as dates. */
  startDate?: string;
}

export interface AdditionAdvice {
  status: 'all-at-once-is-safe' | 'staged' | 'no-safe-schedule';
  /** The one-line answer. */
  summary: string;
  batches: Batch[];
  finishDay: number | null;
  /** The finish as YYYY-MM-DD when the request gave a start date. */
  finishDate: string | null;
  events: ScenarioEvent[];
  /** The limits the search ran under (the keeper's fields). */
  earliestDay: number;
  searchDays: number;
  maxBatches: number;
  staged: PlanOutcome | null;
  allAtOnce: PlanOutcome;
  binding: AppliedLimit;
  limits: AppliedLimit[];
  /** What stands in the way when no schedule is safe, else null. */
  blocker: AdditionBlocker | null;
  /** What would make it possible (empty unless no schedule is safe). */
  suggestions: AdditionSuggestion[];
  judgement: Judgement;
  explanation: string[];
  cautions: string[];
}

/** The fastest schedule whose forecast stays under the limits on the band's upper edge. */
export function fastestSafeSchedule(request: AdditionRequest): AdditionAdvice {
  const { fish, startDate } = request;
  const found = searchSchedule(request);
  const { ctx, judge, result, staged, allAtOnce, days } = found;
  const batches = result?.batches ?? [];
  const status: AdditionAdvice['status'] = !result ? 'no-safe-schedule' : batches.length === 1 ? 'all-at-once-is-safe' : 'staged';
  const blocker = result ? null : additionBlocker(request, found, startDate);
  const suggestions = result ? [] : additionSuggestions(request, found, startDate);
  const binding = limitByKey(ctx.limits, blocker?.limit ?? result?.paceLimit ?? allAtOnce.upperEdge.binding);
  const summary = result
    ? scheduleSummary(fish, batches, startDate)
    : `No safe schedule for ${fish.count} ${fishName(fish)} from ${dayWords(days[0], startDate)} within ${found.searchDays} days.`;
  const explanation = explainAddition(status, fish, allAtOnce, staged, binding, ctx.limits, blocker, suggestions, request.constraints ?? {});
  explanation.push(bandExplanation(judge.ensemble.forecasts.length));
  const cautions = [...ESTIMATE_CAUTIONS, 'Test total ammonia and nitrite on each batch day before adding fish, and two and four days after each batch.'];
  if (suggestions.some((s) => s.kind === 'water-changes')) cautions.push(...WATER_CHANGE_CAUTIONS);
  return {
    status,
    summary,
    batches,
    finishDay: result?.finishDay ?? null,
    finishDate: result && startDate ? addDays(startDate, result.finishDay) || null : null,
    events: result ? batchEvents(fish, batches) : [],
    earliestDay: days[0],
    searchDays: found.searchDays,
    maxBatches: found.maxBatches,
    staged,
    allAtOnce,
    binding,
    limits: ctx.limits,
    blocker,
    suggestions,
    judgement: judgementOf(judge, ctx.seed),
    explanation,
    cautions,
  };
}

function explainAddition(
  status: AdditionAdvice['status'],
  fish: FishGroup,
  allAtOnce: PlanOutcome,
  staged: PlanOutcome | null,
  binding: AppliedLimit,
  limits: AppliedLimit[],
  blocker: AdditionBlocker | null,
  suggestions: readonly AdditionSuggestion[],
  c: AdditionConstraints,
): string[] {
  const name = fishName(fish);
  const out: string[] = [];
  out.push(describeOutcome(allAtOnce, limits, `All ${fish.count} ${name} at once`));
  if (status === 'all-at-once-is-safe') {
    out.push('Your biofilter can take the whole addition at once: even the upper edge of the band stays under every limit.');
  } else if (status === 'staged' && staged) {
    out.push(describeOutcome(staged, limits, 'With this schedule'));
    out.push(
      `Why this schedule: each batch goes in on the earliest day at which the forecast — judged on the band's upper edge, ` +
        `not its middle — stays under every limit; a day earlier for any batch would cross the ${binding.label} limit on ` +
        `the worst 1 in 10 forecasts. Between batches the filter bacteria grow into the new load.`,
    );
    out.push(`The limit that sets the pace is the ${describeLimit(binding)}. ${whyLimitMatters(binding.key)}`);
  } else if (blocker) {
    out.push(blocker.words);
    if (c.latestFinishDay !== undefined) out.push(`You asked for the last batch by day ${c.latestFinishDay}.`);
    out.push(
      suggestions.length > 0
        ? 'Each suggestion below was searched and checked the same way as a schedule, on the same forecasts in the band.'
        : 'Nothing tried here (smaller batches, a later finish, more frequent water changes, fewer fish) keeps the forecast under the limits. If your own tests read well under the limits, fit the model to them ("Fit to my tests") and ask again: the forecast is only as good as what it knows of this tank. Otherwise add no fish for now.',
    );
    out.push(`The limit in the way is the ${describeLimit(binding)}. ${whyLimitMatters(binding.key)}`);
  }
  return out;
}
