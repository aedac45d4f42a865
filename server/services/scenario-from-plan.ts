import type { Livestock } from '../entities/livestock.js';
import type { Plan } from '../entities/plan.js';
import type { Tank } from '../entities/tank.js';
import { parseScenario, ScenarioError, type Scenario } from '../../shared/schemas/scenario.js';
import { tankScenario } from '../../shared/tank-scenario.js';
import { presentLivestock } from '../presenters/tank.js';

/**
 * A stored plan on its stored tank as an engine scenario, built by the plans' own rule
 * (shared/tank-scenario.ts), so lessons, share links and alerts forecast what the plan editor
 * forecasts. Throws ScenarioError when the engine cannot take it (e.g. a custom fish without
 * a length).
 */
export function scenarioFromPlan(tank: Tank, livestock: Livestock[], plan: Plan): Scenario {
  const { scenario } = tankScenario(
    {
      volumeL: tank.volumeL,
      temperatureC: tank.temperatureC,
      ph: tank.ph,
      khDkh: tank.khDkh,
      tapWater: { tanMgN: tank.tapTanMgN, no2MgN: tank.tapNo2MgN, no3MgN: tank.tapNo3MgN },
      setup: tank.setup ?? {},
      livestock: livestock.map(presentLivestock),
      readings: [],
    },
    { name: plan.name, events: plan.events },
  );
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
