/**
 * What a tank's biofilter settles at for a given stocking: the engine's mature steady state
 * (steady-state.ts) for the scenario's fish and feeding — or for an explicit load — read
 * without integrating anything. For advice that needs a target capacity ("the biofilter the
 * restocked tank would have") and for the app's capacity figures.
 */
import type { Scenario } from './scenario';
import { createForecastSession, type ForecastOptions, type ForecastReading } from './forecast';

export interface SteadyCapacityOptions {
  /** TAN the populations carry, mg N/day; default: the scenario's starting fish and feeding. */
  loadMgNPerDay?: number;
  parameters?: ForecastOptions['parameters'];
  feedingMultiplier?: number;
}

/**
 * Steady-state water and capacities (at the tank's temperature, mg N/day) for the starting
 * stocking of `scenario`; its start, day-0 water and events are ignored. A load the zones
 * cannot carry throws the engine's ScenarioError (field `fish` or `start.loadMgNPerDay`).
 */
export function steadyStateCapacity(scenario: Scenario, options: SteadyCapacityOptions = {}): ForecastReading {
  const settled: Scenario = {
    ...scenario,
    start: { kind: 'mature', loadMgNPerDay: options.loadMgNPerDay },
    initialWater: {},
    events: [],
  };
  const session = createForecastSession(settled, { horizonDays: 1, parameters: options.parameters, feedingMultiplier: options.feedingMultiplier });
  return session.reading();
}
