// Declarations for the parts of odex 2.0 (Gragg-Bulirsch-Stoer, Hairer & Wanner) that the engine
// uses. tsconfig.api.json maps 'odex' here, because the package's own TypeScript source does not
// pass strict checking.
export type Derivative = (x: number, y: number[]) => number[];
export type OutputFunction = (nr: number, xold: number, x: number, y: number[],
  dense?: (c: number, x: number) => number) => boolean | void;
export declare enum Outcome { Converged = 0, MaxStepsExceeded = 1, EarlyReturn = 2 }
export declare class Solver {
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
}
