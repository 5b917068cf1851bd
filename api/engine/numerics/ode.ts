/** ODE integration through odex (Gragg-Bulirsch-Stoer extrapolation), with collapse detection. */
import { Outcome, Solver } from 'odex';

export type Rhs = (t: number, y: number[]) => number[];

export interface OdeOptions {
  /** Relative and absolute tolerance (default 1e-9). */
  tol?: number;
  /** Stop as soon as any component falls to zero or below (a population collapse). */
  stopAtZero?: boolean;
  maxSteps?: number;
  /** First step size tried (default a quarter of the interval, at most 0.25). */
  initialStep?: number;
}

export interface OdeResult {
  y: number[];
  /** Time reached: t1, or the end of the step in which a component first reached zero. */
  t: number;
  collapsed: boolean;
  evaluations: number;
}

const solvers = new Map<number, Solver>();

function solverFor(n: number, tol: number, maxSteps: number, initialStep: number): Solver {
  let s = solvers.get(n);
  if (!s) {
    s = new Solver(n);
    solvers.set(n, s);
  }
  s.relativeTolerance = tol;
  s.absoluteTolerance = tol;
  s.maxSteps = maxSteps;
  s.denseOutput = false;
  s.initialStepSize = initialStep;
  return s;
}

/** Integrates y' = f(t, y) from t0 to t1; never returns NaN: a path through zero is a collapse. */
export function integrate(f: Rhs, t0: number, y0: number[], t1: number, opts: OdeOptions = {}): OdeResult {
  const solver = solverFor(y0.length, opts.tol ?? 1e-9, opts.maxSteps ?? 10_000, opts.initialStep ?? Math.min(0.25, Math.abs(t1 - t0)));
  let collapseAt: { t: number; y: number[] } | null = null;
  const out = opts.stopAtZero
    ? (_n: number, _x0: number, x: number, y: number[]) => {
        if (y.some((v) => v <= 0)) {
          collapseAt = { t: x, y: y.map((v) => Math.max(v, 0)) };
          return false;
        }
        return true;
      }
    : undefined;
  const r = solver.solve(f, t0, y0, t1, out);
  const hit = collapseAt as { t: number; y: number[] } | null;
  if (hit) return { y: hit.y, t: hit.t, collapsed: true, evaluations: r.nEval };
  if (r.outcome === Outcome.MaxStepsExceeded || r.y.some((v) => !Number.isFinite(v))) {
    throw new Error(`ODE integration failed at t=${r.xEnd} (steps exceeded or non-finite state)`);
  }
  return { y: r.y, t: t1, collapsed: false, evaluations: r.nEval };
}
