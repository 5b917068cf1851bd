/**
 * Retrospective analysis and hindcast cross-validation: refit with the last 1..N years removed,
 * Mohn's rho of terminal biomass and fishing mortality, and one-step-ahead predictions of each
 * survey scored by the mean absolute scaled error against the naive (last value) forecast.
 */
import { concentratedIndexFit } from '../fit/likelihood';
import { fitSurplusRaw, type SurplusFitOptions } from '../surplus/fit-surplus';
import { referencePoints } from '../surplus/surplus';
import type { StockSeries } from '../data/series';

export interface PeelPath {
  /** Years removed (0 = the full fit). */
  peel: number;
  years: number[];
  /** Biomass at the start of each year. */
  biomass: number[];
  /** Harvest rate C_t / B_t. */
  F: number[];
  bOverBmsy: number[];
  fOverFmsy: number[];
  /** Biomass at the start of the year after the last (the one-step-ahead prediction). */
  bNext: number;
  /** Catchability of each survey in this fit. */
  q: number[];
}

/** The first `length` years of a series. */
export function truncateSeries(series: StockSeries, length: number): StockSeries {
  return {
    ...series, years: series.years.slice(0, length), catches: series.catches.slice(0, length),
    predatorCatches: series.predatorCatches?.slice(0, length),
    indices: series.indices.map((ix) => ({ ...ix, values: ix.values.slice(0, length), cv: ix.cv?.slice(0, length) ?? null })),
  };
}

/** Refits a series cut to its first `length` years, starting from `initial` (free scale). */
export function peelFit(series: StockSeries, opts: SurplusFitOptions, peel: number, initial: number[]): PeelPath {
  const length = series.years.length - peel;
  const cut = truncateSeries(series, length);
  const raw = fitSurplusRaw(cut, { ...opts, initial });
  const params = raw.problem.decode(raw.u);
  const ref = referencePoints(opts.model, params);
  const { biomass } = raw.problem.path(raw.u);
  const B = biomass.slice(0, length);
  const F = B.map((b, t) => raw.problem.catches[t]! / Math.max(b, 1e-12));
  const q = cut.indices.map((ix) => concentratedIndexFit(ix.values, biomass, ix.cv, raw.problem.fixedQ[ix.name])?.q ?? NaN);
  return {
    peel, years: cut.years, biomass: B, F, bOverBmsy: B.map((b) => b / ref.bMsy), fOverFmsy: F.map((f) => f / ref.fMsy),
    bNext: biomass[length]!, q,
  };
}

/**
 * Mohn's rho (Mohn 1999, ICES J. Mar. Sci. 56:473): the mean over peels of the relative difference
 * between each peel's terminal-year estimate and the full fit's estimate for that same year.
 */
export function mohnsRho(full: number[], peels: { peel: number; values: number[] }[]): number {
  const n = full.length;
  const rel = peels.map(({ peel, values }) => {
    const t = n - peel - 1;
    return (values[t]! - full[t]!) / full[t]!;
  });
  return rel.reduce((s, v) => s + v, 0) / rel.length;
}

/**
 * Mean absolute scaled error of predictions against the naive forecast (Hyndman & Koehler 2006,
 * Int. J. Forecasting 22:679), in the hindcast form Σ|ŷ − y| / Σ|y_naive − y| (Kell, Kimoto & Kitakado 2016, Fish. Res. 183:119, from memory):
 * below 1, the model predicts better than carrying the last value forward. Null when the naive
 * forecast is exact every time.
 */
export function mase(observed: number[], predicted: number[], naive: number[]): number | null {
  let num = 0, den = 0;
  for (let i = 0; i < observed.length; i++) {
    num += Math.abs(predicted[i]! - observed[i]!);
    den += Math.abs(naive[i]! - observed[i]!);
  }
  return den > 0 ? num / den : null;
}

export interface HindcastPoint { year: number; observed: number; predicted: number; naive: number; peel: number }
export interface HindcastIndex { index: string; mase: number | null; points: HindcastPoint[] }

/** One-step-ahead predictions of each survey from the peel fits, and their MASE. */
export function hindcast(series: StockSeries, peels: PeelPath[]): HindcastIndex[] {
  return series.indices.map((ix, j) => {
    const points: HindcastPoint[] = [];
    for (const p of peels) {
      const t = series.years.length - p.peel;
      const obs = ix.values[t];
      const last = ix.values.slice(0, t).map((v, i) => (v === null ? -1 : i)).filter((i) => i >= 0).pop();
      if (obs === null || obs === undefined || last === undefined || !Number.isFinite(p.q[j]!)) continue;
      points.push({ year: series.years[t]!, observed: obs, predicted: p.q[j]! * p.bNext, naive: ix.values[last]!, peel: p.peel });
    }
    points.sort((a, b) => a.year - b.year);
    return { index: ix.name, points, mase: points.length ? mase(points.map((p) => p.observed), points.map((p) => p.predicted), points.map((p) => p.naive)) : null };
  });
}

/** How many years can be peeled while keeping at least 10 years and 5 observations of each survey. */
export function feasiblePeels(series: StockSeries, wanted: number): number {
  let n = 0;
  for (let p = 1; p <= wanted; p++) {
    const len = series.years.length - p;
    if (len < 10 || series.indices.some((ix) => ix.values.slice(0, len).filter((v) => v !== null).length < 5)) break;
    n = p;
  }
  return n;
}
