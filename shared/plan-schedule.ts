/**
 * Putting a "how fast" schedule into a plan: the rule the plan editor applies and the server
 * searches by, so both agree on which events the schedule stands for. Pure.
 */
import type { ScenarioEvent } from '../simulation/scenario';

type AddFish = Extract<ScenarioEvent, { type: 'add-fish' }>;
type FishKind = { species?: string; name?: string };

const sameKind = (g: FishKind, fish: FishKind) => g.species === fish.species && g.name === fish.name;

/** An add-fish event that carries `fish` (species and name) among its groups. */
export function addsSameFish(e: ScenarioEvent, fish: FishKind): e is AddFish {
  return e.type === 'add-fish' && e.fish.some((g) => sameKind(g, fish));
}

/** Day of the first planned addition of these fish (0 when the plan has none): the schedule's earliest start. */
export function plannedDay(events: readonly ScenarioEvent[], fish: FishKind): number {
  const days = events.filter((e) => addsSameFish(e, fish)).map((e) => e.day);
  return days.length > 0 ? Math.min(...days) : 0;
}

/** The plan's events without any addition of these fish; other fish added in the same event stay. */
export function withoutFish(events: readonly ScenarioEvent[], fish: FishKind): ScenarioEvent[] {
  return events.flatMap((e): ScenarioEvent[] => {
    if (!addsSameFish(e, fish)) return [e];
    const rest = e.fish.filter((g) => !sameKind(g, fish));
    return rest.length > 0 ? [{ ...e, fish: rest }] : [];
  });
}

const byDay = (a: ScenarioEvent, b: ScenarioEvent) => a.day - b.day;

/** Events sorted by day (stable, so same-day events keep the keeper's order). */
export function sortEvents(events: readonly ScenarioEvent[]): ScenarioEvent[] {
  return [...events].sort(byDay);
}

/**
 * The plan's events with its additions of the schedule's fish replaced by the schedule's
 * batches on their days (advice "apply this schedule"); every other event and every other
 * fish stays. Null when a batch would go in before the first planned addition of those fish:
 * applying advice never moves an event earlier than the keeper planned it.
 */
export function applySchedule(events: readonly ScenarioEvent[], schedule: readonly ScenarioEvent[]): ScenarioEvent[] | null {
  const batches = schedule.filter((e): e is AddFish => e.type === 'add-fish');
  if (batches.length === 0 || batches[0].fish.length === 0) return null;
  const fish = batches[0].fish[0];
  const earliest = plannedDay(events, fish);
  if (batches.some((b) => !b.fish.every((g) => sameKind(g, fish)) || b.day < earliest)) return null;
  return sortEvents([...withoutFish(events, fish), ...batches]);
}
