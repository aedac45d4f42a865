import type { Livestock } from '../entities/livestock.js';
import type { Plan } from '../entities/plan.js';
import type { Tank } from '../entities/tank.js';
import { parseScenario, ScenarioError, type Scenario } from '../../simulation/scenario.js';
import { tankScenario } from '../../shared/tank-scenario.js';
import { toScenarioTank } from './plans.js';

/**
 * A stored plan on its stored tank as an engine scenario, built by the plans' own rule
 * (shared/tank-scenario.ts), so lessons, share links and alerts forecast what the plan editor
 * forecasts. Throws ScenarioError when the engine cannot take it (e.g. a custom fish without
 * a length).
 */
export function scenarioFromPlan(tank: Tank, livestock: Livestock[], plan: Plan): Scenario {
  // The keeper's account of the tank at the plan's start; tests and fits are not read here (callers hold no readings).
  const { scenario } = tankScenario(toScenarioTank(tank, livestock, false), { name: plan.name, events: plan.events }, { startDate: plan.startDate, evidence: 'description' });
  return parseScenario(scenario);
}

/** The scenario, or null when the engine cannot take this plan. */
export function scenarioFromPlanOrNull(tank: Tank, livestock: Livestock[], plan: Plan): Scenario | null {
  try {
    return scenarioFromPlan(tank, livestock, plan);
  } catch (err) {
    if (err instanceof ScenarioError) return null;
    throw err;
  }
}
