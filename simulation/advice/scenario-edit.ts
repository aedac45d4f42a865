/**
 * Small pure edits of a parsed scenario that the advisors make: extra events, scaled feeding,
 * a different start. Inputs are never mutated; the result is a new object sharing unchanged
 * parts.
 */
import type { FeedingInput, Scenario, ScenarioEvent, Start } from '../../shared/schemas/scenario';
import { DEFAULT_PARAMETERS } from '../parameters';

/** The scenario with `events` appended to its timeline. */
export function withEvents(scenario: Scenario, events: readonly ScenarioEvent[]): Scenario {
  return events.length === 0 ? scenario : { ...scenario, events: [...scenario.events, ...events] };
}

/** The scenario with a different start. */
export function withStart(scenario: Scenario, start: Start): Scenario {
  return { ...scenario, start };
}

/** Feeding multiplied by `m`: grams per day, or the body-mass percentage (default from the parameter table). */
export function scaleFeedingInput(feeding: FeedingInput, m: number): FeedingInput {
  if (feeding.mode === 'grams') return { ...feeding, gramsPerDay: feeding.gramsPerDay * m };
  return { ...feeding, percentPerDay: (feeding.percentPerDay ?? DEFAULT_PARAMETERS.feedPercent) * m };
}

/** Every feeding of the scenario (the starting one and feeding events) multiplied by `m`. */
export function scaleFeeding(scenario: Scenario, m: number): Scenario {
  if (m === 1) return scenario;
  return {
    ...scenario,
    feeding: scaleFeedingInput(scenario.feeding, m),
    events: scenario.events.map((e) => (e.type === 'feeding' ? { ...e, feeding: scaleFeedingInput(e.feeding, m) } : e)),
  };
}

/** The scenario without events after `horizonDays` (the engine refuses events past its horizon). */
export function truncateEvents(scenario: Scenario, horizonDays: number): Scenario {
  if (scenario.events.every((e) => e.day <= horizonDays)) return scenario;
  return { ...scenario, events: scenario.events.filter((e) => e.day <= horizonDays) };
}
