import type { DataSource } from 'typeorm';
import { forecastSentences } from '../../shared/forecast-view.js';
import { startLine, startWarningLines } from '../../shared/start-words.js';
import type { FitBand, ForecastView, PlanForecastResponse } from '../../shared/schemas/plan.js';
import { parseScenario, ScenarioError, type Scenario, type ScenarioEvent, type Start } from '../../simulation/scenario.js';
import { tankScenario, type StartReason, type StartState } from '../../shared/tank-scenario.js';
import { DOSING_CAUTIONS, DOSING_WITH_FISH_CAUTIONS, ESTIMATE_CAUTIONS, REHOMING_CAUTIONS, WATER_CHANGE_CAUTIONS } from '../../simulation/advice/cautions.js';
import { dosesWithFish } from '../../shared/fish-on-day.js';
import { validationFailed } from '../errors.js';
import { FORECAST_BAND_MEMBERS } from '../workers/engine-tasks.js';
import { runEngine, type EngineCaller } from './engine-runs.js';
import { ENGINE_VERSION } from './engine-version.js';
import { inputHash, readCache, writeCache } from './forecast-cache.js';
import { scenarioTankOf, type OwnPlan } from './plans.js';

interface StoredForecast {
  forecast: ForecastView;
  explanation: string[];
  fitBand: FitBand | null;
}

export interface PlanScenario {
  scenario: Scenario;
  startReason: StartReason;
  startState: StartState;
  /** with an applied fit: the start the tank would have without it (the band is compared with it) */
  compareStart: Start | null;
}

/**
 * The parsed scenario of a saved plan on its tank, starting from the tank's evidence at the
 * plan's start date (shared/tank-start.ts); a scenario the engine refuses → 400 with its fields.
 */
export async function planScenario(ds: DataSource, own: OwnPlan, events: readonly ScenarioEvent[] = own.plan.events): Promise<PlanScenario> {
  try {
    return await planScenarioOrThrow(ds, own, events);
  } catch (e) {
    if (e instanceof ScenarioError) throw validationFailed(e.fields);
    throw e;
  }
}

/** The same, throwing the engine's ScenarioError (its message names the fields) for callers that log it. */
export async function planScenarioOrThrow(ds: DataSource, own: OwnPlan, events: readonly ScenarioEvent[] = own.plan.events): Promise<PlanScenario> {
  const tank = await scenarioTankOf(ds, own.tank, own.plan.startDate);
  const plan = { name: own.plan.name, events };
  const built = tankScenario(tank, plan, { startDate: own.plan.startDate });
  const compareStart = built.startReason === 'fitted' ? tankScenario({ ...tank, fit: null }, plan, { startDate: own.plan.startDate }).start : null;
  return { scenario: parseScenario(built.scenario), startReason: built.startReason, startState: built.startState, compareStart };
}

/**
 * Cautions for a plan: always the estimate ones; dosing (and dosing with fish present, when a
 * dose falls on a day the tank holds `fishAtStart` or more), rehoming and water changes when it has them.
 */
export function planCautions(events: readonly ScenarioEvent[], fishAtStart = 0): string[] {
  const has = (types: ScenarioEvent['type'][]) => events.some((e) => types.includes(e.type));
  return [
    ...ESTIMATE_CAUTIONS,
    ...(has(['ammonia-dose']) ? DOSING_CAUTIONS : []),
    ...(dosesWithFish(fishAtStart, events) ? DOSING_WITH_FISH_CAUTIONS : []),
    ...(events.some((e) => e.type === 'remove-fish' || (e.type === 'move-fish' && e.direction === 'out')) ? REHOMING_CAUTIONS : []),
    ...(has(['water-change']) ? WATER_CHANGE_CAUTIONS : []),
  ];
}

/**
 * Forecasts being computed in this process, by input hash: identical requests that arrive while
 * the first is still on the engine pool wait for it instead of queueing the same work again.
 * Losing it (a restart, another process) only costs a recomputation, so it keeps no state that
 * scaling out would break.
 */
const inFlight = new Map<string, Promise<{ stored: StoredForecast; computedAt: Date }>>();

/** A signal that never fires: a shared run is not the first client's to cancel. */
const NEVER = new AbortController().signal;

function computeOnce(ds: DataSource, hash: string, scenario: Scenario, compareStart: Start | null, caller?: EngineCaller): Promise<{ stored: StoredForecast; computedAt: Date }> {
  const running = inFlight.get(hash);
  if (running) return running;
  // The run counts against the first caller's slots but finishes if that client goes away: a
  // later identical request may share it, and its result is cached for the next one.
  const shared = caller ? { claim: caller.claim, signal: NEVER } : undefined;
  const job = (async () => {
    const { value, ms } = await runEngine<StoredForecast>({ kind: 'forecast', scenario, band: true, ...(compareStart ? { compareStart } : {}) }, shared);
    return { stored: value, computedAt: await writeCache(ds, hash, value, ms) };
  })().finally(() => inFlight.delete(hash));
  inFlight.set(hash, job);
  return job;
}

/**
 * The saved plan's forecast with its uncertainty band, from the cache when the same inputs ran
 * before (the plan's name is not an input), else from the engine pool (once per input at a time).
 */
export async function forecastPlan(ds: DataSource, own: OwnPlan, caller?: EngineCaller): Promise<PlanForecastResponse> {
  const { scenario, startReason, startState, compareStart } = await planScenario(ds, own);
  const hash = inputHash('plan-forecast', { scenario: { ...scenario, name: undefined }, bandMembers: FORECAST_BAND_MEMBERS, compareStart });
  const hit = await readCache<StoredForecast>(ds, hash);
  let stored: StoredForecast;
  let computedAt: Date;
  if (hit) {
    stored = hit.result;
    computedAt = hit.createdAt;
  } else {
    ({ stored, computedAt } = await computeOnce(ds, hash, scenario, compareStart, caller));
  }
  return {
    planId: own.plan.id,
    cached: Boolean(hit),
    inputHash: hash,
    engineVersion: ENGINE_VERSION,
    startReason,
    startState,
    fitBand: stored.fitBand,
    computedAt: computedAt.toISOString(),
    forecast: stored.forecast,
    // Words as N: the screens word the start again in the keeper's own basis from startState.
    explanation: [startLine(startState, 'N'), ...startWarningLines(startState, 'N'), ...forecastSentences(stored.forecast), ...stored.explanation],
    cautions: planCautions(own.plan.events, scenario.fish.reduce((n, f) => n + f.count, 0)),
  };
}
