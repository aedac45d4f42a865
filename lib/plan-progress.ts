/**
 * A started plan against the calendar and the tank's tests (pure; local calendar days, the
 * keeper's own): which check days are done, due today, missed or still to come; where each
 * test falls on the forecast's day axis; and each test beside the forecast's value that day.
 */
import type { PlanCheckDay } from '@/shared/plan-check-days';
import type { ForecastView, PlanDetail } from '@/shared/schemas/plan';
import type { ReadingItem } from '@/shared/schemas/tank';

const DAY_MS = 86_400_000;

/** YYYY-MM-DD of an instant in the local calendar. */
export function localDate(t: Date): string {
  const y = t.getFullYear();
  const m = String(t.getMonth() + 1).padStart(2, '0');
  const d = String(t.getDate()).padStart(2, '0');
  return `${y}-${m}-${d}`;
}

/** Local midnight starting a YYYY-MM-DD day (ms); NaN for an unreadable date. */
function localMidnight(date: string): number {
  const [y, m, d] = date.split('-').map(Number);
  return y && m && d ? new Date(y, m - 1, d).getTime() : Number.NaN;
}

/** Whole local days from `from` to `to` (YYYY-MM-DD); rounded, as a daylight-saving day is 23 or 25 h. */
export function daysBetween(from: string, to: string): number {
  return Math.round((localMidnight(to) - localMidnight(from)) / DAY_MS);
}

/** The plan day of a test (fractional: day 2.5 is noon of day 2), counted from local midnight of day 0. */
export function readingDay(takenAt: string, startDate: string): number {
  return (Date.parse(takenAt) - localMidnight(startDate)) / DAY_MS;
}

/**
 * - done: a test was logged that day;
 * - due: today, not tested yet;
 * - missed: gone by without a test;
 * - upcoming: still to come;
 * - not-needed: after the plan was marked done.
 */
export type CheckDayState = 'done' | 'due' | 'missed' | 'upcoming' | 'not-needed';

export interface CheckDayProgress extends PlanCheckDay {
  state: CheckDayState;
}

export const CHECK_DAY_STATE_WORDS: Record<CheckDayState, string> = {
  done: 'Tested',
  due: 'Test today',
  missed: 'Missed',
  upcoming: 'To come',
  'not-needed': 'Not needed: the plan was done',
};

/**
 * Each check day's state. `testedOn`: the local dates with a logged test; `today` and
 * `finishedOn` (null while running) are local dates too.
 */
export function checkDayProgress(checkDays: readonly PlanCheckDay[], testedOn: ReadonlySet<string>, today: string, finishedOn: string | null): CheckDayProgress[] {
  return checkDays.map((c) => {
    const state: CheckDayState = testedOn.has(c.date)
      ? 'done'
      : finishedOn !== null && c.date > finishedOn
        ? 'not-needed'
        : c.date < today
          ? 'missed'
          : c.date === today
            ? 'due'
            : 'upcoming';
    return { ...c, state };
  });
}

/** The local dates of the given tests. */
export function testedDates(readings: readonly Pick<ReadingItem, 'takenAt'>[]): Set<string> {
  return new Set(readings.map((r) => localDate(new Date(r.takenAt))));
}

/** The next check day still open (due today or to come), or null when none is left. */
export function nextCheckDay(progress: readonly CheckDayProgress[]): CheckDayProgress | null {
  return progress.find((c) => c.state === 'due' || c.state === 'upcoming') ?? null;
}

export interface PlanProgress {
  /** Today's plan day (0 on the start date). */
  today: number;
  /** The forecast's last day: the plan's span. */
  lastDay: number;
  checkDays: CheckDayProgress[];
  next: CheckDayProgress | null;
  done: number;
  missed: number;
}

/** Where a started plan stands; `readings` are the tests taken while it ran. */
export function planProgress(
  plan: Pick<PlanDetail, 'startDate' | 'checkDays' | 'finishedAt'>,
  readings: readonly Pick<ReadingItem, 'takenAt'>[],
  now: Date,
  lastDay: number,
): PlanProgress {
  const today = localDate(now);
  const finishedOn = plan.finishedAt ? localDate(new Date(plan.finishedAt)) : null;
  const checkDays = checkDayProgress(plan.checkDays, testedDates(readings), today, finishedOn);
  return {
    // Never below day 0: a start date a day ahead of this device's calendar (another time zone) is day 0.
    today: Math.max(0, daysBetween(plan.startDate, today)),
    lastDay,
    checkDays,
    next: finishedOn ? null : nextCheckDay(checkDays),
    done: checkDays.filter((c) => c.state === 'done').length,
    missed: checkDays.filter((c) => c.state === 'missed').length,
  };
}

/** A sampled series' value at a day, linearly between samples; null outside the forecast. */
export function seriesAt(days: readonly number[], values: readonly number[], day: number): number | null {
  const n = Math.min(days.length, values.length);
  if (n === 0 || !Number.isFinite(day) || day < days[0] || day > days[n - 1]) return null;
  let hi = 1;
  while (hi < n - 1 && days[hi] < day) hi++;
  const lo = hi - 1;
  if (n === 1 || days[hi] === days[lo]) return values[lo];
  const w = Math.min(1, Math.max(0, (day - days[lo]) / (days[hi] - days[lo])));
  return values[lo] * (1 - w) + values[hi] * w;
}

export interface MeasuredBesideForecast {
  measured: number | null;
  forecast: number | null;
}

/** One test beside the forecast at its moment (mg N/L; conversion to the keeper's basis is the screen's). */
export interface ReadingBesideForecast {
  id: string;
  takenAt: string;
  day: number;
  tanMgN: MeasuredBesideForecast;
  no2MgN: MeasuredBesideForecast;
  no3MgN: MeasuredBesideForecast;
}

export function readingsBesideForecast(readings: readonly ReadingItem[], view: Pick<ForecastView, 'days' | 'tanMgN' | 'no2MgN' | 'no3MgN'>, startDate: string): ReadingBesideForecast[] {
  return readings.map((r) => {
    const day = readingDay(r.takenAt, startDate);
    const pair = (key: 'tanMgN' | 'no2MgN' | 'no3MgN') => ({ measured: r[key], forecast: seriesAt(view.days, view[key], day) });
    return { id: r.id, takenAt: r.takenAt, day, tanMgN: pair('tanMgN'), no2MgN: pair('no2MgN'), no3MgN: pair('no3MgN') };
  });
}
