/** The forecast's options, their defaults, and the checks made before any solving. */
import { ScenarioError, type Scenario } from '../scenario';
import type { LimitChoices } from '../limits';
import { resolveParameters, type ParameterOverrides, type Parameters } from '../parameters';
import { aoClockIndex, aoIndex, I_ACID, I_PLANT, noClockIndex, noIndex, type Model } from '../model';
import { createOdexIntegrator, type SamplingMode, type SegmentIntegrator } from '../solver';
import type { ForecastState } from './state';

export interface ForecastOptions {
  /** Output interval, days (default 1). */
  stepDays?: number;
  /** Forecast length, days (default: scenario.horizonDays, else 60). */
  horizonDays?: number;
  /** Parameter overrides by key (see parameters.ts). */
  parameters?: ParameterOverrides;
  /** Fixed limits replacing the defaults (which follow the water's pH and temperature). */
  limits?: Partial<{ freeNh3MgNH3: number; tanChronicMgN: number; tanAcuteMgN: number; no2MgN: number }>;
  /** Which default limits to use. */
  limitChoices?: LimitChoices;
  /** Solver tolerances (see solver.ts for the defaults and why). */
  tolerances?: { relative?: number; concentration?: number; capacityPerLitre?: number };
  /**
   * A sample that falls exactly on an event instant shows the water just 'after' the events
   * (default) or just 'before' them — 'before' reads like a test taken before the day's dose.
   */
  eventSampling?: 'after' | 'before';
  /** How odex takes samples (see solver.ts); default 'restart'. */
  sampling?: SamplingMode;
  /** Step limit per segment. */
  maxSteps?: number;
  /**
   * Multiplies every feeding of the scenario (the starting one and feeding events): food
   * offered per day, whether given in grams or as a share of body mass. Default 1.
   */
  feedingMultiplier?: number;
  /** Continue from a saved state (see createForecastSession); the result starts at its day. */
  from?: ForecastState;
  /** Integrator factory (tests and the benchmark use a mathjs reference); default odex. */
  integrator?: (n: number, tolerances: { relative: number; absolute: number[] }) => SegmentIntegrator;
}

export interface ResolvedOptions {
  feedingMultiplier: number;
  horizon: number;
  step: number;
  params: Parameters;
  relative: number;
  concentration: number;
  capacityPerLitre: number;
}

const DEFAULT_HORIZON = 60;
const MAX_SAMPLES = 100_000;

/** A refused option (or input the engine cannot run), as the scenario's field error. */
export function optionError(field: string, message: string): ScenarioError {
  return new ScenarioError({ [field]: message });
}

export function resolveOptions(scenario: Scenario, options: ForecastOptions): ResolvedOptions {
  const horizon = options.horizonDays ?? scenario.horizonDays ?? DEFAULT_HORIZON;
  const step = options.stepDays ?? 1;
  if (!(Number.isFinite(horizon) && horizon > 0 && horizon <= 3650)) throw optionError('options.horizonDays', 'Horizon must be above 0 and at most 3650 days.');
  if (!(Number.isFinite(step) && step > 0)) throw optionError('options.stepDays', 'Step must be above 0 days.');
  if (horizon / step > MAX_SAMPLES) throw optionError('options.stepDays', `At most ${MAX_SAMPLES} samples; use a longer step.`);
  let params: Parameters;
  try {
    params = resolveParameters(options.parameters);
  } catch (e) {
    throw optionError('options.parameters', (e as Error).message);
  }
  const feedingMultiplier = options.feedingMultiplier ?? 1;
  if (!(Number.isFinite(feedingMultiplier) && feedingMultiplier >= 0)) throw optionError('options.feedingMultiplier', 'Feeding multiplier must be 0 or more.');
  const tol = options.tolerances ?? {};
  return {
    feedingMultiplier,
    horizon,
    step,
    params,
    relative: tol.relative ?? 1e-6,
    concentration: tol.concentration ?? 1e-7,
    capacityPerLitre: tol.capacityPerLitre ?? 1e-9,
  };
}

const CLOCK_TOLERANCE_DAYS = 1e-3;
/** Adaptation is a share (0–1) that changes over weeks. */
const ACID_TOLERANCE = 1e-6;

/**
 * The run's integrator with its tolerances: one relative tolerance, and absolute ones per
 * component (concentrations per litre; the plant-uptake total and capacities scale with V).
 */
export function createIntegrator(options: ForecastOptions, opt: ResolvedOptions, model: Model): SegmentIntegrator {
  const n = model.n;
  const V = model.volumeL;
  const absolute = new Array<number>(n).fill(opt.concentration);
  absolute[I_PLANT] = opt.concentration * V;
  for (let z = 0; z < model.zones.length; z++) {
    absolute[aoIndex(z)] = opt.capacityPerLitre * V;
    absolute[noIndex(z)] = opt.capacityPerLitre * V;
    // Clocks in days: a minute's accuracy is plenty for a loss that switches over days.
    absolute[aoClockIndex(z)] = CLOCK_TOLERANCE_DAYS;
    absolute[noClockIndex(z)] = CLOCK_TOLERANCE_DAYS;
  }
  absolute[I_ACID] = ACID_TOLERANCE;
  const tolerances = { relative: opt.relative, absolute };
  return options.integrator ? options.integrator(n, tolerances) : createOdexIntegrator(n, { tolerances, maxSteps: options.maxSteps, sampling: options.sampling });
}
