/** Display formatting for the tank screens. Pure: every function takes `now` or a locale explicitly. */

const DAY_MS = 86_400_000;

function startOfLocalDay(t: Date): number {
  return new Date(t.getFullYear(), t.getMonth(), t.getDate()).getTime();
}

/** Whole calendar days from `then` to `now` in local time (0 = same day); null for an invalid date. */
export function calendarDaysAgo(then: string | Date, now: Date): number | null {
  const t = typeof then === 'string' ? new Date(then) : then;
  if (Number.isNaN(t.getTime())) return null;
  // Round: a daylight-saving change makes one local day 23 or 25 hours long.
  return Math.round((startOfLocalDay(now) - startOfLocalDay(t)) / DAY_MS);
}

/** "today", "yesterday", "3 days ago", "in 2 days" (clock skew), or "unknown date". */
export function relativeDayLabel(then: string | Date, now: Date): string {
  const days = calendarDaysAgo(then, now);
  if (days === null) return 'unknown date';
  if (days === 0) return 'today';
  if (days === 1) return 'yesterday';
  if (days === -1) return 'tomorrow';
  return days > 0 ? `${days} days ago` : `in ${-days} days`;
}

/** "12 Mar 2025" style date in the given locale (default: the runtime's). */
export function shortDate(then: string | Date, locale?: string): string {
  const t = typeof then === 'string' ? new Date(then) : then;
  if (Number.isNaN(t.getTime())) return 'unknown date';
  return new Intl.DateTimeFormat(locale, { day: 'numeric', month: 'short', year: 'numeric' }).format(t);
}

/** Concentration, litres and °C: one formatter per kind of figure, in simulation/format-number.ts. */
export { formatCelsius, formatLitres, formatConcentration as formatMgPerL } from '@/simulation/format-number';

/** A wait in words, rounded up: "30 seconds", "1 minute", "15 minutes", "2 hours". */
export function formatWait(seconds: number): string {
  const s = Math.max(1, Math.ceil(seconds));
  if (s < 60) return `${s} second${s === 1 ? '' : 's'}`;
  const m = Math.ceil(s / 60);
  if (m < 60) return `${m} minute${m === 1 ? '' : 's'}`;
  const h = Math.ceil(m / 60);
  return `${h} hour${h === 1 ? '' : 's'}`;
}

/**
 * "1 fish · 1 species", "14 fish and 10 shrimp or snails · 4 species", "No animals": shrimp and
 * snails are not counted as fish.
 */
export function stockingLabel(fishCount: number, speciesCount: number, invertebrateCount = 0): string {
  if (fishCount === 0 && invertebrateCount === 0) return 'No animals';
  const inverts = invertebrateCount > 0 ? `${invertebrateCount} shrimp or snail${invertebrateCount === 1 ? '' : 's'}` : '';
  const fish = fishCount > 0 ? `${fishCount} fish` : '';
  const animals = fish && inverts ? `${fish} and ${inverts}` : fish || inverts;
  const species = speciesCount > 0 ? ` · ${speciesCount} species` : '';
  return `${animals}${species}`;
}

/** A compact date for tables: "12 Mar" within the current year, "12 Mar 2024" otherwise. */
export function compactDate(then: string | Date, now: Date, locale?: string): string {
  const t = typeof then === 'string' ? new Date(then) : then;
  if (Number.isNaN(t.getTime())) return 'unknown date';
  if (t.getFullYear() !== now.getFullYear()) return shortDate(t, locale);
  return new Intl.DateTimeFormat(locale, { day: 'numeric', month: 'short' }).format(t);
}
