/**
 * Maximum-likelihood fit of a surplus-production model (Schaefer, Pella-Tomlinson, Fox) to catches
 * and survey indices: lognormal errors, q and σ concentrated out, several Nelder-Mead starts.
 */
import { concentratedIndexFit } from '../fit/likelihood';
import { minimise } from '../numerics/nelder-mead';
import { biomassPath, referencePoints, type SurplusModelName, type SurplusParams } from './surplus';
import { filledCatches, type StockSeries } from '../data/series';
import { type Bound, toFree, toNatural } from '../numerics/transforms';

export interface SurplusFitOptions {
  model: SurplusModelName;
  /** Pella-Tomlinson shape: fixed at this value, or estimated when omitted. */
  shape?: number;
  /** Number of Nelder-Mead starts taken from the best points of a coarse grid (default 3). */
  starts?: number;
  /** Start from this free-scale point instead of the grid (used by bootstrap refits). */
  initial?: number[];
  /** odex tolerance for the models integrated numerically. */
  tol?: number;
}

export interface SurplusProblem {
  model: SurplusModelName;
  bounds: Bound[];
  catches: number[];
  filledYears: number[];
  nObs: number;
  decode(u: number[]): SurplusParams & { d0: number };
  path(u: number[]): { biomass: number[]; collapseYear: number | null };
  nll(u: number[]): number;
}

const COLLAPSE_PENALTY = 1e10;

/** The likelihood problem for a series: bounds, decoding of free parameters and the objective. */
export function surplusProblem(series: StockSeries, opts: SurplusFitOptions): SurplusProblem {
  const { catches, filledYears } = filledCatches(series);
  const scale = Math.max(...catches, 1e-9);
  const estimateShape = opts.model === 'pella-tomlinson' && opts.shape === undefined;
  const bounds: Bound[] = [
    { name: 'r', lo: 0.005, hi: 3, log: true },
    { name: 'K', lo: 0.5 * scale, hi: 1e4 * scale, log: true },
    { name: 'd0', lo: 0.05, hi: 1.5, log: false },
  ];
  if (estimateShape) bounds.push({ name: 'p', lo: 0.05, hi: 5, log: true });
  const nObs = series.indices.reduce((s, ix) => s + ix.values.filter((v) => v !== null).length, 0);
  const decode = (u: number[]) => ({
    r: toNatural(bounds[0]!, u[0]!),
    K: toNatural(bounds[1]!, u[1]!),
    d0: toNatural(bounds[2]!, u[2]!),
    p: opts.model === 'pella-tomlinson' ? (estimateShape ? toNatural(bounds[3]!, u[3]!) : opts.shape!) : 1,
  });
  const path = (u: number[]) => {
    const p = decode(u);
    return biomassPath(opts.model, p, p.d0 * p.K, catches, { tol: opts.tol ?? 1e-8 });
  };
  const nll = (u: number[]) => {
    const { biomass, collapseYear } = path(u);
    if (collapseYear !== null) return COLLAPSE_PENALTY * (1 + (catches.length - collapseYear) / catches.length);
    let total = 0;
    for (const ix of series.indices) {
      const fit = concentratedIndexFit(ix.values, biomass, ix.cv);
      if (!fit) return COLLAPSE_PENALTY * 3;
      total += fit.nll;
    }
    return total;
  };
  return { model: opts.model, bounds, catches, filledYears, nObs, decode, path, nll };
}

/** Grid of start points on the free scale, best first. */
function gridStarts(problem: SurplusProblem, count: number): number[][] {
  const [rB, KB, dB, pB] = problem.bounds;
  const scale = Math.max(...problem.catches, 1e-9);
  const points: { u: number[]; f: number }[] = [];
  for (const r of [0.08, 0.2, 0.45, 1.0]) {
    for (const k of [3, 6, 12, 25, 60]) {
      for (const d of [0.5, 0.95]) {
        const u = [toFree(rB!, r), toFree(KB!, k * scale), toFree(dB!, d)];
        if (pB) u.push(toFree(pB, 1));
        points.push({ u, f: problem.nll(u) });
      }
    }
  }
  points.sort((a, b) => a.f - b.f);
  return points.slice(0, count).map((p) => p.u);
}

export interface RawFit {
  problem: SurplusProblem;
  u: number[];
  nll: number;
  iterations: number;
  evaluations: number;
  simplexSize: number;
  hitIterationLimit: boolean;
  /** Best objective of each start, for the agreement check. */
  startValues: number[];
  startPoints: number[][];
}

/** Runs the starts and a final polish from the best; no intervals (see summariseFit). */
export function fitSurplusRaw(series: StockSeries, opts: SurplusFitOptions): RawFit {
  const problem = surplusProblem(series, opts);
  let evaluations = 0;
  const f = (u: number[]) => { evaluations++; return problem.nll(u); };
  const starts = opts.initial ? [opts.initial] : gridStarts(problem, opts.starts ?? 3);
  const runs = starts.map((s) => minimise(f, s));
  runs.sort((a, b) => a.fx - b.fx);
  const polish = minimise(f, runs[0]!.x);
  const best = polish.fx <= runs[0]!.fx ? polish : runs[0]!;
  return {
    problem, u: best.x, nll: best.fx,
    iterations: runs.reduce((s, r) => s + r.iterations, 0) + polish.iterations,
    evaluations, simplexSize: polish.simplexSize, hitIterationLimit: polish.hitIterationLimit,
    startValues: runs.map((r) => r.fx), startPoints: runs.map((r) => r.x),
  };
}
