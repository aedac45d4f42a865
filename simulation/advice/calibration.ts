/**
 * Calibration to a tank's own test log (issue 4, point 6; MODEL.md §5.2).
 *
 * Unknowns: a factor on the ammonia oxidisers' and on the nitrite oxidisers' capacity at the
 * start of the log (each zone keeps its share), and optionally a growth-speed multiplier on
 * both μmax — fitted in logarithms (they are positive and act multiplicatively) by
 * Levenberg–Marquardt (./least-squares), started from the best point of a coarse grid.
 * Residuals follow the colour-chart error model of ./kit-error (rounding step/√12 plus a
 * relative share; "0" censored). Each parameter vector costs one forecast (remembered, so a
 * vector is never forecast twice); `quality.forecasts` counts them.
 *
 * Bounds: a capacity factor goes no higher than the zones' area ceiling allows (model.ts: a
 * biofilm above its ceiling cannot grow, only decay, so a start above it is no state a tank
 * holds) and no lower than 1e-4 of the prior. The ceiling also keeps the forecasts cheap:
 * capacities far above it made the equations stiff, and one forecast then took ~0.5 s.
 *
 * Quality: RMSE in kit steps, and the reduced χ² of the scaled residuals; the fit is "poor"
 * when the reduced χ² exceeds 4 — readings sit on average more than twice the kit's expected
 * error from the best the model can do (common practice for a χ² misfit flag).
 *
 * Narrower band: the covariance of the log-parameters is s²(JᵀJ)⁻¹ (J the scaled-residual
 * Jacobian at the optimum, s² the reduced χ² floored at 1); an ensemble draws them by Latin
 * hypercube through the normal quantile, with the other model values at their defaults — the
 * fit was made at those values, so letting them vary independently would ignore that.
 */
import type { SpareCapacity } from '../forecast';
import type { Scenario } from '../scenario';
import { createForecastSession, forecastParsed, type Forecast, type ForecastOptions } from '../forecast';
import { DEFAULT_PARAMETERS, type ParameterOverrides } from '../parameters';
import { MOLAR_MASS } from '../units';
import { ESTIMATE_CAUTIONS } from './cautions';
import { bandOf, runEnsemble, DEFAULT_SEED, MIN_BAND_MEMBERS, type EnsembleBand } from './ensemble';
import { DEFAULT_KIT, scaledResidual, type KitSpec } from './kit-error';
import { latinHypercube } from './latin-hypercube';
import { invertSpd, leastSquares, type LeastSquaresStop } from './least-squares';
import { normalQuantile } from './normal-quantile';
import { seededRandom } from './random';
import { withStart } from './scenario-edit';
import { formatValue } from './tank-limits';

export interface Reading {
  /** days from the scenario's day 0 */
  day: number;
  tanMgN?: number;
  no2MgN?: number;
}

export type FitKey = 'ao' | 'no' | 'growth';

export interface CalibrationRequest {
  /** The tank over the period of the log (start = the prior guess of its state at day 0). */
  scenario: Scenario;
  readings: Reading[];
  kits?: { tan?: KitSpec; no2?: KitSpec };
  /** What to fit (default all three; a capacity test fits capacities only). */
  fit?: readonly FitKey[];
  /** Days forecast after the last reading for the band (default 30). */
  forecastDays?: number;
  members?: number;
  seed?: number;
}

export interface CalibrationResult {
  fitted: { aoFactor: number; noFactor: number; growthMultiplier: number };
  /** capacities at the water temperature, mg N/day */
  capacity: {
    startAoMgNPerDay: number;
    startNoMgNPerDay: number;
    presentAoMgNPerDay: number;
    presentNoMgNPerDay: number;
    /** the present ammonia-oxidiser capacity as mg NH3 a day */
    presentAoMgNH3PerDay: number;
    /** per zone at the last reading (the explicit start of a forecast from then on) */
    presentByZone: { zoneId: string; aoMgNPerDay: number; noMgNPerDay: number }[];
  };
  /** log-parameter standard errors, in the order of `fit` */
  standardErrors: Record<FitKey, number | null>;
  quality: {
    rmseKitSteps: number;
    reducedChiSquare: number;
    readings: number;
    verdict: 'good' | 'fair' | 'poor';
    iterations: number;
    /** why the optimiser stopped ('iterations' = it ran out of its budget) */
    stop: LeastSquaresStop;
    /** forecasts run to fit (grid, optimiser, covariance, the best fit), not counting the bands */
    forecasts: number;
  };
  /** scenario with the fitted start (explicit capacities) and growth, ready to forecast */
  calibratedScenario: Scenario;
  calibratedParameters: ParameterOverrides;
  band: { prior: EnsembleBand; calibrated: EnsembleBand; meanWidthTan: { prior: number; calibrated: number }; meanWidthNo2: { prior: number; calibrated: number } };
  explanation: string[];
  cautions: string[];
  /** capacity test only: spare capacity at the tank's own load from the fitted capacities */
  spareCapacity?: SpareCapacity | null;
}

