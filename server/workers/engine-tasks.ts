/**
 * The engine work the API hands to worker threads (engine-pool.ts). Plain data in, plain data
 * out: errors cannot cross a thread boundary with their class, so refusals come back as
 * `{ ok: false }` results the route turns into 400s.
 */
import { ScenarioError, parseScenario } from '../../simulation/scenario.js';
import { forecastView } from '../../shared/forecast-view.js';
import { forecastParsed } from '../../simulation/forecast/index.js';
import {
  calibrate,
  capacityTestProtocol,
  estimateCapacityFromTest,
  fastestSafeSchedule,
  rescueWaterChanges,
  runEnsemble,
  supplementaryDosing,
  bandExplanation,
  type AdditionRequest,
  type CalibrationRequest,
  type RemovalRequest,
  type RescueRequest,
} from '../../simulation/advice/index.js';
import { MIN_BAND_MEMBERS, DEFAULT_SEED } from '../../simulation/advice/ensemble.js';
import { describeBandChange, meanBandWidth } from '../../simulation/advice/calibration.js';
import { ESTIMATE_CAUTIONS } from '../../simulation/advice/cautions.js';
import type { Scenario, ScenarioInput, Start } from '../../simulation/scenario.js';
import type { LimitSettings } from '../../simulation/advice/tank-limits.js';
import { overEnsembleBudgetFields } from '../../simulation/work-budget.js';
import type { CapacityTestRequest } from '../../simulation/advice/schemas.js';
import type { AmmoniaSolution } from '../../simulation/dosing.js';

export type EngineTask =
  /** `compareStart`: also the band with this start (the tank without its fit), to say how much the fit narrowed it. */
  | { kind: 'forecast'; scenario: ScenarioInput; band: boolean; compareStart?: Start }
  /** The central forecast's TAN and nitrite by day (the reading-alert job compares a test with it). */
  | { kind: 'forecast-series'; scenario: ScenarioInput; horizonDays: number }
  | { kind: 'addition'; request: Omit<AdditionRequest, 'scenario'> & { scenario: ScenarioInput } }
  | { kind: 'removal'; request: Omit<RemovalRequest, 'scenario'> & { scenario: ScenarioInput } }
  | { kind: 'rescue'; request: Omit<RescueRequest, 'scenario'> & { scenario: ScenarioInput } }
  | { kind: 'ensemble'; scenario: ScenarioInput; members?: number; seed?: number; horizonDays?: number }
  | { kind: 'calibration'; request: Omit<CalibrationRequest, 'scenario'> & { scenario: ScenarioInput } }
  | {
      kind: 'capacity-test';
      scenario: ScenarioInput;
      solution?: AmmoniaSolution;
      limits?: LimitSettings;
      test?: Omit<CapacityTestRequest, 'scenario'>;
    };

export type EngineResult =
  | { ok: true; value: unknown; ms: number }
  | { ok: false; reason: 'scenario'; message: string; fields: Record<string, string> }
  | { ok: false; reason: 'refused'; message: string }
  | { ok: false; reason: 'unsolvable'; message: string };

/** Band members for a saved plan's forecast (the advice layer's minimum: ensemble.ts). */
export const FORECAST_BAND_MEMBERS = MIN_BAND_MEMBERS;

/**
 * Refuses, before any run, advice whose ensembles (about `bands` of `members` forecasts over
 * `horizonDays`) exceed the engine's work budget, naming `field`.
 */
function withinBudget(scenario: Scenario, horizonDays: number, members: number, bands: number, field: string): void {
  const over = overEnsembleBudgetFields(scenario, horizonDays, members * bands, field);
  if (over) throw new ScenarioError(over);
}

