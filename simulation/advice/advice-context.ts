/**
 * Settings every advisor shares, resolved once: the tank's limits, the forecast options the
 * judge uses, and the ensemble spec.
 */
import type { Scenario } from '../scenario';
import type { ForecastOptions } from '../forecast';
import type { ParameterOverrides } from '../parameters';
import { DEFAULT_SEED, MIN_BAND_MEMBERS, type EnsembleSpec } from './ensemble';
import { tankLimits, type AppliedLimit, type LimitSettings } from './tank-limits';

/** Output spacing advice judges on: twice a day catches peaks a daily test could see (common practice: test daily during changes). */
export const ADVICE_STEP_DAYS = 0.5;
/**
 * Relative solver tolerance for advice: 1e-4 moves peaks by < 0.1 % here, far under a kit step
 * (measured on 40 platies added to bench/advice.ts's 200 L tank: peak TAN 2e-6, peak
 * nitrite 7e-6 relative against rtol 1e-10), and steps stay stability-limited.
 */
export const ADVICE_RELATIVE_TOLERANCE = 1e-4;

export interface AdviceSettings {
  limits?: LimitSettings;
  /** Ensemble size (≥ 64) and seed. */
  members?: number;
  seed?: number;
  /** Values calibration fixed for this tank. */
  parameters?: ParameterOverrides;
  /** Members kept in the bounding set the search judges on (default 2). */
  boundingSize?: number;
}

export interface AdviceContext {
  limits: AppliedLimit[];
  options: ForecastOptions;
  ensemble: EnsembleSpec;
  seed: number;
  members: number;
  boundingSize?: number;
}

export function adviceContext(scenario: Scenario, horizonDays: number, settings: AdviceSettings = {}): AdviceContext {
  const members = settings.members ?? MIN_BAND_MEMBERS;
  if (!(Number.isInteger(members) && members >= MIN_BAND_MEMBERS)) {
    throw new RangeError(`the band needs at least ${MIN_BAND_MEMBERS} members, got ${members}`);
  }
  const seed = settings.seed ?? DEFAULT_SEED;
  const tank = scenario.tank;
  return {
    limits: tankLimits({ ph: tank.ph, temperatureC: tank.temperatureC, chlorideMgL: tank.chlorideMgL }, settings.limits),
    options: {
      horizonDays,
      stepDays: ADVICE_STEP_DAYS,
      tolerances: { relative: ADVICE_RELATIVE_TOLERANCE },
      parameters: settings.parameters,
    },
    ensemble: { members, seed, fixed: settings.parameters },
    seed,
    members,
    boundingSize: settings.boundingSize,
  };
}
