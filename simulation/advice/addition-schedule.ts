/**
 * Fastest safe schedule for adding fish (issue 4, point 2).
 *
 * Search. For a fixed number of batches B (counts as equal as whole fish allow, larger ones
 * first), batch 1 goes in on the first possible day and each later batch on the earliest
 * possible day at which the plan so far stays under every limit on the upper edge — found by
 * exponential search then bisection over the possible days, so the day before the chosen one
 * is known to be unsafe (the schedule is tight, not just safe). B runs from 1 (all at once)
 * up to the largest count the smallest batch allows; the plan finishing first wins, fewer
 * batches on a tie. A branch that cannot beat the best finish found so far is cut.
 * Candidates are simulated only to `SETTLE_DAYS` after their last batch (the peak of an
 * addition passes within about two weeks, model.md §6.3); the winner is then checked on the
 * full horizon and against the whole ensemble, and if a member outside the bounding set
 * breaks the 90th-percentile bound it joins the set and the search runs again.
 *
 * The engine has no resumable state, so each candidate is forecast from day 0.
 */
import type { FishGroup, Scenario, ScenarioEvent } from '../../shared/schemas/scenario';
import { forecastParsed } from '../forecast';
import { adviceContext, type AdviceSettings } from './advice-context';
import { bandExplanation } from './ensemble';
import { describeLimit, describeOutcome, limitByKey, whyLimitMatters } from './explain';
import { checkAgainstEnsemble, createJudge, ensembleForecasts, type UpperEdgeJudge } from './judge';
import { planOutcome, type PlanOutcome } from './plan-outcome';
import { truncateEvents, withEvents } from './scenario-edit';
import { ESTIMATE_CAUTIONS } from './cautions';
import type { AppliedLimit, LimitKey } from './tank-limits';

/** Days simulated after a candidate's last batch while searching. */
export const SETTLE_DAYS = 28;
/** Search rounds in which the bounding set may grow. */
const MAX_ROUNDS = 3;

export interface AdditionConstraints {
  /** Smallest batch worth a trip (fish); default 1. */
  minBatch?: number;
  /** Most batches considered; default 8. */
  maxBatches?: number;
  /** First day fish can go in (a fixed delivery day); default 0. */
  firstDay?: number;
  /** Last day the final batch may go in; default: no limit within the horizon. */
  latestFinishDay?: number;
  /** Only these days are possible for a batch (e.g. the shop's delivery days); default: any whole day. */
  allowedDays?: readonly number[];
}

export interface AdditionRequest {
  scenario: Scenario;
  /** The fish to add; `count` is the total. */
  fish: FishGroup;
  constraints?: AdditionConstraints;
  /** Days to search within (default 90). */
  searchDays?: number;
  settings?: AdviceSettings;
}

export interface Batch {
  day: number;
  count: number;
}

export interface AdditionAdvice {
  status: 'all-at-once-is-safe' | 'staged' | 'no-safe-schedule';
  batches: Batch[];
  finishDay: number | null;
  events: ScenarioEvent[];
  staged: PlanOutcome | null;
  allAtOnce: PlanOutcome;
  binding: AppliedLimit;
  limits: AppliedLimit[];
  judgement: {
    method: 'bounding-set';
    ensembleMembers: number;
    seed: number;
    boundingMembers: number[];
    /** the bounding set's draws, so anyone can re-run them */
    boundingDraws: { index: number; parameters: Record<string, number>; feedingMultiplier: number }[];
    forecastsRun: number;
  };
  explanation: string[];
  cautions: string[];
}

/** Whole-fish batch counts as equal as possible, larger first. */
export function splitCount(total: number, batches: number): number[] {
  const base = Math.floor(total / batches);
  const extra = total - base * batches;
  return Array.from({ length: batches }, (_, i) => base + (i < extra ? 1 : 0));
}

function possibleDays(c: Required<Pick<AdditionConstraints, 'firstDay'>> & AdditionConstraints, lastDay: number): number[] {
  const days = c.allowedDays
    ? [...new Set(c.allowedDays)].filter((d) => Number.isInteger(d) && d >= c.firstDay && d <= lastDay).sort((a, b) => a - b)
    : Array.from({ length: Math.max(0, Math.floor(lastDay) - Math.ceil(c.firstDay) + 1) }, (_, i) => Math.ceil(c.firstDay) + i);
  return days;
}

function batchEvents(fish: FishGroup, batches: readonly Batch[]): ScenarioEvent[] {
  return batches.map((b) => ({ type: 'add-fish', day: b.day, fish: { ...fish, count: b.count } }));
}

