/**
 * Home-screen status of a tank (pure): the latest test judged against the tank's limits
 * (simulation/limits.ts `defaultLimits`), and the day the next test is due.
 */
import type { JudgedValue, LimitLevel, NextTest, PlanEvent, TankStatus } from './schemas/tank';
import { defaultLimits } from '../simulation/limits';
import { planCheckDays } from './plan-check-days';

/** A value at or above this share of its limit is "watch" — Shoalshift's own margin, not a published one. */
export const WATCH_SHARE = 0.5;
/** Common practice: a settled tank is tested about weekly. */
export const ROUTINE_TEST_INTERVAL_DAYS = 7;

const DAY_MS = 86_400_000;
const LEVEL_ORDER: readonly LimitLevel[] = ['ok', 'watch', 'over'];

export function levelFor(value: number, limit: number): LimitLevel {
  if (value > limit) return 'over';
  if (value >= limit * WATCH_SHARE) return 'watch';
  return 'ok';
}

interface LatestValues {
  tanMgN: number | null;
  no2MgN: number | null;
  ph: number | null;
  temperatureC: number | null;
}

/**
 * Total ammonia is judged against the free-ammonia guideline expressed as TAN at the pH and
 * temperature of the test (the tank's own when the test has none): free ammonia is the toxic
 * part and it grows with both. Nitrite against the culture-practice limit. Nitrate has no
 * default limit in simulation/limits.ts and is not judged.
 */
export function judgeLatest(latest: LatestValues, tank: { ph: number; temperatureC: number }): JudgedValue[] {
  const ph = latest.ph ?? tank.ph;
  const temperatureC = latest.temperatureC ?? tank.temperatureC;
  const limits = defaultLimits({ ph: Math.min(10, Math.max(4, ph)), temperatureC: Math.min(40, Math.max(0, temperatureC)) });
  const out: JudgedValue[] = [];
  if (latest.tanMgN !== null) {
    const l = limits.freeNh3AsTan;
    out.push({ key: 'tanMgN', valueMgN: latest.tanMgN, level: levelFor(latest.tanMgN, l.value), limit: { ...l } });
  }
  if (latest.no2MgN !== null) {
    const l = limits.nitrite;
    out.push({ key: 'no2MgN', valueMgN: latest.no2MgN, level: levelFor(latest.no2MgN, l.value), limit: { ...l } });
  }
  return out;
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
