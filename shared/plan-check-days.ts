/**
 * planCheckDays(events, startDate): the days a keeper should test the water during a plan,
 * each with its reasons. Rule of thumb (common practice): test before anything changes, daily
 * for the first days after a new load or a lost part of the biofilter (ammonia rises within a
 * day or two, nitrite a few days later), then every few days for two weeks.
 */
import type { ScenarioEvent } from '../simulation/scenario';
import { defaultHorizonDays } from './tank-scenario';

export interface PlanCheckDay {
  day: number;
  /** YYYY-MM-DD, or '' when the start date is unreadable */
  date: string;
  reasons: string[];
}

/** Days after a new load to test (common practice: daily at first, then spaced out to two weeks). */
export const AFTER_NEW_LOAD = [1, 2, 3, 5, 7, 10, 14] as const;
/** Days after a smaller change (feeding, temperature, fewer fish). */
export const AFTER_SMALL_CHANGE = [2, 5, 9] as const;

function fishWords(count: number): string {
  return count === 1 ? '1 fish' : `${count} fish`;
}

/** Test days one event asks for, as [offset from its day, reason]. */
function checksFor(e: ScenarioEvent): [number, string][] {
  switch (e.type) {
    case 'add-fish':
      return AFTER_NEW_LOAD.map((k) => [e.day + k, `${fishWords(e.fish.count)} added on day ${e.day}`]);
    case 'move-fish':
      return e.direction === 'in'
        ? AFTER_NEW_LOAD.map((k) => [e.day + k, `${fishWords(e.fish.count)} moved in on day ${e.day}`])
        : AFTER_SMALL_CHANGE.map((k) => [e.day + k, `fish moved out on day ${e.day}: the biofilter shrinks to the smaller load`]);
    case 'remove-fish':
      return AFTER_SMALL_CHANGE.map((k) => [e.day + k, `fish rehomed on day ${e.day}: the biofilter shrinks to the smaller load`]);
    case 'feeding':
      return AFTER_SMALL_CHANGE.map((k) => [e.day + k, `feeding changed on day ${e.day}`]);
    case 'water-change':
      return [[e.day, `before the ${e.percent} % water change`]];
    case 'ammonia-dose': {
      const every = e.repeatEveryDays ?? 0;
      const times = every > 0 ? (e.repeatCount ?? 1) : 1;
      const out: [number, string][] = [[e.day + 1, 'a day after the first ammonia dose: it should be falling']];
      // Once a week while doses repeat, just before the dose.
      for (let t = 7; every > 0 && t <= every * (times - 1); t += 7) {
        const doseDay = e.day + Math.ceil(t / every) * every;
        out.push([doseDay, 'before a repeat dose: ammonia and nitrite should read near zero']);
      }
      return out;
    }
    case 'filter-clean':
      return [1, 3, 7].map((k) => [e.day + k, `filter media ${e.action === 'rinse' ? 'rinsed' : 'replaced'} on day ${e.day}`]);
    case 'medication':
    case 'aeration-loss': {
      const what = e.type === 'medication' ? 'medication' : 'aeration loss';
      const out: [number, string][] = [];
      const span = Math.min(Math.ceil(e.durationDays), 14);
      for (let k = 1; k <= span; k++) out.push([e.day + k, `during the ${what} from day ${e.day}: filter bacteria may slow`]);
      out.push([e.day + Math.ceil(e.durationDays) + 2, `after the ${what} ends`]);
      return out;
    }
    case 'temperature':
      return AFTER_SMALL_CHANGE.map((k) => [e.day + k, `temperature changed on day ${e.day}`]);
  }
}

/** Adds whole days to a YYYY-MM-DD date (UTC); '' when the date is unreadable. */
export function addDays(startDate: string, days: number): string {
  const t = Date.parse(`${startDate}T00:00:00Z`);
  if (Number.isNaN(t)) return '';
  return new Date(t + Math.round(days) * 86_400_000).toISOString().slice(0, 10);
}

/** Check days in order, one per whole day, within the plan's forecast horizon. */
export function planCheckDays(events: readonly ScenarioEvent[], startDate: string): PlanCheckDay[] {
  const horizon = defaultHorizonDays(events);
  const byDay = new Map<number, string[]>();
  const add = (day: number, reason: string) => {
    const d = Math.round(day);
    if (d < 0 || d > horizon) return;
    const list = byDay.get(d) ?? [];
    if (!list.includes(reason)) list.push(reason);
    byDay.set(d, list);
  };
  if (events.length > 0) add(0, 'before the plan starts, to know the starting water');
  for (const e of events) for (const [day, reason] of checksFor(e)) add(day, reason);
  return [...byDay.entries()].sort((a, b) => a[0] - b[0]).map(([day, reasons]) => ({ day, date: addDays(startDate, day), reasons }));
}
