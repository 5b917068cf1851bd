/**
 * What a reserve design does for a sedentary stock: the equilibrium map, the yield of the fished
 * cells, the spillover across reserve edges, persistence, the fishing rate at which the stock is lost
 * (extinction for logistic growth, a fold for growth with an Allee effect), and the critical reserve length.
 */
import { GROWTH, type Growth, type SpatialParams } from './growth';
import { cellArea, coastHabitat, habitatFromMask, type Habitat } from './habitat';
import { equilibrium, principalRate, totalStock, type RdProblem } from './reaction-diffusion';

export interface DesignResult {
  /** Equilibrium density per habitable cell, in the habitat's unknown order. */
  density: number[];
  total: number;
  /** Catch per year from the fished cells: Σ F·u·area. */
  yield: number;
  /** Net flow per year from reserve cells into fished cells across their shared faces. */
  spillover: number;
  persists: boolean;
  /** Growth rate of a sparse stock (principal eigenvalue at zero); persistence needs it above 0 under logistic growth. */
  sparseGrowthRate: number;
  converged: boolean;
}

/** Equilibrium and its figures for one design at fishing mortality F outside reserves, from the unfished stock. */
export function evaluateDesign(hab: Habitat, growth: Growth, params: SpatialParams, F: number, start?: ArrayLike<number>): DesignResult {
  const pb: RdProblem = { hab, growth, params, F };
  const eq = equilibrium(pb, start ?? new Float64Array(hab.cells.length).fill(params.K));
  const u = eq.u;
  const area = cellArea(hab);
  let caught = 0;
  for (let i = 0; i < u.length; i++) if (!hab.reserve[i]) caught += F * u[i]! * area;
  // a face between cells has length h on a grid (and is a point on a coast)
  const faceLength = hab.ny > 1 ? hab.h : 1;
  let spill = 0;
  for (let e = 0; e < hab.faces.length; e += 2) {
    const i = hab.faces[e]!, j = hab.faces[e + 1]!;
    if (hab.reserve[i] === hab.reserve[j]) continue;
    const [res, fished] = hab.reserve[i] ? [i, j] : [j, i];
    spill += (params.D * (u[res]! - u[fished]!) / hab.h) * faceLength;
  }
  const total = totalStock(hab, u);
  const lambda = principalRate(pb);
  // why: past a fold the iteration drifts through the ghost of the lost equilibrium without converging
  const persists = eq.converged && total > 1e-6 * params.K * hab.cells.length * area;
  return { density: Array.from(u), total, yield: caught, spillover: spill, persists, sparseGrowthRate: lambda, converged: eq.converged };
}

export interface SweepPoint {
  F: number;
  total: number;
  yield: number;
}

export interface FishingSweep {
  points: SweepPoint[];
  /** Fishing mortality outside at which the stock is lost (null if it survives the whole range). */
  criticalF: number | null;
  kind: 'extinction' | 'fold' | null;
  /** Fishing mortality giving the largest yield on the sweep. */
  bestF: number;
}

/** Equilibria as F rises (each from the last), and where the stock is lost. */
export function fishingSweep(hab: Habitat, growth: Growth, params: SpatialParams, fMax: number, steps = 30): FishingSweep {
  const points: SweepPoint[] = [];
  let prev: number[] | undefined;
  let lostBetween: [number, number] | null = null;
  for (let s = 0; s <= steps; s++) {
    const F = (fMax * s) / steps;
    const d = evaluateDesign(hab, growth, params, F, prev);
    points.push({ F, total: d.total, yield: d.yield });
    if (!d.persists && !lostBetween) lostBetween = [points[s - 1]?.F ?? 0, F];
    prev = d.persists ? d.density : prev;
  }
  const best = points.reduce((b, p) => (p.yield > b.yield ? p : b), points[0]!);
  if (!lostBetween) return { points, criticalF: null, kind: null, bestF: best.F };
  if (growth.linearDetermined) {
    // logistic growth: the stock is lost where the sparse growth rate crosses zero (transcritical point)
    const rate = (F: number) => principalRate({ hab, growth, params, F });
    return { points, criticalF: bisect(rate, 0, fMax), kind: 'extinction', bestF: best.F };
  }
  // depensation: the branch followed from the lower F ends at a fold
  let [lo, hi] = lostBetween;
  let state = prev;
  for (let i = 0; i < 40; i++) {
    const mid = 0.5 * (lo + hi);
    const d = evaluateDesign(hab, growth, params, mid, state);
    if (d.persists) { lo = mid; state = d.density; } else hi = mid;
  }
  return { points, criticalF: 0.5 * (lo + hi), kind: 'fold', bestF: best.F };
}

/** Root of a decreasing function on [a, b] by bisection; null when it keeps one sign. */
function bisect(f: (x: number) => number, a: number, b: number): number | null {
  let fa = f(a);
  const fb = f(b);
  if (fa <= 0) return a;
  if (fb > 0) return null;
  let lo = a, hi = b;
  for (let i = 0; i < 60; i++) {
    const mid = 0.5 * (lo + hi);
    const fm = f(mid);
    if (fm > 0) { lo = mid; fa = fm; } else hi = mid;
  }
  return 0.5 * (lo + hi);
}

export interface CriticalLengthOptions {
  /** Coast length (km); the reserve is centred at `centre`. */
  coast: number;
  centre: number;
  /** Fishing mortality outside, or null for uninhabitable surroundings (nothing survives outside). */
  F: number | null;
  /** Cells across the reserve (accuracy of the discretisation). */
  reserveCells?: number;
}

/** A coast with one reserve of length ℓ, laid out so that the reserve edges fall on cell faces. */
function singleReserveCoast(o: CriticalLengthOptions & { r: number; D: number }, len: number): Habitat {
  const n = o.reserveCells ?? 100;
  if (o.F === null) return coastHabitat(len, n, [[0, len]], 'lethal');
  // why: beyond fifteen decay lengths √(D/(F − r)) of the edge a sparse stock's profile is below e^-30
  const reach = 15 * Math.sqrt(o.D / Math.max(o.F - o.r, 1e-12));
  const from = Math.max(0, o.centre - len / 2), to = Math.min(o.coast, o.centre + len / 2);
  const left = Math.min(reach, from), right = Math.min(reach, o.coast - to);
  const inside = to - from;
  const h = inside / n;
  const nl = Math.round(left / h), nr = Math.round(right / h);
  const row = [...Array(nl).fill(1), ...Array(n).fill(2), ...Array(nr).fill(1)] as (1 | 2)[];
  return habitatFromMask([row], h, 'closed');
}

/**
 * Shortest reserve (same centre) on which a sparse stock grows: λ₁ = 0 of D·Δ + r − F·1_outside.
 * 0 when the stock persists without a reserve (F ≤ r), null when not even the whole coast suffices.
 */
export function criticalLength(params: SpatialParams, o: CriticalLengthOptions): number | null {
  const growth = GROWTH.logistic;
  if (o.F !== null && o.F <= params.r) return 0;
  const rate = (len: number) => principalRate({ hab: singleReserveCoast({ ...o, r: params.r, D: params.D }, len), growth, params, F: o.F ?? 0 });
  const top = o.F === null ? Math.max(o.coast, 10 * Math.PI * Math.sqrt(params.D / params.r)) : o.coast;
  if (rate(top) <= 0) return null;
  let lo = 1e-6 * top, hi = top;
  for (let i = 0; i < 50; i++) {
    const mid = 0.5 * (lo + hi);
    if (rate(mid) > 0) hi = mid; else lo = mid;
  }
  return 0.5 * (lo + hi);
}