function run(task: EngineTask): unknown {
  switch (task.kind) {
    case 'forecast': {
      const scenario = parseScenario(task.scenario);
      const central = forecastParsed(scenario);
      if (!task.band) return { forecast: forecastView(central), explanation: [] };
      const horizon = { horizonDays: central.series.days.at(-1) };
      const ensemble = runEnsemble(scenario, { members: FORECAST_BAND_MEMBERS }, horizon);
      // The same draws on the start the tank would have without its fit: how much the fit narrowed the band.
      const without = task.compareStart ? runEnsemble(parseScenario({ ...task.scenario, start: task.compareStart }), { members: FORECAST_BAND_MEMBERS }, horizon).band : null;
      const fitBand = without
        ? {
            tanMgN: { prior: meanBandWidth(without.tanMgN), calibrated: meanBandWidth(ensemble.band.tanMgN) },
            no2MgN: { prior: meanBandWidth(without.no2MgN), calibrated: meanBandWidth(ensemble.band.no2MgN) },
          }
        : null;
      return {
        forecast: forecastView(central, ensemble.band, ensemble.forecasts.length),
        explanation: [bandExplanation(ensemble.forecasts.length), ...(fitBand ? [describeBandChange(fitBand.tanMgN, fitBand.no2MgN)] : [])],
        fitBand,
      };
    }
    case 'forecast-series': {
      const { series } = forecastParsed(parseScenario(task.scenario), { horizonDays: task.horizonDays });
      return { days: series.days, tanMgN: series.tanMgN, no2MgN: series.no2MgN };
    }
    // Each advice judges a plan with and without the change on `members` draws: two bands.
    case 'addition': {
      const scenario = parseScenario(task.request.scenario);
      withinBudget(scenario, scenario.horizonDays ?? 365, task.request.settings?.members ?? MIN_BAND_MEMBERS, 2, 'settings.members');
      return fastestSafeSchedule({ ...task.request, scenario });
    }
    case 'removal': {
      const scenario = parseScenario(task.request.scenario);
      const horizon = task.request.restockDay + (task.request.daysAfterRestock ?? 30);
      withinBudget(scenario, horizon, task.request.settings?.members ?? MIN_BAND_MEMBERS, 2, 'settings.members');
      return supplementaryDosing({ ...task.request, scenario });
    }
    case 'rescue': {
      const scenario = parseScenario(task.request.scenario);
      withinBudget(scenario, task.request.horizonDays ?? scenario.horizonDays ?? 60, task.request.settings?.members ?? MIN_BAND_MEMBERS, 2, 'settings.members');
      return rescueWaterChanges({ ...task.request, scenario });
    }
    case 'ensemble': {
      const scenario = parseScenario(task.scenario);
      const seed = task.seed ?? DEFAULT_SEED;
      const members = task.members ?? MIN_BAND_MEMBERS;
      // Members × (entries + days) within the work budget, refused naming `members` before any run.
      const over = overEnsembleBudgetFields(scenario, task.horizonDays ?? scenario.horizonDays ?? 60, members, 'members');
      if (over) throw new ScenarioError(over);
      const result = runEnsemble(scenario, { members, seed }, task.horizonDays ? { horizonDays: task.horizonDays } : {});
      return {
        band: result.band,
        members: result.forecasts.length,
        failed: result.failed.length,
        explanation: [bandExplanation(result.forecasts.length)],
        cautions: [...ESTIMATE_CAUTIONS],
      };
    }
    case 'calibration': {
      const scenario = parseScenario(task.request.scenario);
      const lastDay = Math.max(0, ...task.request.readings.map((r) => r.day));
      // The prior and the calibrated band, at half-day samples (two units a day).
      withinBudget(scenario, 2 * (lastDay + (task.request.forecastDays ?? 30)), task.request.members ?? MIN_BAND_MEMBERS, 2, 'members');
      return calibrate({ ...task.request, scenario });
    }
    case 'capacity-test': {
      const scenario = parseScenario(task.scenario);
      const protocol = capacityTestProtocol(scenario, task.solution, task.limits);
      const estimate = task.test ? estimateCapacityFromTest(scenario, task.test.doseMgNPerL, task.test.readings, task.test.kit) : null;
      return { protocol: { ...protocol, readingHours: [...protocol.readingHours] }, estimate };
    }
  }
}

/** Runs one task; the worker's exported function (also callable in-process). */
export function runEngineTask(task: EngineTask): EngineResult {
  const t0 = performance.now();
  try {
    const value = run(task);
    return { ok: true, value, ms: performance.now() - t0 };
  } catch (e) {
    if (e instanceof ScenarioError) return { ok: false, reason: 'scenario', message: e.message, fields: e.fields };
    // The engine and advice layer refuse impossible requests with RangeError (e.g. no possible
    // day for a batch) and loads the zones cannot carry with LoadTooHighError: the keeper's input.
    if (e instanceof RangeError || (e instanceof Error && e.name === 'LoadTooHighError')) {
      return { ok: false, reason: 'refused', message: e.message };
    }
    // The solver gave up (step limit): extreme but valid input. Said plainly, never a 500.
    if (e instanceof Error && e.name === 'SolverError') return { ok: false, reason: 'unsolvable', message: e.message };
    throw e;
  }
}