interface SearchResult {
  batches: Batch[];
  finishDay: number;
  /** limit crossed on the bounding set when the last batch goes in one possible day earlier */
  paceLimit: LimitKey | null;
}

/** Best schedule on the judge's current bounding set, or null. */
function search(
  scenario: Scenario,
  fish: FishGroup,
  judge: UpperEdgeJudge,
  days: readonly number[],
  maxB: number,
): SearchResult | null {
  let best: SearchResult | null = null;
  let lastUnsafe: LimitKey | null = null;
  const safe = (batches: Batch[]) => {
    const last = batches[batches.length - 1].day;
    const v = judge.judge(withEvents(scenario, batchEvents(fish, batches)), last + SETTLE_DAYS);
    if (!v.safe) lastUnsafe = v.binding;
    return v.safe;
  };
  for (let B = 1; B <= maxB; B++) {
    const counts = splitCount(fish.count, B);
    const bound = best ? best.finishDay : Infinity; // must finish strictly earlier
    const batches: Batch[] = [{ day: days[0], count: counts[0] }];
    if (!safe(batches)) continue; // the first batch alone is too big
    let ok = true;
    let idx = 0; // index into days of the previous batch
    let paceLimit: LimitKey | null = null;
    for (let k = 1; k < B && ok; k++) {
      // Exponential search for a safe day after the previous batch, then bisection.
      let lo = idx; // known unsafe (or the previous batch's day)
      let step = 1;
      let hi = -1;
      while (true) {
        const cand = lo + step;
        if (cand >= days.length || days[cand] >= bound) break;
        if (safe([...batches, { day: days[cand], count: counts[k] }])) {
          hi = cand;
          break;
        }
        lo = cand;
        step *= 2;
      }
      if (hi < 0) {
        // Check the last day within bounds once before giving up.
        let last = days.length - 1;
        while (last > lo && days[last] >= bound) last--;
        if (last > lo && safe([...batches, { day: days[last], count: counts[k] }])) hi = last;
        else {
          ok = false;
          break;
        }
      }
      while (hi - lo > 1) {
        const mid = (lo + hi) >> 1;
        if (safe([...batches, { day: days[mid], count: counts[k] }])) hi = mid;
        else lo = mid;
      }
      if (lo > idx) {
        safe([...batches, { day: days[lo], count: counts[k] }]); // re-judge the day before to name its limit (cheap: fails fast)
        paceLimit = lastUnsafe;
      }
      batches.push({ day: days[hi], count: counts[k] });
      idx = hi;
    }
    if (!ok) continue;
    const finishDay = batches[batches.length - 1].day;
    if (!best || finishDay < best.finishDay) best = { batches, finishDay, paceLimit };
    if (B === 1) break; // all at once is safe: nothing finishes sooner
  }
  return best;
}

