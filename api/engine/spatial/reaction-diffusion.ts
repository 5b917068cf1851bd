/**
 * Reaction-diffusion of a sedentary stock by the method of lines: on every habitable cell,
 * du/dt = D·Δu + g(u) − F·u (F only outside reserves), with the five-point (three-point on a coast)
 * finite-volume Laplacian. Time steps use the L-stable two-stage Rosenbrock method ROS2
 * (Verwer, Spee, Blom & Hundsdorfer 1999, SIAM J. Sci. Comput. 20:1456) with banded LU solves;
 * equilibria use pseudo-transient continuation (Kelley & Keyes 1998, SIAM J. Numer. Anal. 35:508).
 */
import { BandMatrix, bandLu, bandSolve, type BandLu } from '../numerics/banded';
import type { Growth, SpatialParams } from './growth';
import type { Habitat } from './habitat';

export interface RdProblem {
  hab: Habitat;
  growth: Growth;
  params: SpatialParams;
  /** Fishing mortality outside reserves (1/yr). */
  F: number;
}

const fishing = (pb: RdProblem, i: number) => (pb.hab.reserve[i] ? 0 : pb.F);

/** G(u) = D·Δu + g(u) − F·u for every cell. */
export function rhs(pb: RdProblem, u: ArrayLike<number>): Float64Array {
  const { hab, growth, params } = pb;
  const n = hab.cells.length;
  const k = params.D / (hab.h * hab.h);
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = growth.g(u[i]!, params) - fishing(pb, i) * u[i]! - 2 * k * hab.lethalFaces[i]! * u[i]!;
  const f = hab.faces;
  for (let e = 0; e < f.length; e += 2) {
    const i = f[e]!, j = f[e + 1]!;
    const flow = k * (u[j]! - u[i]!);
    out[i]! += flow;
    out[j]! -= flow;
  }
  return out;
}

/** The banded matrix c·I + s·J(u), J the Jacobian of G (s = −γΔt gives a Rosenbrock matrix). */
export function shiftedJacobian(pb: RdProblem, u: ArrayLike<number> | null, c: number, s: number): BandMatrix {
  const { hab, growth, params } = pb;
  const n = hab.cells.length;
  const k = params.D / (hab.h * hab.h);
  const M = new BandMatrix(n, hab.band, hab.band);
  for (let i = 0; i < n; i++) {
    const local = growth.dg(u ? u[i]! : 0, params) - fishing(pb, i) - 2 * k * hab.lethalFaces[i]!;
    M.set(i, i, c + s * local);
  }
  const f = hab.faces;
  for (let e = 0; e < f.length; e += 2) {
    const i = f[e]!, j = f[e + 1]!;
    M.add(i, i, -s * k); M.add(j, j, -s * k);
    M.add(i, j, s * k); M.add(j, i, s * k);
  }
  return M;
}

const GAMMA = 1 + 1 / Math.SQRT2;

export interface IntegrateOptions {
  dt: number;
  /** Recompute and factorise the Jacobian every this many steps (ROS2 keeps order 2 with an old one). */
  refreshEvery?: number;
  /** Set negative densities to zero after each step (off for pure diffusion checks). */
  nonNegative?: boolean;
  /** Called after every step; return false to stop. */
  onStep?: (t: number, u: Float64Array) => boolean | void;
}

/** Integrates from t = 0 to t1 with ROS2 at a fixed step. */
export function integrateRd(pb: RdProblem, u0: ArrayLike<number>, t1: number, o: IntegrateOptions): Float64Array {
  const steps = Math.max(1, Math.ceil(t1 / o.dt - 1e-9));
  const dt = t1 / steps;
  const refresh = o.refreshEvery ?? 1;
  const clamp = o.nonNegative !== false;
  const n = u0.length;
  let u = Float64Array.from(u0 as ArrayLike<number>);
  const mid = new Float64Array(n);
  let lu: BandLu | null = null;
  for (let s = 0; s < steps; s++) {
    if (!lu || s % refresh === 0) lu = bandLu(shiftedJacobian(pb, u, 1, -GAMMA * dt));
    const k1 = bandSolve(lu, rhs(pb, u));
    for (let i = 0; i < n; i++) mid[i] = u[i]! + dt * k1[i]!;
    const g2 = rhs(pb, mid);
    for (let i = 0; i < n; i++) g2[i]! -= 2 * k1[i]!;
    const k2 = bandSolve(lu, g2);
    const next = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const v = u[i]! + dt * (1.5 * k1[i]! + 0.5 * k2[i]!);
      next[i] = clamp && v < 0 ? 0 : v;
    }
    u = next;
    if (o.onStep?.((s + 1) * dt, u) === false) break;
  }
  return u;
}

