/** Jitter: refit from perturbed starts and count how many reach the best likelihood (common practice in assessment reviews). */
import { fitSurplusRaw, type SurplusFitOptions } from '../surplus/fit-surplus';
import { createRng } from '../numerics/random';
import type { StockSeries } from '../data/series';

export interface Jitter {
  starts: number;
  /** Refits within `tolerance` of the best objective found. */
  reachingBest: number;
  tolerance: number;
  /** Objective of the reported fit and the best any start found. */
  fitNll: number;
  bestNll: number;
  /** Objective reached from each start. */
  values: number[];
  /** Relative spread of r among the starts reaching the best objective. */
  rSpread: number;
}

/** Refits from `n` starts drawn around the fitted point (normal, sd `sd` on the free scale), seeded. */
export function jitterFit(series: StockSeries, opts: SurplusFitOptions, free: number[], fitNll: number, n: number, seed: number, sd = 0.5): Jitter {
  const rng = createRng((seed * 2654435761) >>> 0);
  const values: number[] = [];
  const rs: number[] = [];
  for (let i = 0; i < n; i++) {
    const initial = free.map((u) => u + sd * rng.normal());
    const raw = fitSurplusRaw(series, { ...opts, initial });
    values.push(raw.nll);
    rs.push(raw.problem.decode(raw.u).r);
  }
  const tolerance = 0.01;
  const bestNll = Math.min(fitNll, ...values);
  const best = rs.filter((_, i) => values[i]! - bestNll < tolerance);
  const rSpread = best.length ? (Math.max(...best) - Math.min(...best)) / (best.reduce((s, v) => s + v, 0) / best.length) : 0;
  return { starts: n, reachingBest: best.length, tolerance, fitNll, bestNll, values, rSpread };
}