interface Base {
  start: { zoneId: string; ao: number; no: number; aoCeiling: number; noCeiling: number }[];
  water: { tanMgN: number; no2MgN: number; no3MgN: number; orgMgN: number };
}

/** Day-0 capacities and water of the scenario as described (the prior), before any day-0 event. */
function baseState(scenario: Scenario): Base {
  const session = createForecastSession({ ...scenario, events: [] }, { horizonDays: 0.01 });
  const r = session.reading();
  const ceilings = session.finish().summary.final.zones;
  return {
    start: r.zones.map((z, i) => ({ zoneId: z.zoneId, ao: z.aoMgNPerDay, no: z.noMgNPerDay, aoCeiling: ceilings[i].aoCeilingMgNPerDay, noCeiling: ceilings[i].noCeilingMgNPerDay })),
    water: { tanMgN: r.tanMgN, no2MgN: r.no2MgN, no3MgN: r.no3MgN, orgMgN: r.orgMgN },
  };
}

/** The scenario with capacities scaled and the day-0 water fixed to the prior's. */
export function scaledScenario(scenario: Scenario, base: { start: readonly { zoneId: string; ao: number; no: number }[]; water: Base['water'] }, aoFactor: number, noFactor: number): Scenario {
  // A zone without nitrifiers in the prior gets a trace so a factor can act on it.
  const s = withStart(scenario, {
    kind: 'explicit',
    capacities: base.start.map((z) => ({ zoneId: z.zoneId, aoMgNPerDay: z.ao * aoFactor, noMgNPerDay: z.no * noFactor })),
  });
  return { ...s, initialWater: { ...base.water, ...scenario.initialWater } };
}

/** Widest log-factor range searched (the prior ×1e-4 … ×1e4). */
const LOG_FACTOR_SPAN = Math.log(1e4);

/** Largest log factor on a population before a zone holding it would start above its area ceiling (at least the prior's 0). */
function ceilingLogFactor(base: Base, key: 'ao' | 'no'): number {
  let ratio = Infinity;
  for (const z of base.start) {
    const c = key === 'ao' ? z.aoCeiling : z.noCeiling;
    if (z[key] > 0 && c > 0) ratio = Math.min(ratio, c / z[key]);
  }
  return Math.max(0, Math.min(LOG_FACTOR_SPAN, Math.log(ratio)));
}

function growthParameters(g: number): ParameterOverrides {
  return { muMaxAo: DEFAULT_PARAMETERS.muMaxAo * g, muMaxNo: DEFAULT_PARAMETERS.muMaxNo * g };
}

/** Linear interpolation of a sampled series at a day. */
function at(days: readonly number[], values: readonly number[], day: number): number {
  if (day <= days[0]) return values[0];
  const last = days.length - 1;
  if (day >= days[last]) return values[last];
  const step = days[1] - days[0];
  const i = Math.min(Math.floor((day - days[0]) / step), last - 1);
  const w = (day - days[i]) / (days[i + 1] - days[i]);
  return values[i] * (1 - w) + values[i + 1] * w;
}

interface Observation {
  day: number;
  species: 'tan' | 'no2';
  value: number;
  kit: KitSpec;
}

const STEP_DAYS = 1 / 24;