/** The fastest schedule whose forecast stays under the limits on the band's upper edge. */
export function fastestSafeSchedule(request: AdditionRequest): AdditionAdvice {
  const { scenario, fish } = request;
  const c = { firstDay: 0, ...request.constraints };
  const minBatch = c.minBatch ?? 1;
  if (!(Number.isInteger(fish.count) && fish.count >= 1)) throw new RangeError('fish.count must be a whole number ≥ 1');
  if (!(Number.isInteger(minBatch) && minBatch >= 1)) throw new RangeError('minBatch must be a whole number ≥ 1');
  const searchDays = request.searchDays ?? 90;
  const lastDay = Math.min(c.latestFinishDay ?? searchDays, searchDays);
  const days = possibleDays(c, lastDay);
  if (days.length === 0) throw new RangeError('no possible day for a batch between firstDay and latestFinishDay');
  // The reference (all at once) is ranked over two settling periods; plans finishing later are
  // compared over a longer horizon at the end.
  const referenceHorizon = days[0] + 2 * SETTLE_DAYS;
  const ctx = adviceContext(scenario, referenceHorizon, request.settings);
  const allAtOnceEvents = batchEvents(fish, [{ day: days[0], count: fish.count }]);
  const allAtOnceScenario = withEvents(scenario, allAtOnceEvents);
  const judge = createJudge(truncateEvents(allAtOnceScenario, referenceHorizon), ctx.limits, ctx.options, {
    ensemble: ctx.ensemble,
    boundingSize: ctx.boundingSize,
  });
  const maxB = Math.max(1, Math.min(c.maxBatches ?? 8, Math.floor(fish.count / minBatch)));

  let result: SearchResult | null = null;
  let staged: PlanOutcome | null = null;
  let horizon = referenceHorizon;
  for (let round = 0; round < MAX_ROUNDS; round++) {
    result = search(scenario, fish, judge, days, maxB);
    if (!result) break;
    const plan = withEvents(scenario, batchEvents(fish, result.batches));
    horizon = Math.max(referenceHorizon, result.finishDay + SETTLE_DAYS);
    const full = judge.judge(plan, horizon);
    const check = checkAgainstEnsemble(judge, plan, horizon);
    if (full.safe && check.edgeRatio <= 1) {
      staged = planOutcome(check.forecasts, ctx.limits, forecastParsed(truncateEvents(plan, horizon), { ...ctx.options, horizonDays: horizon }));
      break;
    }
    const grow = check.breaking.length ? check.breaking : full.safe ? [] : [judge.ensemble.members[full.worstMember]];
    if (grow.length === 0) {
      result = null;
      break;
    }
    judge.bounding.push(...grow.filter((m) => !judge.bounding.some((b) => b.index === m.index)));
    result = null;
  }

  const allAtOnceForecasts = horizon === referenceHorizon ? judge.ensemble.forecasts : ensembleForecasts(judge, allAtOnceScenario, horizon);
  const allAtOnce = planOutcome(
    allAtOnceForecasts,
    ctx.limits,
    forecastParsed(truncateEvents(allAtOnceScenario, horizon), { ...ctx.options, horizonDays: horizon }),
  );
  const batches = result?.batches ?? [];
  const status: AdditionAdvice['status'] = !result ? 'no-safe-schedule' : batches.length === 1 ? 'all-at-once-is-safe' : 'staged';
  const bindingKey: LimitKey = result?.paceLimit ?? allAtOnce.upperEdge.binding;
  const binding = limitByKey(ctx.limits, bindingKey);
  const explanation = explainAddition(status, fish, batches, allAtOnce, staged, binding, ctx.limits, c, minBatch);
  explanation.push(bandExplanation(judge.ensemble.forecasts.length, ctx.seed));
  return {
    status,
    batches,
    finishDay: result?.finishDay ?? null,
    events: result ? batchEvents(fish, batches) : [],
    staged,
    allAtOnce,
    binding,
    limits: ctx.limits,
    judgement: {
      method: 'bounding-set',
      ensembleMembers: judge.ensemble.forecasts.length,
      seed: ctx.seed,
      boundingMembers: judge.bounding.map((m) => m.index),
      boundingDraws: judge.bounding.map((m) => ({ index: m.index, parameters: { ...m.parameters } as Record<string, number>, feedingMultiplier: m.feedingMultiplier })),
      forecastsRun: judge.forecastsRun,
    },
    explanation,
    cautions: [...ESTIMATE_CAUTIONS, 'Test total ammonia and nitrite on each batch day before adding fish, and two and four days after each batch.'],
  };
}

function explainAddition(
  status: AdditionAdvice['status'],
  fish: FishGroup,
  batches: Batch[],
  allAtOnce: PlanOutcome,
  staged: PlanOutcome | null,
  binding: AppliedLimit,
  limits: AppliedLimit[],
  c: AdditionConstraints & { firstDay: number },
  minBatch: number,
): string[] {
  const name = fish.name ?? fish.species ?? 'fish';
  const out: string[] = [];
  out.push(describeOutcome(allAtOnce, limits, `All ${fish.count} ${name} at once`));
  if (status === 'all-at-once-is-safe') {
    out.push('Your biofilter can take the whole addition at once: even the upper edge of the band stays under every limit.');
  } else if (status === 'staged' && staged) {
    const plan = batches.map((b) => `${b.count} on day ${b.day}`).join(', ');
    out.push(`Fastest safe schedule: ${plan}. The last batch goes in on day ${batches[batches.length - 1].day}.`);
    out.push(describeOutcome(staged, limits, 'With this schedule'));
    out.push(
      `Why this schedule: each batch goes in on the earliest day at which the forecast — judged on the band's upper edge, ` +
        `not its middle — stays under every limit; a day earlier for any batch would cross the ${binding.label} limit on ` +
        `the pessimistic forecasts. Between batches the nitrifiers grow into the new load.`,
    );
    out.push(`The limit that sets the pace is the ${describeLimit(binding)}. ${whyLimitMatters(binding.key)}`);
  } else {
    const reasons = [`smallest batch ${minBatch}`, c.latestFinishDay !== undefined ? `finish by day ${c.latestFinishDay}` : null]
      .filter(Boolean)
      .join(', ');
    out.push(
      `No schedule within your constraints (${reasons}) keeps the forecast under the limits. Consider fewer fish, smaller ` +
        `batches, a later finish, or growing the biofilter first with supplementary ammonia dosing.`,
    );
    out.push(`The limit in the way is the ${describeLimit(binding)}. ${whyLimitMatters(binding.key)}`);
  }
  return out;
}
