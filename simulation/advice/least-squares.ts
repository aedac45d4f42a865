/**
 * Box-bounded Levenberg–Marquardt for a few unknowns whose residuals are costly (each residual
 * vector is one forecast): Madsen, Nielsen & Tingleff, "Methods for non-linear least squares
 * problems" (2nd ed., DTU 2004), Algorithm 3.16 [pub] — gain-ratio damping update, a step is
 * taken only when it lowers the sum of squares, and the run stops as soon as the gradient, the
 * step or the relative gain is negligible. Steps are projected onto the bounds and the gain
 * ratio uses the projected step. The Jacobian is forward differences around the accepted
 * point, reusing its residuals (n extra evaluations per accepted step, none per rejected one).
 *
 * Written here rather than taken from ml-levenberg-marquardt: that library moves to every
 * trial point even when it is worse and stops only on an absolute sum of squares, so on real
 * test logs it ran its full iteration budget, wandering the corners of the bounds.
 */

export interface LeastSquaresOptions {
  lower: readonly number[];
  upper: readonly number[];
  /** Forward-difference step on each unknown (default 1e-3). */
  difference?: number;
  /** Most damping updates, accepted or not (default 60). */
  maxIterations?: number;
  /** Stop when the largest gradient component falls below this (default 1e-6). */
  gradientTolerance?: number;
  /** Stop when the step is this small relative to the unknowns (default 1e-4). */
  stepTolerance?: number;
  /** Stop when an accepted step lowers the sum of squares by less than this share (default 1e-4). */
  relativeGainTolerance?: number;
}

export type LeastSquaresStop = 'gradient' | 'step' | 'gain' | 'iterations';

export interface LeastSquaresResult {
  x: number[];
  residuals: number[];
  sumOfSquares: number;
  iterations: number;
  /** residual vectors computed (start, trials, Jacobian columns) */
  evaluations: number;
  stop: LeastSquaresStop;
}

const sumSq = (r: readonly number[]) => r.reduce((s, v) => s + v * v, 0);

/** Solves the small symmetric positive-definite system A·x = b (Cholesky). */
export function solveSpd(a: number[][], b: number[]): number[] {
  const n = b.length;
  const L = a.map(() => new Array<number>(n).fill(0));
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      let s = a[i][j];
      for (let k = 0; k < j; k++) s -= L[i][k] * L[j][k];
      L[i][j] = i === j ? Math.sqrt(Math.max(s, 1e-300)) : s / L[j][j];
    }
  }
  const y = new Array<number>(n).fill(0);
  for (let i = 0; i < n; i++) {
    let s = b[i];
    for (let k = 0; k < i; k++) s -= L[i][k] * y[k];
    y[i] = s / L[i][i];
  }
  const x = new Array<number>(n).fill(0);
  for (let i = n - 1; i >= 0; i--) {
    let s = y[i];
    for (let k = i + 1; k < n; k++) s -= L[k][i] * x[k];
    x[i] = s / L[i][i];
  }
  return x;
}

/** Inverse of a small symmetric positive-definite matrix, column by column. */
export function invertSpd(a: number[][]): number[][] {
  const n = a.length;
  const columns = a.map((_, j) => solveSpd(a, a.map((__, i) => (i === j ? 1 : 0))));
  return Array.from({ length: n }, (_, i) => columns.map((c) => c[i]));
}

/** Minimises ½‖residuals(x)‖² from x0 within [lower, upper]. */
export function leastSquares(residuals: (x: readonly number[]) => number[], x0: readonly number[], options: LeastSquaresOptions): LeastSquaresResult {
  const n = x0.length;
  const h = options.difference ?? 1e-3;
  const maxIterations = options.maxIterations ?? 60;
  const eps1 = options.gradientTolerance ?? 1e-6;
  const eps2 = options.stepTolerance ?? 1e-4;
  const eps3 = options.relativeGainTolerance ?? 1e-4;
  const clamp = (v: number, i: number) => Math.min(Math.max(v, options.lower[i]), options.upper[i]);
  let evaluations = 0;
  const evaluate = (x: readonly number[]) => {
    evaluations++;
    return residuals(x);
  };

  let x = x0.map(clamp);
  let r = evaluate(x);
  let F = sumSq(r) / 2;
  // J·ᵀJ and Jᵀr of the forward-difference Jacobian at x (stepping inwards at an upper bound).
  const normalEquations = () => {
    const J: number[][] = [];
    for (let j = 0; j < n; j++) {
      const d = x[j] + h <= options.upper[j] ? h : -h;
      const xj = x.slice();
      xj[j] += d;
      const rj = evaluate(xj);
      J.push(rj.map((v, i) => (v - r[i]) / d));
    }
    const A = J.map((a) => J.map((b) => a.reduce((s, v, i) => s + v * b[i], 0)));
    const g = J.map((a) => a.reduce((s, v, i) => s + v * r[i], 0));
    return { A, g };
  };
  let { A, g } = normalEquations();
  let mu = 1e-3 * Math.max(...A.map((row, i) => row[i]), 1e-12);
  let nu = 2;
  const done = (stop: LeastSquaresStop, iterations: number): LeastSquaresResult => ({ x, residuals: r, sumOfSquares: 2 * F, iterations, evaluations, stop });
  // The projected gradient: a component pushing against its bound cannot be followed.
  const stationary = () => Math.max(0, ...g.map((v, i) => ((x[i] <= options.lower[i] && v > 0) || (x[i] >= options.upper[i] && v < 0) ? 0 : Math.abs(v)))) <= eps1;
  if (stationary()) return done('gradient', 0);

  for (let k = 1; k <= maxIterations; k++) {
    // Unknowns held at a bound the gradient pushes against stay there; the step is solved for the others.
    const free = x.map((_, i) => i).filter((i) => !((x[i] <= options.lower[i] && g[i] > 0) || (x[i] >= options.upper[i] && g[i] < 0)));
    if (free.length === 0) return done('step', k);
    const reduced = solveSpd(
      free.map((i) => free.map((j) => (i === j ? A[i][j] + mu : A[i][j]))),
      free.map((i) => -g[i]),
    );
    const step = new Array<number>(n).fill(0);
    free.forEach((i, f) => (step[i] = reduced[f]));
    const xNew = x.map((v, i) => clamp(v + step[i], i));
    const taken = xNew.map((v, i) => v - x[i]);
    const norm = Math.hypot(...taken);
    if (norm <= eps2 * (Math.hypot(...x) + eps2)) return done('step', k);
    const rNew = evaluate(xNew);
    const FNew = sumSq(rNew) / 2;
    // Reduction the linear model predicts for the step actually taken.
    const predicted = -taken.reduce((s, t, i) => s + t * g[i], 0) - 0.5 * taken.reduce((s, t, i) => s + t * A[i].reduce((u, a, j) => u + a * taken[j], 0), 0);
    const rho = predicted > 0 && Number.isFinite(FNew) ? (F - FNew) / predicted : -1;
    if (rho > 0) {
      const gain = (F - FNew) / Math.max(F, 1e-300);
      x = xNew;
      r = rNew;
      F = FNew;
      if (gain < eps3) return done('gain', k);
      ({ A, g } = normalEquations());
      if (stationary()) return done('gradient', k);
      mu *= Math.max(1 / 3, 1 - (2 * rho - 1) ** 3);
      nu = 2;
    } else {
      mu *= nu;
      nu *= 2;
    }
  }
  return done('iterations', maxIterations);
}
