/** Nelder-Mead minimisation (fmin's implementation) with the iteration count and final simplex size. */
import fmin from 'fmin';

export interface Minimum {
  x: number[];
  fx: number;
  iterations: number;
  /** Largest distance of a simplex vertex from the best one at the end. */
  simplexSize: number;
  hitIterationLimit: boolean;
}

/** Minimises f from x0; `maxIterations` bounds the work (default 400 per dimension). */
export function minimise(f: (x: number[]) => number, x0: number[], maxIterations = 400 * x0.length): Minimum {
  let iterations = 0;
  let last: { simplex: number[][] } | null = null;
  // why: fmin reports progress only through a `history` list; this one counts and keeps the last entry
  const history = { push: (entry: { simplex: number[][] }) => { iterations++; last = entry; } };
  const res = fmin.nelderMead(f, x0.slice(), { maxIterations, minErrorDelta: 1e-9, minTolerance: 1e-7, history });
  const simplex = (last as { simplex: number[][] } | null)?.simplex ?? [];
  const simplexSize = simplex.reduce((m, v) => Math.max(m, ...v.map((vi, i) => Math.abs(vi - res.x[i]!))), 0);
  return { x: Array.from(res.x), fx: res.fx, iterations, simplexSize, hitIterationLimit: iterations >= maxIterations };
}
