/**
 * Three-species food chain with type II responses (Hastings & Powell 1991, Ecology 72:896), in
 * biomass units: prey X = K·x, intermediate predator Y = Yscale·y, top predator Z = Zscale·z and
 * time in years t = τ/r, where the dimensionless chain is
 *   dx/dτ = x(1 − x) − f₁(x)·y,   dy/dτ = f₁(x)·y − f₂(y)·z − d₁y,   dz/dτ = f₂(y)·z − d₂z,
 *   fᵢ(u) = aᵢu/(1 + bᵢu).
 * Harvest on any level: a fishing mortality F (per year) and/or a constant catch (biomass per year).
 * A level that reaches zero stays at zero; the others follow their own dynamics.
 */
import { integrate } from '../numerics/ode';

export interface FoodChainParams {
  /** Prey growth rate per year (sets the time scale). */
  r: number;
  K: number;
  yScale: number;
  zScale: number;
  a1: number; b1: number; a2: number; b2: number; d1: number; d2: number;
}

export interface ChainHarvest {
  /** Fishing mortality per year on prey, intermediate and top predator. */
  rates?: [number, number, number];
  /** Constant catches per year on each level. */
  catches?: [number, number, number];
}

/** Hastings & Powell (1991) published shape: chaotic for b₁ between about 2.2 and 3.2. */
export const HASTINGS_POWELL = { a1: 5, b1: 3, a2: 0.1, b2: 2, d1: 0.4, d2: 0.01 } as const;

export const LEVELS = ['prey', 'intermediate', 'top'] as const;

const scales = (p: FoodChainParams) => [p.K, p.yScale, p.zScale];

/** Right-hand side in biomass per year; levels at or below zero neither grow, eat nor are caught. */
export function foodChainRhs(p: FoodChainParams, harvest: ChainHarvest = {}): (t: number, y: number[]) => number[] {
  const F = harvest.rates ?? [0, 0, 0];
  const C = harvest.catches ?? [0, 0, 0];
  const s = scales(p);
  return (_t, Y) => {
    const x = Math.max(Y[0]!, 0) / s[0]!, y = Math.max(Y[1]!, 0) / s[1]!, z = Math.max(Y[2]!, 0) / s[2]!;
    const f1 = (p.a1 * x) / (1 + p.b1 * x), f2 = (p.a2 * y) / (1 + p.b2 * y);
    const d = [x * (1 - x) - f1 * y, f1 * y - f2 * z - p.d1 * y, f2 * z - p.d2 * z];
    return d.map((v, i) => {
      const B = Math.max(Y[i]!, 0);
      return p.r * s[i]! * v - F[i]! * B - (B > 0 ? C[i]! : 0);
    });
  };
}

/** Analytic Jacobian in biomass units. */
export function foodChainJacobian(p: FoodChainParams, harvest: ChainHarvest = {}): (Y: number[]) => number[][] {
  const F = harvest.rates ?? [0, 0, 0];
  const s = scales(p);
  return (Y) => {
    const x = Y[0]! / s[0]!, y = Y[1]! / s[1]!, z = Y[2]! / s[2]!;
    const f1 = (p.a1 * x) / (1 + p.b1 * x), f2 = (p.a2 * y) / (1 + p.b2 * y);
    const g1 = p.a1 / (1 + p.b1 * x) ** 2, g2 = p.a2 / (1 + p.b2 * y) ** 2;
    const Jd = [
      [1 - 2 * x - g1 * y, -f1, 0],
      [g1 * y, f1 - g2 * z - p.d1, -f2],
      [0, g2 * z, f2 - p.d2],
    ];
    return Jd.map((row, i) => row.map((v, j) => (p.r * s[i]! * v) / s[j]! - (i === j ? F[i]! : 0)));
  };
}

/** Start-of-year biomass of the three levels under annual harvests; a level reaching zero stays at zero. */
export function foodChainPath(p: FoodChainParams, y0: number[], harvests: ChainHarvest[], tol = 1e-8): { levels: number[][]; collapseYear: number | null } {
  const levels: number[][] = [y0.slice()];
  let y = y0.map((v) => Math.max(v, 0));
  let collapseYear: number | null = null;
  harvests.forEach((h, i) => {
    y = chainYear(p, y, h, 0, 1, tol);
    if (collapseYear === null && y.some((v) => v === 0)) collapseYear = i;
    levels.push(y.slice());
  });
  return { levels, collapseYear };
}

/** Integrates from t0 to t1; living levels only, a level reaching zero is held there. */
export function chainYear(p: FoodChainParams, y0: number[], h: ChainHarvest, t0: number, t1: number, tol = 1e-8): number[] {
  const f = foodChainRhs(p, h);
  const y = y0.map((v) => Math.max(v, 0));
  let t = t0;
  while (t < t1) {
    const alive = [0, 1, 2].filter((k) => y[k]! > 0);
    if (alive.length === 0) break;
    const full = (z: number[]) => { const w = [0, 0, 0]; alive.forEach((k, i) => { w[k] = z[i]!; }); return w; };
    const g = (tt: number, z: number[]) => { const d = f(tt, full(z)); return alive.map((k) => d[k]!); };
    const res = integrate(g, t, alive.map((k) => y[k]!), t1, { tol, stopAtZero: true, maxSteps: 200_000, initialStep: Math.min(0.25, t1 - t) });
    alive.forEach((k, i) => { y[k] = res.y[i]! > 0 ? res.y[i]! : 0; });
    if (!res.collapsed) break;
    t = res.t;
  }
  return y;
}
