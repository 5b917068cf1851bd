/**
 * What a food chain does in the long run and how far ahead it can be projected: the attractor, a
 * Poincaré section, the Lyapunov spectrum, the predictability horizon and the successive maxima of
 * the top predator as the fishing mortality on one level rises.
 */
import { lyapunovSpectrum } from '../numerics/lyapunov';
import { chainYear, foodChainJacobian, foodChainRhs, type ChainHarvest, type FoodChainParams } from './food-chain';

export interface Attractor {
  /** States sampled every `step` years after the transient. */
  points: number[][];
  step: number;
  /** Standard deviation of ln biomass of each level on the attractor (0 for a level that died out). */
  logSd: number[];
  mean: number[];
}

/** Samples the long-run behaviour after a transient. */
export function sampleAttractor(p: FoodChainParams, y0: number[], h: ChainHarvest, opts: { transient: number; years: number; step: number }): Attractor {
  let y = chainYear(p, y0, h, 0, opts.transient, 1e-8);
  const points: number[][] = [y.slice()];
  const n = Math.round(opts.years / opts.step);
  for (let i = 0; i < n; i++) {
    y = chainYear(p, y, h, 0, opts.step, 1e-8);
    points.push(y.slice());
  }
  const logSd = [0, 1, 2].map((k) => {
    const v = points.map((q) => q[k]!).filter((b) => b > 0).map(Math.log);
    if (v.length < points.length) return 0;
    const m = v.reduce((a, b) => a + b, 0) / v.length;
    return Math.sqrt(v.reduce((a, b) => a + (b - m) ** 2, 0) / (v.length - 1));
  });
  const mean = [0, 1, 2].map((k) => points.reduce((a, q) => a + q[k]!, 0) / points.length);
  return { points, step: opts.step, logSd, mean };
}

/** Crossings of the plane Y = mean(Y) with Y falling: (X, Z) at each crossing, by linear interpolation. */
export function poincareSection(a: Attractor): { prey: number; top: number }[] {
  const c = a.mean[1]!;
  const out: { prey: number; top: number }[] = [];
  for (let i = 1; i < a.points.length; i++) {
    const p = a.points[i - 1]!, q = a.points[i]!;
    if (p[1]! > c && q[1]! <= c) {
      const w = (p[1]! - c) / (p[1]! - q[1]!);
      out.push({ prey: p[0]! + w * (q[0]! - p[0]!), top: p[2]! + w * (q[2]! - p[2]!) });
    }
  }
  return out;
}

/** Lyapunov exponents per year, largest first (Benettin et al. 1980), from a state on or near the attractor. */
export function chainLyapunov(p: FoodChainParams, y0: number[], h: ChainHarvest, opts: { transient?: number; time?: number; onProgress?: (f: number) => void } = {}): number[] {
  // the exponents are computed in years directly (the right-hand side is in years)
  const res = lyapunovSpectrum(foodChainRhs(p, h), foodChainJacobian(p, h), y0, {
    transient: opts.transient ?? 2000 / p.r, time: opts.time ?? 20000 / p.r, interval: 5 / p.r, tol: 1e-8, onProgress: opts.onProgress,
  });
  return res.exponents;
}

/**
 * Predictability horizon in years: the time for an initial relative error (the survey error) to grow
 * to the stock's own fluctuations (the smallest standard deviation of ln biomass among the living
 * levels), ln(tolerance / error) / λ₁. Infinite when λ₁ ≤ 0 (errors do not grow).
 */
export function predictabilityHorizon(lambda1: number, error: number, tolerance: number): number {
  if (!(error > 0)) throw new Error('the initial error must be positive');
  if (!(lambda1 > 0)) return Infinity;
  if (tolerance <= error) return 0;
  return Math.log(tolerance / error) / lambda1;
}

export type Regime = 'equilibrium' | 'cycle' | 'chaos' | 'collapse';

export interface MaximaColumn {
  rate: number;
  /** Successive local maxima of the top predator on the attractor (biomass). */
  maxima: number[];
  regime: Regime;
  /** Mean annual catch on the attractor at this fishing mortality (all levels). */
  meanCatch: number;
}

/**
 * Successive maxima of the top predator against the fishing mortality on one level, with the regime
 * read from them: no oscillation (equilibrium), a few repeated maxima (cycle), many distinct ones
 * (chaos), or a level lost (collapse).
 */
export function maximaDiagram(p: FoodChainParams, y0: number[], level: 0 | 1 | 2, rates: number[], opts: { transient: number; years: number; onProgress?: (f: number) => void }): MaximaColumn[] {
  const step = 0.5 / p.r;
  return rates.map((F, idx) => {
    const rateVec: [number, number, number] = [0, 0, 0];
    rateVec[level] = F;
    const a = sampleAttractor(p, y0, { rates: rateVec }, { transient: opts.transient, years: opts.years, step });
    opts.onProgress?.((idx + 1) / rates.length);
    const z = a.points.map((q) => q[2]!);
    const meanCatch = a.mean[level]! * F;
    const scale = [p.K, p.yScale, p.zScale];
    if (a.points[a.points.length - 1]!.some((v, k) => v < 1e-6 * scale[k]!)) return { rate: F, maxima: [], regime: 'collapse' as const, meanCatch };
    const maxima: number[] = [];
    for (let i = 1; i < z.length - 1; i++) {
      if (!(z[i]! > z[i - 1]! && z[i]! >= z[i + 1]!)) continue;
      // the vertex of the parabola through the three samples
      const c2 = (z[i - 1]! - 2 * z[i]! + z[i + 1]!) / 2, c1 = (z[i + 1]! - z[i - 1]!) / 2;
      maxima.push(c2 < 0 ? z[i]! - (c1 * c1) / (4 * c2) : z[i]!);
    }
    const range = Math.max(...z) - Math.min(...z);
    if (maxima.length < 2 || range < 1e-4 * Math.max(...z)) return { rate: F, maxima, regime: 'equilibrium' as const, meanCatch };
    // maxima on a grid of 0.2% of the largest value: a cycle fills a few cells, chaos a band of them
    const cells = new Set(maxima.map((m) => Math.round(m / (2e-3 * Math.max(...z)))));
    return { rate: F, maxima, regime: cells.size <= 12 ? 'cycle' as const : 'chaos' as const, meanCatch };
  });
}
