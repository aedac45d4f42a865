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
 * Resuming: a candidate differs from the plan committed so far only by its new batch, so for
 * each bounding member the committed plan runs once, in a forecast session that keeps the
 * state at every possible day it passes; a candidate batch on day d is then forecast from
 * the state at d (the engine's `from` option) and judged on the committed run's samples
 * before d plus its own from d on — the same series as a run from day 0, to solver
 * tolerance, at the cost of the days after d only. A candidate is judged every
 * `EARLY_CHECK_DAYS` as its forecast runs and dropped at its first sample over a limit — the
 * verdict is the same, since a run is unsafe exactly when some sample crosses; only the
 * re-judging of the day before the chosen one runs in full, to name the limit that sets the
 * pace (the highest peak ratio).
 */
import type { FishGroup, Scenario, ScenarioEvent } from '../scenario';
import { fishGroupName } from '../catalogue';
import { createForecastSession, forecastParsed, type ForecastSeries, type ForecastSession, type ForecastState } from '../forecast';
import { adviceContext, type AdviceSettings } from './advice-context';
import { bandExplanation, memberOptions } from './ensemble';
import { describeLimit, describeOutcome, limitByKey, whyLimitMatters, WORST_TENTH } from './explain';
import { checkAgainstEnsemble, createJudge, ensembleForecasts, judgementOf, judgeSeries, type Judgement, type UpperEdgeJudge } from './judge';
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
  judgement: Judgement;
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

interface SavedDay {
  state: ForecastState;
  /** samples of the committed run before the day */
  samples: number;
  /** largest value/limit per limit over those samples (computed on first use) */
  prefixRatios: number[] | null;
}

interface CommittedRun {
  session: ForecastSession;
  saved: Map<number, SavedDay>;
}

/** Samples [from, to) of a series (the part a judge reads). */
function sliceOf(s: ForecastSeries, from: number, to: number) {
  return {
    days: s.days.slice(from, to),
    tanMgN: s.tanMgN.slice(from, to),
    freeNh3MgL: s.freeNh3MgL.slice(from, to),
    no2MgN: s.no2MgN.slice(from, to),
    ph: s.ph.slice(from, to),
    temperatureC: s.temperatureC.slice(from, to),
  };
}

/** Days forecast between checks of a candidate against the limits (see resumingJudge). */
const EARLY_CHECK_DAYS = 2;

/**
 * Judges "committed batches + one more batch" on the bounding set, resuming each member's
 * forecast from the committed plan's state on the new batch's day (see the module comment).
 */
function resumingJudge(scenario: Scenario, fish: FishGroup, judge: UpperEdgeJudge, committed: readonly Batch[], days: readonly number[]) {
  const base = withEvents(scenario, batchEvents(fish, committed));
  // Past the last possible day (a session needs a horizon above 0 and above every state it saves).
  const sessionHorizon = days[days.length - 1] + 1;
  const sessionScenario = truncateEvents(base, sessionHorizon);
  const runs = new Map<number, CommittedRun>();
  const limits = judge.limits;

  const savedDay = (run: CommittedRun, day: number): SavedDay => {
    const have = run.saved.get(day);
    if (have) return have;
    // Keep the state at every possible day passed on the way: bisection comes back to them.
    for (const d of days) {
      if (d < run.session.day - 1e-9 || d > day) continue;
      const state = run.session.advanceTo(d);
      run.saved.set(d, { state, samples: run.session.samples, prefixRatios: null });
    }
    const saved = run.saved.get(day);
    if (!saved) throw new Error(`no saved state for day ${day}: batch days must be possible days`);
    return saved;
  };

  /** `full`: judge the whole settling period even once a limit is crossed, to name the worst limit. */
  return (batch: Batch, full = false): { safe: boolean; binding: LimitKey } => {
    const horizon = batch.day + SETTLE_DAYS;
    const candidate = truncateEvents(withEvents(base, batchEvents(fish, [batch])), horizon);
    let worstRatio = -Infinity;
    let binding: LimitKey = limits[0].key;
    for (const m of judge.bounding) {
      judge.forecastsRun++;
      const options = memberOptions(m, judge.options);
      let run = runs.get(m.index);
      if (!run) {
        run = { session: createForecastSession(sessionScenario, { ...options, horizonDays: sessionHorizon }), saved: new Map() };
        runs.set(m.index, run);
      }
      const saved = savedDay(run, batch.day);
      saved.prefixRatios ??= judgeSeries(sliceOf(run.session.series, 0, saved.samples), limits).limits.map((v) => v.peakRatio);
      const ratios = saved.prefixRatios.slice();
      const after = createForecastSession(candidate, { ...options, horizonDays: horizon, from: saved.state });
      // Judge as the forecast goes, a few days at a time: an unsafe candidate usually crosses
      // within days of its batch and needs no more (unless its worst limit must be named).
      let judged = 0;
      for (let d = batch.day + EARLY_CHECK_DAYS; ; d += EARLY_CHECK_DAYS) {
        const end = d >= horizon;
        if (end) after.finish();
        else after.runTo(d);
        const upTo = end ? after.series.days.length : after.samples;
        judgeSeries(sliceOf(after.series, judged, upTo), limits).limits.forEach((v, j) => (ratios[j] = Math.max(ratios[j], v.peakRatio)));
        judged = upTo;
        if (end || (!full && ratios.some((r) => r > 1))) break;
      }
      let memberWorst = -Infinity;
      ratios.forEach((r, j) => {
        if (r > memberWorst) memberWorst = r;
        if (r > worstRatio) {
          worstRatio = r;
          binding = limits[j].key;
        }
      });
      if (memberWorst > 1) break; // one unsafe member settles it
    }
    return { safe: worstRatio <= 1, binding };
  };
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
  // One resuming judge per set of committed batches.
  const resumers = new Map<string, ReturnType<typeof resumingJudge>>();
  const safe = (batches: Batch[], full = false) => {
    const committed = batches.slice(0, -1);
    const key = committed.map((b) => `${b.day}:${b.count}`).join(',');
    let resumer = resumers.get(key);
    if (!resumer) {
      resumer = resumingJudge(scenario, fish, judge, committed, days);
      resumers.set(key, resumer);
    }
    const v = resumer(batches[batches.length - 1], full);
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
        safe([...batches, { day: days[lo], count: counts[k] }], true); // re-judge the day before in full to name its worst limit
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
  if (days.length === 0) throw new RangeError('There is no possible day for a batch between the first day allowed and the day it must be finished by.');
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
  // The whole ensemble has the last word: when all at once keeps 9 in 10 forecasts under the
  // limits it is the fastest schedule, even if the bounding draws (ranked just above that
  // quantile) put it a hair over.
  if (!result && allAtOnce.upperEdge.safe) result = { batches: [{ day: days[0], count: fish.count }], finishDay: days[0], paceLimit: null };
  const batches = result?.batches ?? [];
  const status: AdditionAdvice['status'] = !result ? 'no-safe-schedule' : batches.length === 1 ? 'all-at-once-is-safe' : 'staged';
  const bindingKey: LimitKey = result?.paceLimit ?? allAtOnce.upperEdge.binding;
  const binding = limitByKey(ctx.limits, bindingKey);
  const explanation = explainAddition(status, fish, batches, allAtOnce, staged, binding, ctx.limits, c, minBatch);
  explanation.push(bandExplanation(judge.ensemble.forecasts.length));
  return {
    status,
    batches,
    finishDay: result?.finishDay ?? null,
    events: result ? batchEvents(fish, batches) : [],
    staged,
    allAtOnce,
    binding,
    limits: ctx.limits,
    judgement: judgementOf(judge, ctx.seed),
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
  const name = fishGroupName(fish);
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
        `not its middle — stays under every limit; a day earlier for any batch would take the ${binding.label} over its limit in ` +
        `${WORST_TENTH}. Between batches the filter bacteria grow to match the new fish.`,
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
