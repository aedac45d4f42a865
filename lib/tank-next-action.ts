/**
 * The tank page's first screen (pure): the tank's state in a few facts and the one thing to do
 * next. The latest test is judged once (shared/tank-status.ts → simulation/water-test.ts); the
 * running plan's check days come from shared/plan-check-days.ts through lib/plan-progress.ts.
 */
import type { LimitLevel, PlanItem, TankDetail, TankStatus } from '@/shared/schemas/tank';
import { planCheckDays } from '@/shared/plan-check-days';
import { defaultHorizonDays } from '@/shared/tank-scenario';
import { livestockCounts, type StockCounts } from '@/shared/stock-counts';
import { tankStatus } from '@/shared/tank-status';
import { localDate, planProgress, type PlanProgress } from '@/lib/plan-progress';

export type NextAction =
  | { kind: 'log-test'; label: string; why: string }
  | { kind: 'open-plan'; planId: string; label: string; why: string }
  | { kind: 'plan-change'; label: string; why: string };

export interface RunningPlan {
  plan: PlanItem;
  progress: PlanProgress;
}

export interface TankOverview {
  status: TankStatus;
  overall: LimitLevel | null;
  stock: StockCounts;
  running: RunningPlan | null;
  testedToday: boolean;
  action: NextAction;
}

const shortDay = (date: string, locale?: string) =>
  new Intl.DateTimeFormat(locale, { weekday: 'short', day: 'numeric', month: 'short', timeZone: 'UTC' }).format(new Date(`${date}T00:00:00Z`));

/** "today", "tomorrow" or "Sat 6 Dec" for a local date. */
export function dayWords(date: string, now: Date, locale?: string): string {
  const today = localDate(now);
  if (date === today) return 'today';
  if (date === localDate(new Date(now.getTime() + 86_400_000))) return 'tomorrow';
  return shortDay(date, locale);
}

/** The running plan (at most one per tank, the server's rule), with where it stands today. */
export function runningPlanOf(tank: Pick<TankDetail, 'plans' | 'readings'>, now: Date): RunningPlan | null {
  const plan = tank.plans.find((p) => p.status === 'active');
  if (!plan) return null;
  const since = Date.parse(`${plan.startDate}T00:00:00`);
  const readings = tank.readings.filter((r) => Date.parse(r.takenAt) >= since);
  const checkDays = planCheckDays(plan.events, plan.startDate);
  return { plan, progress: planProgress({ startDate: plan.startDate, checkDays, finishedAt: null }, readings, now, defaultHorizonDays(plan.events)) };
}

/**
 * The one next action, in this order:
 * 1. a check day of the running plan today, not tested yet → log today's test;
 * 2. animals in the tank (or a plan running) and a test due or overdue → log today's test;
 * 3. a plan running → open it (its next check day);
 * 4. otherwise → plan a change.
 */
export function tankOverview(tank: TankDetail, now: Date, locale?: string): TankOverview {
  const latest = tank.readings[0] ?? null;
  const running = runningPlanOf(tank, now);
  const status = tankStatus(tank, latest ? { ...latest, takenAt: new Date(latest.takenAt) } : null, running ? running.plan : null, now);
  const stock = livestockCounts(tank.livestock);
  const testedToday = latest !== null && localDate(new Date(latest.takenAt)) === localDate(now);
  const action = nextAction({ status, stock, running, testedToday }, now, locale);
  return { status, overall: status.overall, stock, running, testedToday, action };
}

function nextAction(t: Pick<TankOverview, 'status' | 'stock' | 'running' | 'testedToday'>, now: Date, locale?: string): NextAction {
  const { running, testedToday, status } = t;
  const logToday = "Log today's test";
  if (running && !testedToday) {
    const today = running.progress.checkDays.find((c) => c.state === 'due');
    if (today) return { kind: 'log-test', label: logToday, why: `Day ${today.day} of “${running.plan.name}” is a test day: ${today.reasons[0]}.` };
  }
  const hasAnimals = t.stock.fish + t.stock.invertebrates > 0;
  const due = status.nextTest.date <= now.toISOString().slice(0, 10);
  if ((hasAnimals || running) && due && !testedToday) {
    const why =
      status.nextTest.reason === 'no-test-yet'
        ? 'No water test is logged for this tank yet: it tells every forecast where the water stands.'
        : status.nextTest.reason === 'over-limit'
          ? 'The last test was over a limit: test again until it is back under.'
          : 'A settled tank is tested about once a week, and the last test is a week old or more.';
    return { kind: 'log-test', label: logToday, why };
  }
  if (running) {
    const next = running.progress.next;
    const why = next
      ? `Next test day: ${dayWords(next.date, now, locale)} (day ${next.day}): ${next.reasons[0]}.`
      : 'Every test day is behind: mark it as done when the water has settled.';
    return { kind: 'open-plan', planId: running.plan.id, label: `Open “${running.plan.name}”`, why };
  }
  return {
    kind: 'plan-change',
    label: 'Plan a change',
    why: hasAnimals ? 'Nothing is running on this tank. Adding or removing fish? Forecast it first.' : 'No animals yet. Plan the first fish and see what the water will do.',
  };
}
