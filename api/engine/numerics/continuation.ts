/**
 * Pseudo-arclength continuation of equilibria F(x, h) = 0 in a harvest parameter h, with detection
 * of folds (the h-component of the tangent changes sign), Hopf points (a complex pair crosses the
 * imaginary axis) and boundary crossings (a population reaches zero: transcritical with the
 * extinction equilibrium). Keller (1977); Kuznetsov, Elements of Applied Bifurcation Theory, ch. 10.
 */
import { det, eigenvalues, type Eigen, solveLinear } from './linear';

export interface EquilibriumSystem {
  n: number;
  F(x: number[], h: number): number[];
  /** Typical magnitude of each state variable and of h, for a well-scaled arclength. */
  scale: number[];
}

export interface BranchPoint {
  x: number[];
  h: number;
  eigen: Eigen;
  stable: boolean;
  /** −max Re(λ): how fast the equilibrium recovers from a small disturbance (0 at a fold or Hopf). */
  returnRate: number;
}

export interface BranchEvent {
  kind: 'fold' | 'hopf' | 'boundary';
  x: number[];
  h: number;
}

export interface Branch {
  points: BranchPoint[];
  events: BranchEvent[];
}

/** ∂F/∂(x, h) by central differences, in scaled coordinates. */
function jacobian(sys: EquilibriumSystem, y: number[]): number[][] {
  const n = sys.n;
  const J = Array.from({ length: n }, () => new Array<number>(n + 1).fill(0));
  for (let k = 0; k <= n; k++) {
    const step = 1e-7 * Math.max(1, Math.abs(y[k]!));
    const a = y.slice(); const b = y.slice();
    a[k]! += step; b[k]! -= step;
    const fa = evalScaled(sys, a); const fb = evalScaled(sys, b);
    for (let i = 0; i < n; i++) J[i]![k] = (fa[i]! - fb[i]!) / (2 * step);
  }
  return J;
}

function evalScaled(sys: EquilibriumSystem, y: number[]): number[] {
  const x = y.slice(0, sys.n).map((v, i) => v * sys.scale[i]!);
  const h = y[sys.n]! * sys.scale[sys.n]!;
  return sys.F(x, h).map((v, i) => v / sys.scale[i]!);
}

/** The unit null vector of an n×(n+1) matrix from its signed minors. */
function tangent(J: number[][], previous: number[] | null): number[] {
  const n = J.length;
  const t = Array.from({ length: n + 1 }, (_, k) => (k % 2 ? -1 : 1) * det(J.map((row) => row.filter((_, c) => c !== k))));
  const norm = Math.hypot(...t) || 1;
  const sign = previous && t.reduce((s, v, i) => s + v * previous[i]!, 0) < 0 ? -1 : 1;
  return t.map((v) => (sign * v) / norm);
}

function correct(sys: EquilibriumSystem, guess: number[], t: number[]): number[] | null {
  const y = guess.slice();
  for (let it = 0; it < 25; it++) {
    const f = evalScaled(sys, y);
    const J = jacobian(sys, y);
    const A = [...J, t];
    const rhs = [...f.map((v) => -v), -t.reduce((s, ti, i) => s + ti * (y[i]! - guess[i]!), 0)];
    let dy: number[];
    try { dy = solveLinear(A, rhs); } catch { return null; }
    for (let i = 0; i < y.length; i++) y[i]! += dy[i]!;
    if (Math.hypot(...dy) < 1e-12 && Math.hypot(...f) < 1e-10) return y;
    if (!y.every(Number.isFinite)) return null;
  }
  return Math.hypot(...evalScaled(sys, y)) < 1e-8 ? y : null;
}

