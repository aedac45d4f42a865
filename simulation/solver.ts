/**
 * The segment-integrator interface, and an implementation on odex (Hairer & Wanner's ODEX:
 * GBS extrapolation of the explicit midpoint rule, with dense output). Events are discontinuities: the caller integrates each
 * segment between events separately and changes the state or the model's constants between
 * them, so no step ever straddles a jump.
 *
 * Tolerances (error test |e_i| ≤ atol_i + rtol·|y_i| per component):
 * - rtol 1e-6: the forecast is reported to 3 significant digits; 1e-6 keeps dense-output
 *   error and the timing of exponential growth (capacities grow by 10⁴ in a start-up) well
 *   below that, and brings the engine within 3e-4 relative of a tight reference solution
 *   (the promise the exactness tests hold; a kit's first colour step is ~0.2 mg N/L, so this
 *   is a thousand times finer than any reading).
 * - atol for concentrations 1e-7 mg/L (far below any test kit's 0.25 mg/L step) and for
 *   capacities 1e-9 mg N/(L·d) × V, four orders below the smallest inoculum (1e-5 per L), so
 *   the growth phase from a tiny inoculum is resolved in relative terms.
 *
 * Samples are taken on an index grid t_k = k·step (no accumulated x += dt drift, unlike
 * odex's own `grid`, which also cannot stop at segment ends). Two sampling modes:
 * - 'restart' (default): each segment is further cut at the sample times and odex restarts
 *   there with the last accepted step size, so samples are exact step ends. Measured on the
 *   benchmark (bench/sim.ts) this is ~1.6× faster than dense output and ~2× more accurate,
 *   because odex's dense output needs the costlier step-number sequence and builds the
 *   interpolation polynomial at every step while our steps are stability-limited anyway.
 * - 'dense': one odex run per segment with denseOutput and interpolation at sample times.
 */
import { Outcome, Solver, type Derivative } from 'odex';

export interface Tolerances {
  relative: number;
  absolute: number[];
}

export interface IntegrationStats {
  steps: number;
  accepted: number;
  rejected: number;
  evaluations: number;
}

/** How a segment ended: converged to its end, or gave up (the state is then not to be used). */
export type SegmentOutcome =
  | { ok: true }
  | { ok: false; reason: 'max-steps' | 'stopped' | 'non-finite' | 'failed'; message: string };

/** The integration failed (step limit, or the state became non-finite): the callers' refusal of an outcome. */
export class SolverError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'SolverError';
  }
}

/** Receives sample k (time times[k]) with the state there; `y` is only valid during the call. */
export type SampleSink = (k: number, y: ArrayLike<number>) => void;

export interface SegmentRequest {
  /** Right-hand side dy/dt = f(t, y). */
  f: Derivative;
  /** Segment start and end, days (from ≤ to). */
  from: number;
  to: number;
  /** State at `from`, overwritten with the state at `to` when the outcome is ok. */
  y: number[];
  /** Sample grid; the samples [first, end) are taken, the caller passes those with from ≤ times[k] ≤ to. */
  times: ArrayLike<number>;
  first: number;
  end: number;
  sink: SampleSink;
}

export interface SegmentResult {
  outcome: SegmentOutcome;
  /** Work done on this segment. */
  stats: IntegrationStats;
}

export interface SegmentIntegrator {
  /** Integrates one segment between discontinuities; never throws for a failed integration. */
  integrate(request: SegmentRequest): SegmentResult;
  /**
   * Step size the next segment starts with, days (restart sampling carries it over segment
   * ends); settable so a run continued from a saved state starts as the uninterrupted one would.
   */
  stepSize?: number;
}

export type SamplingMode = 'restart' | 'dense';
const SAMPLING_MODES: readonly SamplingMode[] = ['restart', 'dense'];

export interface OdexOptions {
  tolerances: Tolerances;
  sampling?: SamplingMode;
  maxSteps?: number;
  /** Extra odex settings (e.g. maxExtrapolationColumns), for tuning experiments. */
  tuning?: Partial<Pick<Solver, 'maxExtrapolationColumns' | 'stepSizeSequence' | 'denseOutputErrorEstimator' | 'interpolationFormulaDegree'>>;
}

/** Default step limit per segment; odex's own (10 000) returns quietly, we report it. */
export const DEFAULT_MAX_STEPS = 20000;

const OK: SegmentOutcome = { ok: true };

/** Refuses options the integrator cannot work with, naming the option, before any solving. */
export function checkIntegratorOptions(n: number, options: OdexOptions): void {
  if (!(Number.isInteger(n) && n >= 1)) throw new RangeError(`The state size must be a whole number of at least 1 (got ${n}).`);
  const { relative, absolute } = options.tolerances;
  if (!(Number.isFinite(relative) && relative > 0 && relative < 1)) throw new RangeError(`tolerances.relative must lie between 0 and 1 (got ${relative}).`);
  if (absolute.length !== n) throw new RangeError(`tolerances.absolute needs one value per state component (${n}, got ${absolute.length}).`);
  absolute.forEach((a, i) => {
    if (!(Number.isFinite(a) && a > 0)) throw new RangeError(`tolerances.absolute[${i}] must be above 0 (got ${a}).`);
  });
  if (options.maxSteps !== undefined && !(Number.isInteger(options.maxSteps) && options.maxSteps >= 1)) {
    throw new RangeError(`maxSteps must be a whole number of at least 1 (got ${options.maxSteps}).`);
  }
  if (options.sampling !== undefined && !SAMPLING_MODES.includes(options.sampling)) {
    throw new RangeError(`sampling must be ${SAMPLING_MODES.map((m) => `'${m}'`).join(' or ')} (got ${String(options.sampling)}).`);
  }
}

