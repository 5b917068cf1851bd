/** Periodic orbits of a one-dimensional map: Newton on f^p(x) = x, multipliers, and period detection. */

export interface Map1 {
  f(x: number): number;
  df(x: number): number;
}

/** The multiplier (f^p)'(x) = Π f'(x_i) along the orbit from x. */
export function multiplier(m: Map1, p: number, x: number): number {
  let prod = 1;
  let y = x;
  for (let i = 0; i < p; i++) {
    prod *= m.df(y);
    y = m.f(y);
  }
  return prod;
}

/** f^p(x). */
export function iterate(m: Map1, p: number, x: number): number {
  let y = x;
  for (let i = 0; i < p; i++) y = m.f(y);
  return y;
}

/** A point of a period-p orbit near x (Newton on f^p(x) − x), or null when Newton does not settle. */
export function periodicPoint(m: Map1, p: number, x0: number, scale: number): number | null {
  let x = x0;
  for (let i = 0; i < 60; i++) {
    const g = iterate(m, p, x) - x;
    const dg = multiplier(m, p, x) - 1;
    if (!Number.isFinite(g) || !Number.isFinite(dg) || dg === 0) return null;
    const step = g / dg;
    x -= step;
    if (!(x > 0)) return null;
    if (Math.abs(step) <= 1e-15 * scale + 1e-14 * Math.abs(x)) return Math.abs(iterate(m, p, x) - x) < 1e-9 * scale ? x : null;
  }
  return Math.abs(iterate(m, p, x) - x) < 1e-9 * scale ? x : null;
}

/** True when the orbit through x returns to x in fewer than p steps (a divisor of p). */
export function hasShorterPeriod(m: Map1, p: number, x: number, scale: number): boolean {
  for (let q = 1; q < p; q++) if (p % q === 0 && Math.abs(iterate(m, q, x) - x) < 1e-7 * scale) return true;
  return false;
}

export interface LongRun {
  /** States visited after the transient (all of them for a cycle, a sample otherwise). */
  states: number[];
  /** Smallest period found (≤ maxPeriod), or null. */
  period: number | null;
  /** Mean ln|f'| along the run: the Lyapunov exponent of the attractor. */
  lyapunov: number;
  collapsed: boolean;
  /** Last state, to start the next parameter value from. */
  last: number;
}

/** Iterates past the transient and describes the long-run states. */
export function longRun(m: Map1, x0: number, scale: number, opts: { transient?: number; keep?: number; maxPeriod?: number } = {}): LongRun {
  const transient = opts.transient ?? 3000;
  const keep = opts.keep ?? 512;
  const maxPeriod = opts.maxPeriod ?? 64;
  let x = x0;
  for (let i = 0; i < transient && x > 1e-12 * scale; i++) x = m.f(x);
  if (!(x > 1e-9 * scale)) return { states: [0], period: 1, lyapunov: Math.log(Math.abs(m.df(0))), collapsed: true, last: 0 };
  const seen: number[] = [];
  let lyap = 0;
  for (let i = 0; i < keep; i++) {
    seen.push(x);
    lyap += Math.log(Math.max(Math.abs(m.df(x)), 1e-300));
    x = m.f(x);
  }
  const lyapunov = lyap / keep;
  const period = detectPeriod(seen, maxPeriod, 1e-7 * scale) ?? (lyapunov < 0 ? detectPeriod(seen, maxPeriod, 1e-3 * scale) : null);
  const states = period ? seen.slice(-period) : seen.slice(-160);
  return { states, period, lyapunov, collapsed: false, last: x };
}

function detectPeriod(xs: number[], maxPeriod: number, tol: number): number | null {
  const tail = xs.slice(-4 * maxPeriod);
  for (let p = 1; p <= maxPeriod; p++) {
    let ok = true;
    for (let i = 0; i + p < tail.length && ok; i++) ok = Math.abs(tail[i + p]! - tail[i]!) < tol;
    if (ok) return p;
  }
  return null;
}
