/**
 * forecast(scenario, options): the nitrogen-cycle forecast of one tank over a timeline of
 * events (MODEL.md §7, §8). Pure: no I/O. Invalid input throws ScenarioError (with `.fields`)
 * before any solving; solver failure throws SolverError.
 *
 * Resumable runs: `createForecastSession` integrates forward on demand and hands out a
 * `ForecastState` at any day (the water and populations just before that day's events);
 * `forecastParsed(scenario, { from: state })` continues from it. The continued run applies
 * every event at or after the state's day and reports samples from that day on, so a
 * forecast of "the same plan plus one more event on day d" costs only the days after d. The
 * state remembers which scenario prefix (tank, start, fish, feeding, events before d,
 * parameters, feeding multiplier) produced it, and a mismatch is refused.
 *
 * This file wires one run together; each concept it uses lives beside it.
 */
import { createModel } from '../model';
import { resolveZone } from '../presets';
import { parseScenario, ScenarioError, type Scenario, type ScenarioInput } from '../scenario';
import type { IntegrationStats } from '../solver';
import { buildTimeline } from '../timeline';
import { overBudgetFields } from '../work-budget';
import { closeLedger, openLedger } from './balance';
import { doseFlowOf, feedFlowsOf, segmentConditions, tankChemistry, type RunConditions } from './conditions';
import type { EventScope } from './events';
import { initialState } from './initial-state';
import { spareCapacity } from './spare-capacity';
import { createIntegrator, optionError, resolveOptions, type ForecastOptions } from './options';
import { noEventPeaks } from './peaks';
import { readingOf, type ForecastReading } from './reading';
import { createRecorder, createSeries, sampleTimes, type ForecastSeries } from './series';
import { checkSavedState, createSnapshotter, restoredEffects, type ForecastState } from './state';
import { createStepper } from './stepping';
import { summarize, type ForecastSummary } from './summary';

/** A forecast integrated forward on demand. */
export interface ForecastSession {
  /** Current day (the state is just before this day's events). */
  readonly day: number;
  /** Samples recorded so far (all sample times before `day`). */
  readonly samples: number;
  /** Full-length series buffers; entries at index ≥ `samples` are not yet filled. */
  readonly series: ForecastSeries;
  /** Integrates to `day` (≥ the current day, ≤ the horizon); samples before it are then filled. */
  runTo(day: number): void;
  /** Integrates to `day` like runTo and returns the state there. */
  advanceTo(day: number): ForecastState;
  /** The water and capacities at the current day. */
  reading(): ForecastReading;
  /** Runs to the horizon and returns the forecast (the session cannot be used afterwards). */
  finish(): Forecast;
}

export interface Forecast {
  series: ForecastSeries;
  summary: ForecastSummary;
  stats: IntegrationStats & { segments: number };
}

/** Runs a forecast; `scenario` may be raw input (validated here) or already parsed. */
export function forecast(scenario: ScenarioInput | Scenario, options: ForecastOptions = {}): Forecast {
  return forecastParsed(parseScenario(scenario), options);
}

/** Forecast of an already-parsed scenario (skips schema parsing; for batch callers). */
export function forecastParsed(scenario: Scenario, options: ForecastOptions = {}): Forecast {
  return createForecastSession(scenario, options).finish();
}

/** Starts a forecast that integrates forward on demand (see ForecastSession). */
export function createForecastSession(scenario: Scenario, options: ForecastOptions = {}): ForecastSession {
  const opt = resolveOptions(scenario, options);
  const p = opt.params;
  const fm = opt.feedingMultiplier;
  const tank = scenario.tank;
  const V = tank.volumeL;
  const zones = tank.zones.map(resolveZone);
  const model = createModel(zones, V, p);
  const n = model.n;
  // Counted before anything is built: a schedule past the budget is refused, not expanded.
  const overBudget = overBudgetFields(scenario, opt.horizon);
  if (overBudget) throw new ScenarioError(overBudget);
  const timeline = buildTimeline(scenario, opt.horizon, p);
  const origin = { scenario, parameters: options.parameters, feedingMultiplier: fm };
  const from = options.from;
  const t0 = from ? from.day : 0;
  if (from) checkSavedState(from, origin, n, opt.horizon);

  // --- conditions that events change -------------------------------------------------
  const chemistry = tankChemistry(tank);
  const effects = from ? restoredEffects(from, scenario) : { medications: new Map<number, number>(), aerationLosses: new Map<number, number>(), doseFlows: new Map<number, number>() };
  const start = { temperatureC: from ? from.temperatureC : tank.temperatureC, feeding: from ? from.feeding : scenario.feeding, fishMassG: from ? from.fishMassG : timeline.initialFishMassG };
  const conditions: RunConditions = { ...start, ...effects, feedFlows: feedFlowsOf(start, p, fm) };
  if (conditions.feedFlows.toOrg < -1e-12) throw optionError('options.parameters', 'Feed parameters give more N out of the food than it holds.');
  model.setConditions(segmentConditions(tank, chemistry, conditions, p));

  // --- initial state, output buffers, bookkeeping ----------------------------------------
  const y = new Array<number>(n).fill(0);
  if (from) {
    for (let i = 0; i < n; i++) y[i] = from.y[i];
  } else {
    initialState(scenario, model, zones, conditions.feedFlows, chemistry.kh0, y, p);
  }
  const spare = spareCapacity(model, y, conditions.feedFlows.excretedTan + conditions.feedFlows.toOrg);
  const times = sampleTimes(opt.horizon, opt.step, t0);
  const series = createSeries(times, zones.map((z) => z.id), chemistry.phModel === 'carbonate');
  const record = createRecorder(series, model, () => conditions.temperatureC, () => doseFlowOf(conditions));
  const ledger = openLedger(model, y);
  const eventPeaks = noEventPeaks();
  const scope: EventScope = { tank, chemistry, zones, model, params: p, feedingMultiplier: fm, y, conditions, ledger };

  // --- the integrator ------------------------------------------------------------------
  const integrator = createIntegrator(options, opt, model);
  if (from && from.stepHint !== null && integrator.stepSize !== undefined) integrator.stepSize = from.stepHint;
  const stepper = createStepper({
    scope,
    model,
    integrator,
    breakpoints: timeline.breakpoints,
    times,
    record,
    eventPeaks,
    startDay: t0,
    sampleBeforeEvents: options.eventSampling === 'before',
  });
  let finished = false;
  const snapshot = createSnapshotter(origin);
  const alive = () => {
    if (finished) throw new Error('the forecast session has finished');
  };

  return {
    get day() {
      return stepper.day;
    },
    get samples() {
      return stepper.samples;
    },
    series,
    runTo(day: number): void {
      alive();
      const t = stepper.day;
      if (!(day >= t - 1e-9 && day <= opt.horizon + 1e-9)) throw new RangeError(`runTo(${day}): the day must lie between ${t} and the horizon ${opt.horizon}`);
      stepper.advance(day, false);
    },
    advanceTo(day: number): ForecastState {
      this.runTo(day);
      return snapshot(stepper.day, y, conditions, integrator.stepSize ?? null);
    },
    reading: () => readingOf(model, stepper.day, y),
    finish(): Forecast {
      alive();
      stepper.advance(opt.horizon, true);
      finished = true;
      // Samples at the horizon (after any events there).
      stepper.recordRest();
      const balance = closeLedger(ledger, model, y);
      const summary = summarize({ tank, zones, model, series, eventPeaks, ledger, balance, startDay: t0, horizon: opt.horizon, options, spareCapacity: spare });
      return { series, summary, stats: { ...stepper.work } };
    },
  };
}