/** Refuses a segment request that cannot be integrated (a caller's mistake, not a solver failure). */
export function checkSegmentRequest(n: number, r: SegmentRequest): void {
  if (!(Number.isFinite(r.from) && Number.isFinite(r.to) && r.to >= r.from)) throw new RangeError(`A segment runs forward between finite days (got ${r.from}–${r.to}).`);
  if (r.y.length !== n) throw new RangeError(`The state has ${r.y.length} components; the integrator was made for ${n}.`);
  if (!(Number.isInteger(r.first) && Number.isInteger(r.end) && 0 <= r.first && r.first <= r.end && r.end <= r.times.length)) {
    throw new RangeError(`Samples [${r.first}, ${r.end}) do not lie on the grid of ${r.times.length} times.`);
  }
}

function outcomeOf(solver: Solver, outcome: Outcome, t0: number, t1: number, lastX: number): SegmentOutcome {
  if (outcome === Outcome.MaxStepsExceeded) {
    return {
      ok: false,
      reason: 'max-steps',
      message:
        `The ODE solver reached its step limit (${solver.maxSteps} steps) at day ${lastX.toFixed(3)} ` +
        `while integrating days ${t0}–${t1}; the scenario is too stiff for the explicit solver.`,
    };
  }
  if (outcome !== Outcome.Converged) return { ok: false, reason: 'stopped', message: `The ODE solver stopped early (outcome ${outcome}).` };
  return OK;
}

/** Copies the end state into `to`, or reports the first non-finite component (then `to` is not to be used). */
function copyFinite(from: number[], to: number[], t: number): SegmentOutcome {
  for (let i = 0; i < to.length; i++) {
    const v = from[i];
    if (!Number.isFinite(v)) return { ok: false, reason: 'non-finite', message: `State component ${i} became ${v} near day ${t}.` };
    to[i] = v;
  }
  return OK;
}

const noWork = (): IntegrationStats => ({ steps: 0, accepted: 0, rejected: 0, evaluations: 0 });

function count(stats: IntegrationStats, r: { nStep: number; nAccept: number; nReject: number; nEval: number }): void {
  stats.steps += r.nStep;
  stats.accepted += r.nAccept;
  stats.rejected += r.nReject;
  stats.evaluations += r.nEval;
}

export function createOdexIntegrator(n: number, options: OdexOptions): SegmentIntegrator {
  checkIntegratorOptions(n, options);
  const solver = new Solver(n);
  solver.relativeTolerance = options.tolerances.relative;
  solver.absoluteTolerance = options.tolerances.absolute;
  solver.maxSteps = options.maxSteps ?? DEFAULT_MAX_STEPS;
  solver.denseOutput = options.sampling === 'dense';
  Object.assign(solver, options.tuning);
  return solver.denseOutput ? denseIntegrator(solver, n) : restartIntegrator(solver, n);
}

function restartIntegrator(solver: Solver, n: number): SegmentIntegrator {
  let h = 1e-4;
  let lastX = 0;
  const out = (_nr: number, xold: number, x: number) => {
    lastX = x;
    if (x > xold) h = x - xold;
  };
  return {
    get stepSize() {
      return h;
    },
    set stepSize(v: number) {
      if (v > 0 && Number.isFinite(v)) h = v;
    },
    integrate(request) {
      checkSegmentRequest(n, request);
      const { f, from: t0, to: t1, y, times, end, sink } = request;
      const stats = noWork();
      let k = request.first;
      while (k < end && times[k] <= t0) sink(k++, y);
      let t = t0;
      while (t < t1) {
        const next = k < end && times[k] < t1 ? times[k] : t1;
        // Carry the last accepted step over the restart (odex would begin at 1e-4 d again).
        solver.initialStepSize = Math.min(h, next - t);
        const result = solver.solve(f, t, y, next, out);
        count(stats, result);
        const outcome = outcomeOf(solver, result.outcome, t0, t1, lastX);
        if (!outcome.ok) return { outcome, stats };
        const copied = copyFinite(result.y, y, next);
        if (!copied.ok) return { outcome: copied, stats };
        t = next;
        while (k < end && times[k] <= t) sink(k++, y);
      }
      return { outcome: OK, stats };
    },
  };
}

function denseIntegrator(solver: Solver, n: number): SegmentIntegrator {
  const buf = new Array<number>(n).fill(0);
  return {
    integrate(request) {
      checkSegmentRequest(n, request);
      const { f, from: t0, to: t1, y, times, end, sink } = request;
      const stats = noWork();
      let k = request.first;
      // Samples at t0 are the state just after the events at t0.
      while (k < end && times[k] <= t0) sink(k++, y);
      if (!(t1 > t0)) return { outcome: OK, stats };
      let lastX = t0;
      const out = (nr: number, _xold: number, x: number, _y: number[], dense?: (c: number, x: number) => number) => {
        lastX = x;
        if (nr === 1 || !dense) return;
        while (k < end && times[k] <= x) {
          const t = times[k];
          for (let i = 0; i < n; i++) buf[i] = dense(i, t);
          sink(k++, buf);
        }
      };
      const result = solver.solve(f, t0, y, t1, out);
      count(stats, result);
      const outcome = outcomeOf(solver, result.outcome, t0, t1, lastX);
      if (!outcome.ok) return { outcome, stats };
      const copied = copyFinite(result.y, y, t1);
      if (!copied.ok) return { outcome: copied, stats };
      // Samples at t1 (or a rounding hair beyond the last step's x) take the end state.
      while (k < end) sink(k++, y);
      return { outcome: OK, stats };
    },
  };
}
