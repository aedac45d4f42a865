/**
 * Rescue water changes (issue 4, point 4): when a plan's forecast crosses a limit, the
 * smallest schedule of water changes (day and percent) that keeps it under. Water changes
 * dilute dissolved species exactly and bring in the tap water's ammonia (chloramine) and
 * nitrate (MODEL.md §7.1; the engine mixes with the tank's tap-water setting).
 *
 * Search, on the upper-edge judge (./judge): find the first crossing; put a change on the
 * morning of its day (events come before that day's samples), of the smallest percent on the grid that pushes the first
 * crossing past the next day (so a further change can still come first); repeat. Then prune: lower each change a grid step at a time, and drop any
 * change, while the plan stays safe — so one change fewer, or any one change a step smaller,
 * crosses a limit. Finally the plan is checked against the whole ensemble; a member breaking
 * the 90th-percentile bound joins the bounding set and the search runs again.
 */
import type { Scenario, ScenarioEvent } from '../scenario';
import { forecastParsed } from '../forecast';
import { adviceContext, type AdviceSettings } from './advice-context';
import { ESTIMATE_CAUTIONS, WATER_CHANGE_CAUTIONS } from './cautions';
import { bandExplanation } from './ensemble';
import { describeLimit, describeOutcome, limitByKey, whyLimitMatters, WORST_TENTH } from './explain';
import { checkAgainstEnsemble, createJudge, judgementOf, type Judgement, type UpperEdgeJudge } from './judge';
import { planOutcome, type PlanOutcome } from './plan-outcome';
import { withEvents } from './scenario-edit';
import { formatValue, type AppliedLimit } from './tank-limits';

export interface RescueRequest {
  scenario: Scenario;
  horizonDays?: number;
  /** Largest single change, % (default 50: bigger changes shock fish — common practice). */
  maxPercent?: number;
  /** Grid of percents (default 5). */
  stepPercent?: number;
  /** Smallest change worth doing, % (default 10). */
  minPercent?: number;
  settings?: AdviceSettings;
}

export interface WaterChange {
  day: number;
  percent: number;
}

export interface RescueAdvice {
  status: 'no-changes-needed' | 'rescued' | 'cannot-rescue';
  changes: WaterChange[];
  events: ScenarioEvent[];
  without: PlanOutcome;
  withChanges: PlanOutcome | null;
  binding: AppliedLimit;
  limits: AppliedLimit[];
  judgement: Judgement;
  explanation: string[];
  cautions: string[];
}

const MAX_CHANGES = 40;

function changeEvents(changes: readonly WaterChange[]): ScenarioEvent[] {
  return changes.map((c) => ({ type: 'water-change', day: c.day, percent: c.percent }));
}

/** Safe when every bounding member is; the first crossing is the earliest over all of them. */
function evaluate(judge: UpperEdgeJudge, scenario: Scenario): { safe: boolean; first: number | null } {
  const vs = judge.judgeAll(scenario);
  const days = vs.flatMap((v) => v.limits.map((l) => l.firstDayOver)).filter((d): d is number => d !== null);
  return { safe: vs.every((v) => v.safe), first: days.length ? Math.min(...days) : null };
}

interface Grid {
  min: number;
  max: number;
  step: number;
}

function greedy(scenario: Scenario, judge: UpperEdgeJudge, grid: Grid): WaterChange[] | null {
  const changes: WaterChange[] = [];
  const judgeWith = (cs: WaterChange[]) => evaluate(judge, withEvents(scenario, changeEvents(cs)));
  let v = judgeWith(changes);
  while (!v.safe) {
    if (changes.length >= MAX_CHANGES) return null;
    const t = v.first;
    if (t === null) return null;
    const lastDay = changes.length ? changes[changes.length - 1].day : -1;
    const day = Math.floor(t); // a change on the crossing's own day comes before that day's samples
    if (day <= lastDay || day < 0) return null; // crosses before a change can help
    let chosen: WaterChange | null = null;
    for (let p = grid.min; p <= grid.max + 1e-9; p += grid.step) {
      const trial = [...changes, { day, percent: p }];
      const tv = judgeWith(trial);
      const tc = tv.first;
      // Accept when the next crossing leaves room for a change on a later day.
      if (tv.safe || (tc !== null && tc >= day + 1)) {
        chosen = { day, percent: p };
        v = tv;
        break;
      }
    }
    if (!chosen) {
      chosen = { day, percent: grid.max };
      v = judgeWith([...changes, chosen]);
      const tc = v.first;
      if (!v.safe && (tc === null || tc < day + 1)) return null; // even the largest change leaves no room
    }
    changes.push(chosen);
  }
  return prune(scenario, judge, changes, grid);
}

