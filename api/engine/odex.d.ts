// Local declarations for the parts of odex 2.0 (Gragg-Bulirsch-Stoer, Hairer & Wanner) we use.
declare module 'odex' {
  export type Derivative = (x: number, y: number[]) => number[];
  export type OutputFunction = (nr: number, xold: number, x: number, y: number[],
    dense?: (c: number, x: number) => number) => boolean | void;
  export enum Outcome { Converged = 0, MaxStepsExceeded = 1, EarlyReturn = 2 }
  export class Solver {
    constructor(n: number);
    absoluteTolerance: number;
    relativeTolerance: number;
    maxSteps: number;
    initialStepSize: number;
    maxStepSize: number;
    denseOutput: boolean;
    solve(f: Derivative, x: number, y0: number[], xEnd: number, solOut?: OutputFunction): {
      y: number[]; outcome: Outcome; nStep: number; xEnd: number; nAccept: number; nReject: number; nEval: number;
    };
    grid(dt: number, out: (x: number, y: number[]) => unknown): OutputFunction;
  }
}