export function calibrate(request: CalibrationRequest): CalibrationResult {
  const { scenario } = request;
  const fit = request.fit ?? (['ao', 'no', 'growth'] as const);
  const kits = { tan: request.kits?.tan ?? DEFAULT_KIT, no2: request.kits?.no2 ?? DEFAULT_KIT };
  const obs: Observation[] = [];
  for (const r of request.readings) {
    if (!(r.day >= 0)) throw new RangeError(`reading day must be ≥ 0, got ${r.day}`);
    if (r.tanMgN !== undefined) obs.push({ day: r.day, species: 'tan', value: r.tanMgN, kit: kits.tan });
    if (r.no2MgN !== undefined) obs.push({ day: r.day, species: 'no2', value: r.no2MgN, kit: kits.no2 });
  }
  // Keeper-facing: the API answers it as the refusal's message.
  if (obs.length < fit.length + 1) {
    throw new RangeError(`Fitting needs at least ${fit.length + 1} ammonia or nitrite results (a test's ammonia and nitrite count apart); there are ${obs.length}. Log a few more tests first.`);
  }
  const lastDay = Math.max(...obs.map((o) => o.day));
  const horizon = Math.max(lastDay, STEP_DAYS * 2);
  const base = baseState(scenario);
  const options: ForecastOptions = { horizonDays: horizon, stepDays: Math.min(STEP_DAYS * 6, horizon / 4), tolerances: { relative: 1e-5 } };

  const unpack = (theta: number[]) => {
    const v = { ao: 1, no: 1, growth: 1 };
    fit.forEach((k, i) => (v[k] = Math.exp(theta[i])));
    return v;
  };
  const run = (theta: number[]): Forecast => {
    const v = unpack(theta);
    return forecastParsed(scaledScenario(scenario, base, v.ao, v.no), { ...options, parameters: growthParameters(v.growth) });
  };
  const residuals = (f: Forecast) =>
    obs.map((o) => scaledResidual(o.kit, o.value, at(f.series.days, o.species === 'tan' ? f.series.tanMgN : f.series.no2MgN, o.day)));

  let forecasts = 0;
  const remembered = new Map<string, number[]>();
  // Scaled residuals of one parameter vector; a vector the engine refuses counts as a very bad fit.
  const residualsAt = (theta: readonly number[]): number[] => {
    const key = theta.join(',');
    let r = remembered.get(key);
    if (!r) {
      forecasts++;
      try {
        r = residuals(run([...theta]));
      } catch {
        r = obs.map(() => 1e3);
      }
      remembered.set(key, r);
    }
    return r;
  };
  const bounds: Record<FitKey, [number, number]> = {
    ao: [-LOG_FACTOR_SPAN, ceilingLogFactor(base, 'ao')],
    no: [-LOG_FACTOR_SPAN, ceilingLogFactor(base, 'no')],
    growth: [Math.log(0.2), Math.log(3)],
  };
  const lower = fit.map((k) => bounds[k][0]);
  const upper = fit.map((k) => bounds[k][1]);
  // Start from the best point of a coarse grid (within the bounds): a cycling tank's readings
  // depend on the timing of exponential growth, and a start far off leaves LM in a local minimum.
  const gridValues: Record<FitKey, number[]> = {
    ao: [-3, -1.5, 0, 1.5, 3],
    no: [-3, -1.5, 0, 1.5, 3],
    growth: [Math.log(0.6), 0, Math.log(1.5)],
  };
  const gridOf = (k: FitKey) => [...new Set(gridValues[k].map((g) => Math.min(Math.max(g, bounds[k][0]), bounds[k][1])))];
  let start = fit.map(() => 0);
  let startSsr = Infinity;
  const visit = (prefix: number[]) => {
    if (prefix.length === fit.length) {
      const ssr = residualsAt(prefix).reduce((s, x) => s + x * x, 0);
      if (ssr < startSsr) {
        startSsr = ssr;
        start = prefix;
      }
      return;
    }
    for (const g of gridOf(fit[prefix.length])) visit([...prefix, g]);
  };
  visit([]);
  const lm = leastSquares(residualsAt, start, { lower, upper, difference: 1e-3, maxIterations: 60 });
  const theta = lm.x;
  const v = unpack(theta);
  forecasts++;
  const best = run(theta);
  const r = lm.residuals;
  const ssr = r.reduce((s, x) => s + x * x, 0);
  const dof = Math.max(1, obs.length - fit.length);
  const reducedChiSquare = ssr / dof;
  const stepErr = obs.map((o) => {
    const m = at(best.series.days, o.species === 'tan' ? best.series.tanMgN : best.series.no2MgN, o.day);
    const err = o.value <= 0 ? Math.max(0, m - o.kit.stepMgN / 2) : o.value - m;
    return err / o.kit.stepMgN;
  });
  const rmseKitSteps = Math.sqrt(stepErr.reduce((s, x) => s + x * x, 0) / stepErr.length);
  const verdict = reducedChiSquare > 4 ? 'poor' : reducedChiSquare > 1.5 ? 'fair' : 'good';

  // Covariance from a central-difference Jacobian at the optimum.
  const h = 1e-3;
  const J = obs.map(() => new Array<number>(fit.length).fill(0));
  fit.forEach((_, j) => {
    const up = theta.slice();
    const dn = theta.slice();
    up[j] += h;
    dn[j] -= h;
    const ru = residualsAt(up);
    const rd = residualsAt(dn);
    for (let i = 0; i < obs.length; i++) J[i][j] = (ru[i] - rd[i]) / (2 * h);
  });
  const JtJ = fit.map((_, a) => fit.map((_, b) => J.reduce((s, row) => s + row[a] * row[b], 0) + (a === b ? 1e-9 : 0)));
  const s2 = Math.max(1, reducedChiSquare);
  let cov = invertSpd(JtJ).map((row) => row.map((c) => c * s2));
  if (!cov.every((row) => row.every(Number.isFinite))) cov = fit.map((_, a) => fit.map((_, b) => (a === b ? 1 : 0)));
  const standardErrors: Record<FitKey, number | null> = { ao: null, no: null, growth: null };
  fit.forEach((k, i) => (standardErrors[k] = Math.sqrt(Math.max(0, cov[i][i]))));

  // Bands: the prior ensemble and the calibrated one, over the log and `forecastDays` beyond.
  const bandHorizon = lastDay + (request.forecastDays ?? 30);
  const bandOpts: ForecastOptions = { horizonDays: bandHorizon, stepDays: 0.5, tolerances: { relative: 1e-4 } };
  const members = request.members ?? MIN_BAND_MEMBERS;
  const seed = request.seed ?? DEFAULT_SEED;
  const prior = runEnsemble(scenario, { members, seed }, bandOpts).band;
  const L = cholesky(cov);
  const rows = latinHypercube(members, fit.length, seededRandom(seed));
  const calibratedForecasts: Forecast[] = [];
  for (const u of rows) {
    const z = u.map((p) => normalQuantile(Math.min(Math.max(p, 1e-9), 1 - 1e-9)));
    // Held within the fit's bounds: a direction the readings barely constrain has a huge
    // standard error, and unbounded draws gave capacities the engine refuses or cannot afford.
    const t = theta.map((t0, i) => Math.min(Math.max(t0 + L[i].reduce((s, lij, j) => s + lij * z[j], 0), lower[i]), upper[i]));
    const w = unpack(t);
    try {
      calibratedForecasts.push(forecastParsed(scaledScenario(scenario, base, w.ao, w.no), { ...bandOpts, parameters: growthParameters(Math.max(w.growth, 0.05)) }));
    } catch {
      // a draw the engine refuses is left out of the band
    }
  }
  const calibrated = bandOf(calibratedForecasts);
  const width = meanBandWidth;

  const last = best.series.days.length - 1;
  const sum = (k: 'ao' | 'no', i: number) => best.series.zones.reduce((s, z) => s + z[k][i], 0);
  const presentAo = sum('ao', last);
  const calibratedScenario = scaledScenario(scenario, base, v.ao, v.no);
  const explanation = [
    `Fitted to ${obs.length} ammonia and nitrite results: at the last reading your filter bacteria could clear about ${formatValue(presentAo)} mg of ammonia-nitrogen a day (${formatValue((presentAo * MOLAR_MASS.NH3) / MOLAR_MASS.N)} mg of ammonia) and about ${formatValue(sum('no', last))} mg of nitrite-nitrogen a day.`,
    `On average the forecast is ${formatValue(rmseKitSteps)} shades of your kit's colour chart away from your readings. ` +
      (verdict === 'poor'
        ? 'That is a poor fit: your readings contradict the model as set up — check the tank settings (volume, filter, fish, events), the kit\'s basis (as N or as the ion) and the dates.'
        : verdict === 'fair'
          ? 'That is a fair fit for colour-chart kits.'
          : 'That is as close as colour-chart kits allow.'),
    describeBandChange({ prior: width(prior.tanMgN), calibrated: width(calibrated.tanMgN) }, { prior: width(prior.no2MgN), calibrated: width(calibrated.no2MgN) }),
  ];
  return {
    fitted: { aoFactor: v.ao, noFactor: v.no, growthMultiplier: v.growth },
    capacity: {
      startAoMgNPerDay: sum('ao', 0),
      startNoMgNPerDay: sum('no', 0),
      presentAoMgNPerDay: presentAo,
      presentNoMgNPerDay: sum('no', last),
      presentAoMgNH3PerDay: (presentAo * MOLAR_MASS.NH3) / MOLAR_MASS.N,
      presentByZone: best.series.zones.map((z) => ({ zoneId: z.zoneId, aoMgNPerDay: z.ao[last], noMgNPerDay: z.no[last] })),
    },
    standardErrors,
    quality: { rmseKitSteps, reducedChiSquare, readings: obs.length, verdict, iterations: lm.iterations, stop: lm.stop, forecasts },
    calibratedScenario,
    calibratedParameters: growthParameters(v.growth),
    band: {
      prior,
      calibrated,
      meanWidthTan: { prior: width(prior.tanMgN), calibrated: width(calibrated.tanMgN) },
      meanWidthNo2: { prior: width(prior.no2MgN), calibrated: width(calibrated.no2MgN) },
    },
    explanation,
    cautions: [...ESTIMATE_CAUTIONS],
  };
}

