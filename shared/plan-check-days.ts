/**
 * planCheckDays(events, startDate): the days a keeper should test the water during a plan,
 * each with its reasons. Rule of thumb (common practice): test before anything changes, daily
 * for the first days after a new load or a lost part of the biofilter (ammonia rises within a
 * day or two, nitrite a few days later), then every few days for two weeks.
 */
import type { ScenarioEvent } from '../simulation/scenario';
import { addDays } from '../simulation/calendar';
import { defaultHorizonDays } from './tank-scenario';

/** Plan days as dates: the engine's calendar (one rule for the plan, its advice and its print-out). */
export { addDays };

export interface PlanCheckDay {
  day: number;
  /** YYYY-MM-DD, or '' when the start date is unreadable */
  date: string;
  reasons: string[];
  /**
   * What the plan's forecast says the test should show that day (mg N/L), when a forecast is
   * given: the one source of "what to expect", so no reason states an expectation of its own.
   */
  expected?: { tanMgN: number; no2MgN: number };
}

/** The forecast's daily series, as the plan's forecast view carries them. */
export interface CheckDayForecast {
  days: readonly number[];
  tanMgN: readonly number[];
  no2MgN: readonly number[];
}

/** Days after a new load to test (common practice: daily at first, then spaced out to two weeks). */
export const AFTER_NEW_LOAD = [1, 2, 3, 5, 7, 10, 14] as const;
/** Days after a smaller change (feeding, temperature, fewer fish). */
export const AFTER_SMALL_CHANGE = [2, 5, 9] as const;

/** How many animals an event's groups hold together. */
export function fishCount(groups: readonly { count: number }[]): number {
  return groups.reduce((n, g) => n + g.count, 0);
}

function fishWords(count: number): string {
  return count === 1 ? '1 fish' : `${count} fish`;
}

/** Test days one event asks for, as [offset from its day, reason]. */
function checksFor(e: ScenarioEvent): [number, string][] {
  switch (e.type) {
    case 'add-fish':
      return AFTER_NEW_LOAD.map((k) => [e.day + k, `${fishWords(fishCount(e.fish))} added on day ${e.day}`]);
    case 'move-fish':
      return e.direction === 'in'
        ? AFTER_NEW_LOAD.map((k) => [e.day + k, `${fishWords(fishCount(e.fish))} moved in on day ${e.day}`])
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
      const out: [number, string][] = [
        [e.day + 1, e.delivery === 'continuous' ? 'a day into the continuous ammonia dose, to see the filter keeping up' : 'a day after the first ammonia dose, to see how fast it clears'],
      ];
      // Once a week while doses repeat, just before the dose.
      for (let t = 7; every > 0 && t <= every * (times - 1); t += 7) {
        const doseDay = e.day + Math.ceil(t / every) * every;
        out.push([doseDay, 'before a repeat dose, to see the filter keeping up']);
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

/**
 * The forecast's value for a test on `day`: the sample that day, or — when something happens
 * that day (a dose, a water change, fish coming or going) — the last sample before it, since
 * the test is taken first.
 */
function valueOn(f: CheckDayForecast, series: readonly number[], day: number, eventDays: ReadonlySet<number>): number | undefined {
  const before = eventDays.has(day);
  let k = -1;
  for (let i = 0; i < f.days.length && (before ? f.days[i] < day - 1e-9 : f.days[i] <= day + 1e-9); i++) k = i;
  return k < 0 ? undefined : series[k];
}

/** Whole days on which an event acts (each repeat of a dose included). */
function eventDaysOf(events: readonly ScenarioEvent[]): Set<number> {
  const out = new Set<number>();
  for (const e of events) {
    out.add(Math.round(e.day));
    if (e.type === 'ammonia-dose' && e.repeatEveryDays !== undefined) {
      for (let i = 1; i < (e.repeatCount ?? 1) && i < 1000; i++) out.add(Math.round(e.day + i * e.repeatEveryDays));
    }
  }
  return out;
}

/** Check days in order, one per whole day, within the plan's forecast horizon. */
export function planCheckDays(events: readonly ScenarioEvent[], startDate: string, forecast?: CheckDayForecast): PlanCheckDay[] {
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
  const eventDays = eventDaysOf(events);
  return [...byDay.entries()]
    .sort((a, b) => a[0] - b[0])
    .map(([day, reasons]) => {
      const tan = forecast ? valueOn(forecast, forecast.tanMgN, day, eventDays) : undefined;
      const no2 = forecast ? valueOn(forecast, forecast.no2MgN, day, eventDays) : undefined;
      const expected = tan !== undefined && no2 !== undefined ? { tanMgN: tan, no2MgN: no2 } : undefined;
      return { day, date: addDays(startDate, day), reasons, ...(expected ? { expected } : {}) };
    });
}
