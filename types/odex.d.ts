// odex ships its TypeScript source without a declaration file; tsc would type-check that
// source under our strict settings and fail, so `paths` maps the module here instead.
// Checked against node_modules/odex/src/odex.ts (2.0.4).
declare module 'odex' {
  export type Derivative = (x: number, y: number[]) => number[];
  /**
   * Called after each accepted step (nr ≥ 2) and once before the first (nr = 1, no dense
   * interpolator). `dense(c, x)` interpolates component c at x ∈ [xold, x] when
   * `denseOutput` is on. Return false to stop (outcome EarlyReturn).
   */
  export type OutputFunction = (
    nr: number,
    xold: number,
    x: number,
    y: number[],
    dense?: (c: number, x: number) => number,
  ) => boolean | void;
  export enum Outcome {
    Converged = 0,
    MaxStepsExceeded = 1,
    EarlyReturn = 2,
  }
  export class Solver {
    constructor(n: number);
    n: number;
    uRound: number;
    /** default 10 000; exceeding it returns Outcome.MaxStepsExceeded (no exception). */
    maxSteps: number;
    /** default 1e-4; odex never starts below 1e-4. */
    initialStepSize: number;
    /** 0 means xEnd − x. */
    maxStepSize: number;
    maxExtrapolationColumns: number;
    stepSizeSequence: number;
    stabilityCheckCount: number;
    stabilityCheckTableLines: number;
    denseOutput: boolean;
    denseOutputErrorEstimator: boolean;
    denseComponents: number[] | undefined;
    interpolationFormulaDegree: number;
    stepSizeReductionFactor: number;
    stepSizeFac1: number;
    stepSizeFac2: number;
    stepSizeFac3: number;
    stepSizeFac4: number;
    stepSafetyFactor1: number;
    stepSafetyFactor2: number;
    relativeTolerance: number | number[];
    absoluteTolerance: number | number[];
    debug: boolean;
    solve(
      f: Derivative,
      x: number,
      y0: number[],
      xEnd: number,
      solOut?: OutputFunction,
    ): {
      y: number[];
      outcome: Outcome;
      nStep: number;
      xEnd: number;
      nAccept: number;
      nReject: number;
      nEval: number;
    };
    /** Sampler at a fixed interval (accumulates x += dt; needs denseOutput). */
    grid(dt: number, out: (x: number, y: number[]) => unknown): OutputFunction;
  }
}
