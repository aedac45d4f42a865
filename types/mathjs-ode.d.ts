// mathjs 15.2 has `solveODE` at run time (lib/esm/function/numeric/solveODE.js) but not in
// its type declarations; this augmentation declares the plain-number form we use.
import 'mathjs';

declare module 'mathjs' {
  interface SolveODEOptions {
    /** 'RK45' (Dormand–Prince, default) or 'RK23' (Bogacki–Shampine). */
    method?: 'RK23' | 'RK45';
    /** Absolute tolerance on the max-norm of the local error estimate (default 1e-4). */
    tol?: number;
    firstStep?: number;
    minStep?: number;
    maxStep?: number;
    minDelta?: number;
    maxDelta?: number;
    /** Step attempts before it throws (default 1e4). */
    maxIter?: number;
  }
  interface SolveODEResult {
    t: number[];
    y: number[][];
  }
  interface MathJsInstance {
    solveODE(f: (t: number, y: number[]) => number[], tspan: [number, number], y0: number[], options?: SolveODEOptions): SolveODEResult;
  }
  export function solveODE(
    f: (t: number, y: number[]) => number[],
    tspan: [number, number],
    y0: number[],
    options?: SolveODEOptions,
  ): SolveODEResult;
}
