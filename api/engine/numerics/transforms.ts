/** Free parameters on an unbounded scale: x = lo + (hi − lo)·σ(u) on a log or linear axis. */

export interface Bound {
  name: string;
  lo: number;
  hi: number;
  /** Bound on the log scale (for r, K): u maps to ln x. */
  log: boolean;
}

const sigmoid = (u: number) => 1 / (1 + Math.exp(-u));

/** Natural value of a free parameter. */
export function toNatural(b: Bound, u: number): number {
  if (b.log) return Math.exp(Math.log(b.lo) + (Math.log(b.hi) - Math.log(b.lo)) * sigmoid(u));
  return b.lo + (b.hi - b.lo) * sigmoid(u);
}

/** Free (unbounded) value of a natural parameter; clamps just inside the bounds. */
export function toFree(b: Bound, x: number): number {
  const lo = b.log ? Math.log(b.lo) : b.lo;
  const hi = b.log ? Math.log(b.hi) : b.hi;
  const v = b.log ? Math.log(x) : x;
  const f = Math.min(1 - 1e-9, Math.max(1e-9, (v - lo) / (hi - lo)));
  return Math.log(f / (1 - f));
}

/** Where in its range (0..1) a free value lies: near 0 or 1 means the estimate sits on a bound. */
export function rangePosition(u: number): number {
  return sigmoid(u);
}
