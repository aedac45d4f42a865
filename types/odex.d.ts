// odex ships its TypeScript source without a declaration file; tsc would type-check that
// source under our strict settings and fail, so `paths` maps the module here instead.
declare module 'odex' {
  export type Derivative = (x: number, y: number[]) => number[];
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
    maxSteps: number;
    initialStepSize: number;
    maxStepSize: number;
    denseOutput: boolean;
    denseComponents: number[] | undefined;
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
    grid(dt: number, out: (x: number, y: number[]) => boolean | void): OutputFunction;
  }
}
