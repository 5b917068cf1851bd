/**
 * Generates the demo scenario's data series (seeded, reproducible) from the invented "true" values
 * of the scenario. `npm run --silent seed-series` rewrites seeders/data/*.csv.
 */
import { createRng } from '../api/engine/numerics/random';
import { predatorPreyPath } from '../api/engine/linked/predator-prey';
import type { StockSeries } from '../api/engine/data/series';
import { biomassPath, type SurplusModelName } from '../api/engine/surplus/surplus';

export const SERIES_SEED = 20261202;
export const FIRST_YEAR = 1990;
export const N_YEARS = 36;

export interface SingleStockTruth {
  code: string;
  model: SurplusModelName;
  r: number;
  K: number;
  p?: number;
  d0: number;
  q: number;
  sd: number;
  /** Catch path as fractions of MSY-like scale: rises, overshoots, is cut back. */
  catchPeak: number;
  indexName: string;
  unit: string;
}

export const SINGLE_STOCKS: SingleStockTruth[] = [
  { code: 'blue-lip-crab', model: 'schaefer', r: 0.42, K: 18_500, d0: 0.9, q: 2.1e-4, sd: 0.15, catchPeak: 2_600, indexName: 'trap_survey', unit: 't' },
  { code: 'silver-smelt', model: 'pella-tomlinson', r: 0.65, K: 96_000, p: 0.6, d0: 1, q: 0.8, sd: 0.22, catchPeak: 21_000, indexName: 'acoustic_survey', unit: 't' },
  { code: 'red-grouse', model: 'schaefer', r: 0.9, K: 12_000, d0: 0.85, q: 0.35, sd: 0.25, catchPeak: 2_900, indexName: 'spring_count', unit: 'birds' },
];

/** Catches that rise to a peak by year 16, hold, are cut back to 55% by year 26, then recover slightly. */
export function catchHistory(peak: number, n = N_YEARS): number[] {
  return Array.from({ length: n }, (_, i) => {
    if (i < 16) return peak * (0.15 + 0.85 * (i / 15));
    if (i < 20) return peak;
    if (i < 26) return peak * (1 - 0.45 * ((i - 19) / 6));
    return peak * (0.55 + 0.01 * (i - 25));
  });
}

export interface SimulatedSeries {
  years: number[];
  catches: number[];
  index: number[];
  biomass: number[];
}

/** Simulates one single stock: true biomass path, lognormal survey index, catches rounded to 0.1. */
export function simulateSingle(truth: SingleStockTruth, seed = SERIES_SEED, years = N_YEARS): SimulatedSeries {
  const rng = createRng(seed ^ hash(truth.code));
  const catches = catchHistory(truth.catchPeak, years).map((c) => Math.round(c * (0.95 + 0.1 * rng.uniform()) * 10) / 10);
  const { biomass, collapseYear } = biomassPath(truth.model, truth, truth.d0 * truth.K, catches);
  if (collapseYear !== null) throw new Error(`${truth.code}: the simulated history collapses; lower the catches`);
  const index = catches.map((_, t) => round4(truth.q * biomass[t]! * Math.exp(truth.sd * rng.normal())));
  return { years: catches.map((_, i) => FIRST_YEAR + i), catches, index, biomass };
}

function round4(x: number): number {
  return Number(x.toPrecision(5));
}

function hash(s: string): number {
  let h = 2166136261;
  for (const ch of s) h = Math.imul(h ^ ch.charCodeAt(0), 16777619);
  return h >>> 0;
}

/**
 * Skerry sprat (prey) and ridge cod (predator), Rosenzweig-MacArthur. Chosen so that the history
 * sits at a stable equilibrium (K below the Hopf threshold) with handling time h = 0.5/(aK).
 */
export const SPRAT_COD_TRUTH = {
  code: 'sprat-ridge-cod',
  params: { r: 1.2, K: 250_000, a: 1.5733e-5, h: 0.5 / (1.5733e-5 * 250_000), e: 0.25, m: 0.3 },
  start: [0.5 * 250_000, 40_000] as [number, number],
  qPrey: 1.1e-3,
  qPredator: 2.4e-3,
  sd: 0.2,
  preyCatchPeak: 24_000,
  predatorCatchPeak: 3_600,
};

export interface SimulatedPair {
  years: number[];
  preyCatch: number[];
  predatorCatch: number[];
  preyIndex: number[];
  predatorIndex: number[];
  prey: number[];
  predator: number[];
}

/** Simulates the linked sprat and cod stocks with their two surveys. */
export function simulateSpratCod(seed = SERIES_SEED): SimulatedPair {
  const t = SPRAT_COD_TRUTH;
  const rng = createRng(seed ^ hash(t.code));
  const preyCatch = catchHistory(t.preyCatchPeak).map((c) => Math.round(c * (0.95 + 0.1 * rng.uniform())));
  const predatorCatch = catchHistory(t.predatorCatchPeak).map((c) => Math.round(c * (0.95 + 0.1 * rng.uniform())));
  const path = predatorPreyPath({ model: 'rosenzweig-macarthur', params: t.params }, t.start, preyCatch, predatorCatch);
  if (path.collapseYear !== null) throw new Error('sprat-ridge-cod: the simulated history collapses');
  const preyIndex = preyCatch.map((_, i) => round4(t.qPrey * path.prey[i]! * Math.exp(t.sd * rng.normal())));
  const predatorIndex = preyCatch.map((_, i) => round4(t.qPredator * path.predator[i]! * Math.exp(t.sd * rng.normal())));
  return { years: preyCatch.map((_, i) => FIRST_YEAR + i), preyCatch, predatorCatch, preyIndex, predatorIndex, prey: path.prey, predator: path.predator };
}

/** The demo series as StockSeries, keyed by stock code. */
export function demoSeries(): Record<string, StockSeries> {
  const out: Record<string, StockSeries> = {};
  for (const t of SINGLE_STOCKS) {
    const s = simulateSingle(t);
    out[t.code] = { years: s.years, catches: s.catches, indices: [{ name: t.indexName, values: s.index, cv: null }] };
  }
  const pc = simulateSpratCod();
  out[SPRAT_COD_TRUTH.code] = {
    years: pc.years, catches: pc.preyCatch, predatorCatches: pc.predatorCatch,
    indices: [{ name: 'prey_index', values: pc.preyIndex, cv: null }, { name: 'predator_index', values: pc.predatorIndex, cv: null }],
  };
  return out;
}
