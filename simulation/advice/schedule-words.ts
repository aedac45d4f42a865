/**
 * The plain-words answer of "how fast can these fish go in": one line a keeper can act on
 * ("20 platy every 7 days (2 batches), done by day 7 (Fri 11 Dec 2026)"), the same line for
 * the schedule found and for each suggestion.
 */
import type { FishGroup } from '../scenario';
import { findSpecies } from '../catalogue';
import { dayAsDate } from '../calendar';

export interface ScheduleBatch {
  day: number;
  count: number;
}

/** The fish as a keeper names them: the catalogue's common name, else the keeper's name. */
export function fishName(fish: Pick<FishGroup, 'species' | 'name'>): string {
  const common = fish.species ? findSpecies(fish.species)?.commonName : undefined;
  return fish.name ?? (common ? common.toLowerCase() : fish.species ?? 'fish');
}

/** "day 7 (Fri 11 Dec 2026)", or "day 7" without a start date. */
export function dayWords(day: number, startDate?: string): string {
  const date = startDate ? dayAsDate(startDate, day) : '';
  return date ? `day ${day} (${date})` : `day ${day}`;
}

function range(xs: readonly number[]): string {
  const lo = Math.min(...xs);
  const hi = Math.max(...xs);
  return lo === hi ? `${lo}` : `${lo}–${hi}`;
}

/** "20 every 7 days (2 batches)" or "batches of 13–14, 5–9 days apart (3 batches)". */
export function paceWords(batches: readonly ScheduleBatch[]): string {
  const counts = batches.map((b) => b.count);
  const gaps = batches.slice(1).map((b, i) => b.day - batches[i].day);
  const even = Math.min(...gaps) === Math.max(...gaps);
  const per = range(counts);
  return even ? `${per} every ${gaps[0]} day${gaps[0] === 1 ? '' : 's'} (${batches.length} batches)` : `${batches.length} batches of ${per}, ${range(gaps)} days apart`;
}

/** "all at once on day 0 (…)" or "20 every 7 days (2 batches), done by day 7 (…)". */
export function scheduleWords(batches: readonly ScheduleBatch[], startDate?: string): string {
  if (batches.length === 1) return `all at once on ${dayWords(batches[0].day, startDate)}`;
  return `${paceWords(batches)}, done by ${dayWords(batches[batches.length - 1].day, startDate)}`;
}

/** The one-line answer for a schedule: "40 platy: 20 every 7 days (2 batches), done by day 7 (Fri 11 Dec 2026)." */
export function scheduleSummary(fish: Pick<FishGroup, 'species' | 'name'>, batches: readonly ScheduleBatch[], startDate?: string): string {
  const total = batches.reduce((n, b) => n + b.count, 0);
  return `${total} ${fishName(fish)}: ${scheduleWords(batches, startDate)}.`;
}
