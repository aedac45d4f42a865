/**
 * Small pure edits of a parsed scenario that the advisors make: extra events, a different
 * start (scaled feeding is the engine's `feedingMultiplier` option). Inputs are never
 * mutated; the result is a new object sharing unchanged parts.
 */
import type { Scenario, ScenarioEvent, Start } from '../scenario';

/** The scenario with `events` appended to its timeline. */
export function withEvents(scenario: Scenario, events: readonly ScenarioEvent[]): Scenario {
  return events.length === 0 ? scenario : { ...scenario, events: [...scenario.events, ...events] };
}

/** The scenario with a different start. */
export function withStart(scenario: Scenario, start: Start): Scenario {
  return { ...scenario, start };
}

/** The scenario without events after `horizonDays` (the engine refuses events past its horizon). */
export function truncateEvents(scenario: Scenario, horizonDays: number): Scenario {
  if (scenario.events.every((e) => e.day <= horizonDays)) return scenario;
  return { ...scenario, events: scenario.events.filter((e) => e.day <= horizonDays) };
}
