/**
 * Plan days as calendar dates. A plan counts days from its start date (YYYY-MM-DD, taken as
 * UTC midnight so the server, the worker and the browser agree whatever their time zone).
 */

const DAY_MS = 86_400_000;
const WEEKDAYS = ['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat'] as const;
const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'] as const;

function startMs(startDate: string): number {
  return /^\d{4}-\d{2}-\d{2}$/.test(startDate) ? Date.parse(`${startDate}T00:00:00Z`) : NaN;
}

/** Adds whole days to a YYYY-MM-DD date (UTC); '' when the date is unreadable. */
export function addDays(startDate: string, days: number): string {
  const t = Date.parse(`${startDate}T00:00:00Z`);
  if (Number.isNaN(t)) return '';
  return new Date(t + Math.round(days) * DAY_MS).toISOString().slice(0, 10);
}

/** The plan day as words, e.g. "Fri 11 Dec 2026" (English, the product's language); '' when the start date is unreadable. */
export function dayAsDate(startDate: string, day: number): string {
  const t = startMs(startDate);
  if (Number.isNaN(t)) return '';
  const d = new Date(t + Math.round(day) * DAY_MS);
  return `${WEEKDAYS[d.getUTCDay()]} ${d.getUTCDate()} ${MONTHS[d.getUTCMonth()]} ${d.getUTCFullYear()}`;
}
