/**
 * Reference integrator on mathjs `solveODE` (Dormand–Prince RK45), for tests and the
 * benchmark only — the engine uses odex (simulation/solver.ts). Lives outside simulation/, so
 * the ODE solver of mathjs never reaches the engine or its bundle.
 *
 * mathjs has only an absolute tolerance on the max-norm of the error. To make it relative,
 * each sample interval is integrated in scaled variables z_i = y_i / w_i with
 * w_i = max(|y_i(start)|, atol_i / rtol): then `tol` bounds the relative error per step.
 */
import { solveODE } from 'mathjs';
import type { Derivative } from 'odex';
import { checkSegmentRequest, type IntegrationStats, type SegmentIntegrator, type SegmentOutcome, type Tolerances } from '../../simulation/solver';

export interface MathjsOptions {
  /** mathjs tolerance in scaled units (relative error per step); default tolerances.relative. */
  tol?: number;
  maxIter?: number;
}

export function createMathjsIntegrator(n: number, tolerances: Tolerances, options: MathjsOptions = {}): SegmentIntegrator {
  const w = new Array<number>(n).fill(1);
  const tol = options.tol ?? tolerances.relative;
  let firstStep: number | undefined;

  const solveInterval = (f: Derivative, a: number, b: number, y: number[], stats: IntegrationStats): SegmentOutcome => {
    for (let i = 0; i < n; i++) w[i] = Math.max(Math.abs(y[i]), tolerances.absolute[i] / tolerances.relative);
    const z0 = y.map((v, i) => v / w[i]);
    const g = (t: number, z: number[]) => {
      stats.evaluations++;
      const yy = z.map((v, i) => v * w[i]);
      const dy = f(t, yy);
      return dy.map((v, i) => v / w[i]);
    };
    let result;
    try {
      result = solveODE(g, [a, b], z0, { tol, firstStep: firstStep && firstStep < b - a ? firstStep : undefined, maxIter: options.maxIter ?? 1e6 });
    } catch (e) {
      return { ok: false, reason: 'failed', message: `mathjs solveODE failed on days ${a}–${b}: ${(e as Error).message}` };
    }
    const steps = result.t.length - 1;
    stats.steps += steps;
    stats.accepted += steps;
    // The last step is trimmed to land on b; the one before it is the natural size.
    if (steps >= 2) firstStep = result.t[steps - 1] - result.t[steps - 2];
    const zEnd = result.y[steps];
    for (let i = 0; i < n; i++) y[i] = zEnd[i] * w[i];
    return { ok: true };
  };

  return {
    integrate(request) {
      checkSegmentRequest(n, request);
      const { f, from: t0, to: t1, y, times, end, sink } = request;
      const stats: IntegrationStats = { steps: 0, accepted: 0, rejected: 0, evaluations: 0 };
      let k = request.first;
      while (k < end && times[k] <= t0) sink(k++, y);
      let t = t0;
      while (t < t1) {
        const next = k < end && times[k] < t1 ? times[k] : t1;
        const outcome = solveInterval(f, t, next, y, stats);
        if (!outcome.ok) return { outcome, stats };
        t = next;
        while (k < end && times[k] <= t) sink(k++, y);
      }
      return { outcome: { ok: true }, stats };
    },
  };
}