/** Mean width of a band (p90 − p10 averaged over its samples), mg N/L: how the fit's band change is measured. */
export function meanBandWidth(b: { p10: readonly number[]; p90: readonly number[] }): number {
  return b.p90.reduce((s, x, i) => s + x - b.p10[i], 0) / b.p90.length;
}

/** Within this share either way a band "stays about as wide" (widths are means over a 64-member ensemble). */
export const BAND_SAME_SHARE = 0.05;

export type BandChange = 'narrows' | 'widens' | 'same';

/** Which way a band's mean width moved from the prior to the calibrated ensemble. */
export function bandChange(w: { prior: number; calibrated: number }): BandChange {
  if (w.calibrated < w.prior * (1 - BAND_SAME_SHARE)) return 'narrows';
  if (w.calibrated > w.prior * (1 + BAND_SAME_SHARE)) return 'widens';
  return 'same';
}

function bandChangeWords(what: string, w: { prior: number; calibrated: number }): string {
  const from = `${formatValue(w.prior)} to ${formatValue(w.calibrated)} mg N/L`;
  switch (bandChange(w)) {
    case 'narrows':
      return `the band for ${what} narrows by ${Math.round((1 - w.calibrated / w.prior) * 100)} % (average width from ${from})`;
    case 'widens':
      return `the band for ${what} widens (average width from ${from})`;
    case 'same':
      return `the band for ${what} stays about as wide (average width ${formatValue(w.prior)} mg N/L)`;
  }
}

/** The keeper-facing sentence on how the fit changed the forecast band (the one source of this wording). */
export function describeBandChange(tan: { prior: number; calibrated: number }, no2: { prior: number; calibrated: number }): string {
  const widened = bandChange(tan) === 'widens' || bandChange(no2) === 'widens';
  return (
    `With the fit, ${bandChangeWords('total ammonia', tan)} and ${bandChangeWords('nitrite', no2)}.` +
    (widened ? ' A wider band means your readings leave the model less sure than its defaults did, not more.' : '')
  );
}

/** Lower Cholesky factor of a symmetric positive semi-definite matrix (zero pivots left at 0). */
export function cholesky(a: number[][]): number[][] {
  const n = a.length;
  const L = a.map(() => new Array<number>(n).fill(0));
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      let s = a[i][j];
      for (let k = 0; k < j; k++) s -= L[i][k] * L[j][k];
      if (i === j) L[i][i] = s > 0 ? Math.sqrt(s) : 0;
      else L[i][j] = L[j][j] > 0 ? s / L[j][j] : 0;
    }
  }
  return L;
}