export interface Equilibrium {
  u: Float64Array;
  converged: boolean;
  iterations: number;
  /** Largest |G(u)| at the end, relative to r·K. */
  residual: number;
}

/** The equilibrium reached from u0, by pseudo-transient continuation (implicit Euler steps growing into Newton). */
export function equilibrium(pb: RdProblem, u0: ArrayLike<number>, maxIterations = 400): Equilibrium {
  const { r, K } = pb.params;
  const scale = r * K;
  let u = Float64Array.from(u0 as ArrayLike<number>);
  let G = rhs(pb, u);
  let norm = maxAbs(G);
  let dt = 0.2 / r;
  for (let it = 1; it <= maxIterations; it++) {
    if (norm <= 1e-11 * scale) return { u, converged: true, iterations: it - 1, residual: norm / scale };
    let delta: Float64Array;
    try {
      delta = bandSolve(bandLu(shiftedJacobian(pb, u, 1 / dt, -1)), G);
    } catch {
      dt *= 0.25;
      continue;
    }
    const next = u.map((v, i) => Math.max(0, v + delta[i]!));
    const Gn = rhs(pb, next);
    const nn = maxAbs(Gn);
    // switched evolution relaxation: the step grows as the residual falls
    dt = Math.min(1e12, dt * Math.min(10, Math.max(0.2, norm / Math.max(nn, 1e-300))));
    u = next;
    G = Gn;
    norm = nn;
  }
  return { u, converged: norm <= 1e-8 * scale, iterations: maxIterations, residual: norm / scale };
}

/**
 * Principal eigenvalue of the linearisation at u = 0, D·Δ + g'(0) − F: the growth rate of a sparse
 * stock. It is symmetric, and g'(0) − F bounds its spectrum from above (Gershgorin), so inverse
 * iteration shifted there converges to it; the Rayleigh quotient is returned.
 */
export function principalRate(pb: RdProblem): number {
  const n = pb.hab.cells.length;
  let top = -Infinity;
  for (let i = 0; i < n; i++) top = Math.max(top, pb.growth.dg(0, pb.params) - fishing(pb, i));
  const sigma = top + 1e-9 * (Math.abs(top) + pb.params.D / (pb.hab.h * pb.hab.h));
  const lu = bandLu(shiftedJacobian(pb, null, sigma, -1));
  let v: Float64Array = new Float64Array(n).fill(1 / Math.sqrt(n));
  let lambda = NaN;
  for (let it = 0; it < 3000; it++) {
    const w = bandSolve(lu, v);
    let len = 0;
    for (let i = 0; i < n; i++) len += w[i]! * w[i]!;
    len = Math.sqrt(len);
    v = w.map((x) => x / len);
    const Mv = rhs({ ...pb, growth: { ...pb.growth, g: (u, p) => pb.growth.dg(0, p) * u } }, v);
    let q = 0;
    for (let i = 0; i < n; i++) q += v[i]! * Mv[i]!;
    if (Math.abs(q - lambda) <= 1e-14 * (Math.abs(q) + pb.params.r)) return q;
    lambda = q;
  }
  return lambda;
}

function maxAbs(x: ArrayLike<number>): number {
  let m = 0;
  for (let i = 0; i < x.length; i++) m = Math.max(m, Math.abs(x[i]!));
  return m;
}

/** Total stock: Σ u·cell area. */
export function totalStock(hab: Habitat, u: ArrayLike<number>): number {
  const a = hab.ny > 1 ? hab.h * hab.h : hab.h;
  let s = 0;
  for (let i = 0; i < u.length; i++) s += u[i]!;
  return s * a;
}
