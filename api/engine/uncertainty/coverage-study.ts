/**
 * Simulation study of interval coverage: data sets simulated from a known Schaefer truth (with or
 * without process noise), each fitted, and the share whose 95% intervals of r, K, MSY and h*
 * contain the truth. Used by `npm run coverage` and by the seeded coverage spec.
 */
import { createRng } from '../numerics/random';
import { logisticHarvest } from '../surplus/logistic-harvest';
import { FitInputError, fitSurplusRaw } from '../surplus/fit-surplus';
import { PROFILE_DROP_95, profileInterval, smallSampleDrop } from '../fit/profile';
import type { StockSeries } from '../data/series';

export interface CoverageTruth {
  r: number;
  K: number;
  d0: number;
  q: number;
  /** Observation error sd on log index. */
  sdObs: number;
  /** Process error sd on log biomass (0: deterministic dynamics). */
  sdProc: number;
  years: number;
}

export const QUANTITIES = ['r', 'K', 'MSY', 'h*'] as const;

/** The study's truth: a Schaefer stock fished down past B_MSY and partly rebuilt (our invented design). */
export const STUDY_TRUTH: CoverageTruth = { r: 0.4, K: 10_000, d0: 0.9, q: 0.001, sdObs: 0.2, sdProc: 0, years: 40 };

/** Catches that rise to 1.4·MSY by year 20, then are cut to 0.6·MSY (a one-way trip and a partial rebuild). */
export function studyCatches(t: CoverageTruth): number[] {
  const msy = (t.r * t.K) / 4;
  return Array.from({ length: t.years }, (_, i) => (i < 20 ? msy * (0.2 + (1.2 * i) / 19) : msy * 0.6));
}

/** One simulated data set (seeded). */
export function simulateDataSet(t: CoverageTruth, seed: number): StockSeries {
  const rng = createRng(seed);
  const catches = studyCatches(t);
  let B = t.d0 * t.K;
  const biomass = [B];
  for (const C of catches) {
    const step = logisticHarvest(t.r, t.K, C, B, 1);
    B = step.collapseTime !== null ? 1e-6 * t.K : step.N * Math.exp(t.sdProc * rng.normal() - t.sdProc ** 2 / 2);
    biomass.push(B);
  }
  const years = catches.map((_, i) => 1980 + i);
  return { years, catches, indices: [{ name: 'survey', values: catches.map((_, i) => t.q * biomass[i]! * Math.exp(t.sdObs * rng.normal())), cv: null }] };
}

export interface CoverageRow {
  quantity: (typeof QUANTITIES)[number];
  covered: number;
  total: number;
  /** Misses with the interval entirely below / above the truth. */
  below: number;
  above: number;
}

/** Fits `n` data sets from the truth and counts how many profile intervals contain it. */
export function coverageStudy(t: CoverageTruth, n: number, seed: number, errors: 'observation' | 'state-space' = 'observation', onProgress?: (done: number) => void): CoverageRow[] {
  const truth = { r: t.r, K: t.K, MSY: (t.r * t.K) / 4, 'h*': (t.r * t.K) / 4 };
  const rows = QUANTITIES.map((quantity) => ({ quantity, covered: 0, total: 0, below: 0, above: 0 }));
  for (let k = 0; k < n; k++) {
    const series = simulateDataSet(t, (seed + 104_729 * k) >>> 0);
    let fit: ReturnType<typeof fitSurplusRaw>;
    try {
      fit = fitSurplusRaw(series, { model: 'schaefer', errors });
    } catch (err) {
      // a data set the fit refuses yields no interval: it counts as a miss
      if (!(err instanceof FitInputError)) throw err;
      for (const row of rows) row.total++;
      onProgress?.(k + 1);
      continue;
    }
    const threshold = errors === 'state-space' ? PROFILE_DROP_95 : smallSampleDrop(fit.problem.nObs, fit.problem.bounds.length + 1);
    const intervals = new Map<string, { lower: number; upper: number }>();
    for (const row of rows) {
      // h* is MSY for the Schaefer model: one profile serves both
      const pi = row.quantity === 'h*' ? intervals.get('MSY')! : profileInterval(fit, row.quantity, { threshold });
      intervals.set(row.quantity, pi);
      const v = truth[row.quantity];
      row.total++;
      if (v < pi.lower) row.above++;
      else if (v > pi.upper) row.below++;
      else row.covered++;
    }
    onProgress?.(k + 1);
  }
  return rows;
}
