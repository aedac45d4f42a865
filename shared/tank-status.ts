/**
 * Home-screen status of a tank (pure): the latest test judged against the tank's limits
 * (simulation/water-test.ts `judgeWaterTest`), and the day the next test is due.
 */
import type { JudgedValue, LimitLevel, NextTest, PlanEvent, TankStatus } from './schemas/tank';
import { judgeWaterTest } from '../simulation/water-test';
import { planCheckDays } from './plan-check-days';

/** Common practice: a settled tank is tested about weekly. */
export const ROUTINE_TEST_INTERVAL_DAYS = 7;

const DAY_MS = 86_400_000;
const LEVEL_ORDER: readonly LimitLevel[] = ['ok', 'watch', 'over'];

/** The level rule and its margin live with the one judgement of a test (simulation/water-test.ts). */
export { levelFor, WATCH_SHARE } from '../simulation/water-test';

interface LatestValues {
  tanMgN: number | null;
  no2MgN: number | null;
  ph: number | null;
  temperatureC: number | null;
}

/**
 * The latest test as the home screen and readings table show it: simulation/water-test.ts
 * `judgeWaterTest`, the same judgement the alert e-mails are worded from.
 */
export function judgeLatest(latest: LatestValues, tank: { ph: number; temperatureC: number }): JudgedValue[] {
  return judgeWaterTest(latest, tank).judged.map(({ key, valueMgN, level, limit }) => ({ key, valueMgN, level, limit: { ...limit } }));
}

export function worstLevel(judged: readonly JudgedValue[]): LimitLevel | null {
  if (judged.length === 0) return null;
  return judged.reduce<LimitLevel>((w, j) => (LEVEL_ORDER.indexOf(j.level) > LEVEL_ORDER.indexOf(w) ? j.level : w), 'ok');
}

const utcDay = (ms: number) => new Date(Math.floor(ms / DAY_MS) * DAY_MS).toISOString().slice(0, 10);

/**
 * When the next test is due (UTC calendar date):
 * - no test yet → today;
 * - an active plan → its first check day (shared/plan-check-days.ts, the plans' own rule)
 *   after the day of the last test;
 * - otherwise, or once the plan's check days are all behind → a week after the last test.
 * A due date in the past stays in the past: the card then says the test is overdue.
 */
export function nextTestDue(
  lastTakenAt: Date | null,
  activePlan: { startDate: string; events: readonly PlanEvent[] } | null,
  now: Date,
): NextTest {
  if (!lastTakenAt) return { date: utcDay(now.getTime()), reason: 'no-test-yet' };
  const lastDay = utcDay(lastTakenAt.getTime());
  if (activePlan) {
    const next = planCheckDays(activePlan.events, activePlan.startDate).find((c) => c.date !== '' && c.date > lastDay);
    if (next) return { date: next.date, reason: 'plan-check-day', detail: next.reasons[0] };
  }
  return { date: utcDay(Date.parse(lastDay) + ROUTINE_TEST_INTERVAL_DAYS * DAY_MS), reason: 'routine' };
}

export function tankStatus(
  tank: { ph: number; temperatureC: number },
  latest: (LatestValues & { takenAt: Date }) | null,
  activePlan: { startDate: string; events: readonly PlanEvent[] } | null,
  now: Date,
): TankStatus {
  const judged = latest ? judgeLatest(latest, tank) : [];
  const overall = latest ? worstLevel(judged) : null;
  let nextTest = nextTestDue(latest?.takenAt ?? null, activePlan, now);
  // Over a limit: test again the next day (common practice), unless something is due sooner.
  if (latest && overall === 'over') {
    const dayAfter = utcDay(Date.parse(utcDay(latest.takenAt.getTime())) + DAY_MS);
    if (dayAfter < nextTest.date) nextTest = { date: dayAfter, reason: 'over-limit' };
  }
  return { overall, judged, nextTest };
}
