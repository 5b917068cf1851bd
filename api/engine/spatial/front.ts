/**
 * The recovery front on a coast: after a collapse the stock survives in the reserve only; with the
 * fishery closed (or fished at F), it spreads back along the coast. For logistic growth the front
 * speed tends to 2√((r − F)D) (Fisher 1937; Kolmogorov, Petrovsky & Piskunov 1937), approached from
 * below as t grows (Bramson 1983); the engine reports the speed it measures on the given coast.
 */
import type { Growth, SpatialParams } from './growth';
import type { Habitat } from './habitat';
import { integrateRd, totalStock } from './reaction-diffusion';

export interface RecoveryFront {
  /** Measured front speed (km/yr), or null when the front does not cross the measuring stretch. */
  speed: number | null;
  /** 2√((r − F)D) for pulled (logistic) fronts, null otherwise or when F ≥ r. */
  theory: number | null;
  /** Front position (km from the reserve edge) against time, for a chart. */
  track: { t: number; x: number }[];
  /** Years until the stock holds 90% of `target`, or null within the horizon. */
  yearsTo90: number | null;
}

export interface FrontOptions {
  /** Fishing mortality outside reserves while the stock recovers (0: fishery closed). */
  F: number;
  years: number;
  dt?: number;
  /** Total stock of the equilibrium the stock recovers towards (for yearsTo90). */
  target?: number;
  /** Measure the speed while the front is between these fractions of the longest stretch of fished coast. */
  window?: [number, number];
}

/** Spreads a stock from the reserve cells of a coast (density K there, zero elsewhere) and tracks its front. */
export function recoveryFront(hab: Habitat, growth: Growth, params: SpatialParams, o: FrontOptions): RecoveryFront {
  if (hab.ny !== 1) throw new Error('the recovery front is measured on a coast');
  const n = hab.cells.length;
  const resCells = [...Array(n).keys()].filter((i) => hab.reserve[i]);
  if (resCells.length === 0) throw new Error('the design has no reserve to recover from');
  // measure along the longest fished stretch, from the reserve edge that borders it
  const firstRes = resCells[0]!, lastRes = resCells[resCells.length - 1]!;
  const rightward = n - 1 - lastRes >= firstRes;
  const edgeCell = rightward ? lastRes : firstRes;
  const stretch = (rightward ? n - 1 - lastRes : firstRes) * hab.h;
  const level = 0.5 * params.K * Math.max(0, 1 - o.F / params.r);
  const u0 = new Float64Array(n);
  for (const i of resCells) u0[i] = params.K;
  const track: { t: number; x: number }[] = [];
  let yearsTo90: number | null = null;
  integrateRd({ hab, growth, params, F: o.F }, u0, o.years, {
    dt: o.dt ?? Math.min(0.05, o.years / 200),
    refreshEvery: 5,
    onStep: (t, u) => {
      const x = frontPosition(u, edgeCell, rightward ? 1 : -1, level, hab.h);
      if (x !== null) track.push({ t, x });
      if (yearsTo90 === null && o.target && totalStock(hab, u) >= 0.9 * o.target) yearsTo90 = t;
    },
  });
  const [a, b] = o.window ?? [0.25, 0.85];
  const inWindow = track.filter((p) => p.x >= a * stretch && p.x <= b * stretch);
  const speed = inWindow.length >= 3 ? slope(inWindow) : null;
  const theory = growth.linearDetermined && o.F < params.r ? 2 * Math.sqrt((params.r - o.F) * params.D) : null;
  return { speed, theory, track: thin(track, 200), yearsTo90 };
}

/** Distance from the reserve edge to where density first falls below `level`, interpolated between cell centres. */
function frontPosition(u: ArrayLike<number>, edge: number, dir: 1 | -1, level: number, h: number): number | null {
  for (let k = 1; ; k++) {
    const i = edge + dir * k;
    if (i < 0 || i >= u.length) return null;
    if (u[i]! < level) {
      const prev = u[i - dir]!;
      const frac = prev === u[i]! ? 0 : (prev - level) / (prev - u[i]!);
      return (k - 1 + frac) * h;
    }
  }
}

function slope(p: { t: number; x: number }[]): number {
  const mt = p.reduce((s, q) => s + q.t, 0) / p.length;
  const mx = p.reduce((s, q) => s + q.x, 0) / p.length;
  let sxy = 0, sxx = 0;
  for (const q of p) { sxy += (q.t - mt) * (q.x - mx); sxx += (q.t - mt) ** 2; }
  return sxy / sxx;
}

function thin<T>(xs: T[], n: number): T[] {
  if (xs.length <= n) return xs;
  return Array.from({ length: n }, (_, i) => xs[Math.round((i * (xs.length - 1)) / (n - 1))]!);
}
