/**
 * Equilibria of a surplus-production model under constant harvest h, their stability, and the
 * fold (saddle-node) h* where the stable equilibrium and the unstable threshold meet, found by
 * numerical continuation (and exactly for the logistic: h* = rK/4, Clark 1990).
 */
import { continueBranch } from '../numerics/continuation';
import { production, productionSlope, type SurplusModelName, type SurplusParams } from './surplus';

export interface FoldPoint {
  h: number;
  /** Stable equilibrium (upper branch) at this harvest. */
  stable: number;
  /** Unstable threshold (lower branch) at this harvest. */
  unstable: number;
  /** −g'(B+) at the stable equilibrium: 0 at the fold. */
  returnRate: number;
}

export interface FoldAnalysis {
  hStar: number;
  /** Biomass at the fold. */
  bFold: number;
  /** Both branches on a common grid of harvests from 0 to h*. */
  table: FoldPoint[];
}

/** Continues the equilibrium from (K, 0) up the stable branch, round the fold, down the unstable one. */
export function surplusFold(model: SurplusModelName, params: SurplusParams, gridSize = 80): FoldAnalysis {
  const { K } = params;
  const sys = { n: 1, F: ([B]: number[], h: number) => [production(model, params, B!) - h], scale: [K, params.r * K] };
  const branch = continueBranch(sys, [K], 0, { ds: 0.02, hMin: -1e-9, maxSteps: 5000 });
  const fold = branch.events.find((e) => e.kind === 'fold');
  if (!fold) throw new Error('no fold found along the equilibrium branch');
  const hStar = fold.h;
  const bFold = fold.x[0]!;
  const table: FoldPoint[] = [];
  for (let i = 0; i <= gridSize; i++) {
    const h = (hStar * i) / gridSize;
    const stable = i === gridSize ? bFold : bisectRoot((B) => production(model, params, B) - h, bFold, K);
    const unstable = i === gridSize ? bFold : i === 0 ? 0 : bisectRoot((B) => production(model, params, B) - h, 1e-12 * K, bFold);
    table.push({ h, stable, unstable, returnRate: Math.max(0, -productionSlope(model, params, stable)) });
  }
  return { hStar, bFold, table };
}

/** Both equilibria and the return rate at one harvest; null past the fold. */
export function equilibriaAt(model: SurplusModelName, params: SurplusParams, fold: FoldAnalysis, h: number): FoldPoint | null {
  if (h > fold.hStar) return null;
  if (h <= 0) return { h, stable: params.K, unstable: 0, returnRate: -productionSlope(model, params, params.K) };
  const stable = bisectRoot((B) => production(model, params, B) - h, fold.bFold, params.K);
  const unstable = bisectRoot((B) => production(model, params, B) - h, 1e-12 * params.K, fold.bFold);
  return { h, stable, unstable, returnRate: Math.max(0, -productionSlope(model, params, stable)) };
}

/** Root of f on [a, b] by bisection (f changes sign, or is zero at an end). */
export function bisectRoot(f: (x: number) => number, a: number, b: number): number {
  let fa = f(a);
  if (fa === 0) return a;
  let lo = a, hi = b;
  for (let i = 0; i < 200 && hi - lo > 1e-13 * Math.max(1, Math.abs(hi)); i++) {
    const mid = (lo + hi) / 2;
    const fm = f(mid);
    if (fm === 0) return mid;
    if (Math.sign(fm) === Math.sign(fa)) { lo = mid; fa = fm; } else hi = mid;
  }
  return (lo + hi) / 2;
}
