/**
 * Putting a "how fast" schedule into a plan: the rule the plan editor applies and the server
 * searches by, so both agree on which events the schedule stands for. Pure.
 */
import type { ScenarioEvent } from '../simulation/scenario';

type AddFish = Extract<ScenarioEvent, { type: 'add-fish' }>;

/** An add-fish event of the same fish (species and name) as `fish`. */
export function addsSameFish(e: ScenarioEvent, fish: Pick<AddFish['fish'], 'species' | 'name'>): e is AddFish {
  return e.type === 'add-fish' && e.fish.species === fish.species && e.fish.name === fish.name;
}

/** Day of the first planned addition of these fish (0 when the plan has none): the schedule's earliest start. */
export function plannedDay(events: readonly ScenarioEvent[], fish: Pick<AddFish['fish'], 'species' | 'name'>): number {
  const days = events.filter((e) => addsSameFish(e, fish)).map((e) => e.day);
  return days.length > 0 ? Math.min(...days) : 0;
}

const byDay = (a: ScenarioEvent, b: ScenarioEvent) => a.day - b.day;

/** Events sorted by day (stable, so same-day events keep the keeper's order). */
export function sortEvents(events: readonly ScenarioEvent[]): ScenarioEvent[] {
  return [...events].sort(byDay);
}

/**
 * The plan's events with its additions of the schedule's fish replaced by the schedule's
 * batches on their days (advice "apply this schedule"); every other event stays. Null when a
 * batch would go in before the first planned addition of those fish: applying advice never
 * moves an event earlier than the keeper planned it.
 */
export function applySchedule(events: readonly ScenarioEvent[], schedule: readonly ScenarioEvent[]): ScenarioEvent[] | null {
  const batches = schedule.filter((e): e is AddFish => e.type === 'add-fish');
  if (batches.length === 0) return null;
  const fish = batches[0].fish;
  const earliest = plannedDay(events, fish);
  if (batches.some((b) => !addsSameFish(b, fish) || b.day < earliest)) return null;
  return sortEvents([...events.filter((e) => !addsSameFish(e, fish)), ...batches]);
}