/** Lowers and drops changes while the plan stays safe. */
function prune(scenario: Scenario, judge: UpperEdgeJudge, changes: WaterChange[], grid: Grid): WaterChange[] {
  const safe = (cs: WaterChange[]) => judge.judge(withEvents(scenario, changeEvents(cs))).safe;
  let cs = changes.map((c) => ({ ...c }));
  for (let i = cs.length - 1; i >= 0; i--) {
    const without = cs.filter((_, j) => j !== i);
    if (safe(without)) {
      cs = without;
      continue;
    }
    while (cs[i].percent - grid.step >= grid.min - 1e-9) {
      const trial = cs.map((c, j) => (j === i ? { ...c, percent: c.percent - grid.step } : c));
      if (!safe(trial)) break;
      cs = trial;
    }
  }
  return cs;
}

export function rescueWaterChanges(request: RescueRequest): RescueAdvice {
  const { scenario } = request;
  const horizon = request.horizonDays ?? scenario.horizonDays ?? 60;
  const grid: Grid = { min: request.minPercent ?? 10, max: request.maxPercent ?? 50, step: request.stepPercent ?? 5 };
  if (!(grid.step > 0 && grid.min > 0 && grid.max >= grid.min && grid.max <= 100)) throw new RangeError('percent grid must satisfy 0 < min ≤ max ≤ 100 and step > 0');
  const ctx = adviceContext(scenario, horizon, request.settings);
  const judge = createJudge(scenario, ctx.limits, ctx.options, { ensemble: ctx.ensemble, boundingSize: ctx.boundingSize });
  const reference = forecastParsed(scenario, ctx.options);
  const without = planOutcome(judge.ensemble.forecasts, ctx.limits, reference);

  let changes: WaterChange[] | null = [];
  let withChanges: PlanOutcome | null = null;
  if (!judge.judge(scenario).safe || !without.upperEdge.safe) {
    changes = null;
    for (let round = 0; round < 3; round++) {
      const found = greedy(scenario, judge, grid);
      if (!found) break;
      const plan = withEvents(scenario, changeEvents(found));
      const check = checkAgainstEnsemble(judge, plan);
      if (check.edgeRatio <= 1) {
        changes = found;
        withChanges = planOutcome(check.forecasts, ctx.limits, forecastParsed(plan, ctx.options));
        break;
      }
      if (!check.breaking.length) break;
      judge.bounding.push(...check.breaking);
    }
  }
  const status: RescueAdvice['status'] = changes === null ? 'cannot-rescue' : changes.length === 0 ? 'no-changes-needed' : 'rescued';
  const binding = limitByKey(ctx.limits, without.upperEdge.binding);
  const explanation: string[] = [describeOutcome(without, ctx.limits, 'Without water changes')];
  if (status === 'rescued' && changes && withChanges) {
    const tap = scenario.tank.tapWater;
    explanation.push(
      `Smallest water-change schedule that keeps the forecast under the limits: ${changes.map((c) => `${formatValue(c.percent)} % on day ${c.day}`).join(', ')}.`,
    );
    explanation.push(describeOutcome(withChanges, ctx.limits, 'With these changes'));
    explanation.push(
      `Each change goes in on the morning of the day the forecast would cross, at the smallest size that holds it off; one change fewer, or any change ${formatValue(grid.step)} % smaller, lets ${WORST_TENTH} cross. Your tap water brings ${formatValue(tap.tanMgN)} mg N/L ammonia and ${formatValue(tap.no3MgN)} mg N/L nitrate with each change, which the forecast includes.`,
    );
  } else if (status === 'cannot-rescue') {
    explanation.push(
      `Water changes of at most ${grid.max} % a day cannot keep this forecast under the limits: it crosses too soon or rises too fast. Change the plan itself (fewer fish, a slower schedule), and test daily.`,
    );
  } else {
    explanation.push('No water changes are needed: the forecast stays under the limits on the band\'s upper edge.');
  }
  explanation.push(`The limit at stake is the ${describeLimit(binding)}. ${whyLimitMatters(binding.key)}`);
  explanation.push(bandExplanation(judge.ensemble.forecasts.length));
  return {
    status,
    changes: changes ?? [],
    events: changeEvents(changes ?? []),
    without,
    withChanges,
    binding,
    limits: ctx.limits,
    judgement: judgementOf(judge, ctx.seed),
    explanation,
    cautions: [...ESTIMATE_CAUTIONS, ...WATER_CHANGE_CAUTIONS],
  };
}