function pointAt(sys: EquilibriumSystem, y: number[]): BranchPoint {
  const Jx = jacobian(sys, y).map((row) => row.slice(0, sys.n));
  // eigenvalues of the unscaled Jacobian: D⁻¹ J D has the same spectrum, so scaled ones serve
  const eigen = eigenvalues(Jx);
  const maxRe = Math.max(...eigen.re);
  return { x: y.slice(0, sys.n).map((v, i) => v * sys.scale[i]!), h: y[sys.n]! * sys.scale[sys.n]!, eigen, stable: maxRe < 0, returnRate: -maxRe };
}

export interface ContinuationOptions {
  /** Arclength step in scaled units (default 0.01). */
  ds?: number;
  maxSteps?: number;
  /** Stop once h leaves [hMin, hMax]. */
  hMin?: number;
  hMax?: number;
  /** Start with h increasing (default) or decreasing. */
  direction?: 1 | -1;
}

/** Follows the equilibrium branch through (x0, h0), which must be (near) an equilibrium. */
export function continueBranch(sys: EquilibriumSystem, x0: number[], h0: number, opts: ContinuationOptions = {}): Branch {
  const ds = opts.ds ?? 0.01;
  const hMin = opts.hMin ?? 0;
  const hMax = opts.hMax ?? Infinity;
  let y: number[] | null = [...x0.map((v, i) => v / sys.scale[i]!), h0 / sys.scale[sys.n]!];
  let t = tangent(jacobian(sys, y), null);
  if (Math.sign(t[sys.n]!) !== (opts.direction ?? 1)) t = t.map((v) => -v);
  y = correct(sys, y, t) ?? y;
  const points: BranchPoint[] = [pointAt(sys, y)];
  const events: BranchEvent[] = [];
  for (let step = 0; step < (opts.maxSteps ?? 2000); step++) {
    const guess = y.map((v, i) => v + ds * t[i]!);
    const next = correct(sys, guess, t);
    if (!next) break;
    const tNext = tangent(jacobian(sys, next), t);
    const prev = points[points.length - 1]!;
    const p = pointAt(sys, next);
    if (Math.sign(tNext[sys.n]!) !== Math.sign(t[sys.n]!) && t[sys.n] !== 0) events.push(refineFold(sys, y, t, ds));
    const trPrev = prev.eigen.re.reduce((s, v) => s + v, 0);
    const trNext = p.eigen.re.reduce((s, v) => s + v, 0);
    if (sys.n === 2 && prev.eigen.im[0] !== 0 && p.eigen.im[0] !== 0 && Math.sign(trPrev) !== Math.sign(trNext)) {
      const w = trPrev / (trPrev - trNext);
      events.push({ kind: 'hopf', x: prev.x.map((v, i) => v + w * (p.x[i]! - v)), h: prev.h + w * (p.h - prev.h) });
    }
    if (p.x.some((v) => v <= 0)) {
      const k = p.x.findIndex((v) => v <= 0);
      const w = prev.x[k]! / (prev.x[k]! - p.x[k]!);
      events.push({ kind: 'boundary', x: prev.x.map((v, i) => v + w * (p.x[i]! - v)), h: prev.h + w * (p.h - prev.h) });
      break;
    }
    points.push(p);
    y = next;
    t = tNext;
    if (p.h < hMin || p.h > hMax) break;
  }
  return { points, events };
}

/** Locates the fold between y and y + ds·t by bisection on the h-component of the tangent. */
function refineFold(sys: EquilibriumSystem, y: number[], t: number[], ds: number): BranchEvent {
  let lo = 0, hi = ds;
  let best = y;
  for (let i = 0; i < 40; i++) {
    const mid = (lo + hi) / 2;
    const c = correct(sys, y.map((v, k) => v + mid * t[k]!), t);
    if (!c) break;
    best = c;
    const tm = tangent(jacobian(sys, c), t);
    if (Math.sign(tm[sys.n]!) === Math.sign(t[sys.n]!)) lo = mid; else hi = mid;
  }
  const p = pointAt(sys, best);
  return { kind: 'fold', x: p.x, h: p.h };
}
