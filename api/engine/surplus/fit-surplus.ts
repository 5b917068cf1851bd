/**
 * Maximum-likelihood fit of a surplus-production model (any model in the registry) to catches and
 * survey indices: lognormal errors, q and σ concentrated out, several Nelder-Mead starts.
 */
import { concentratedIndexFit } from '../fit/likelihood';
import { stateSpaceNll } from '../fit/state-space';
import { priorPenalty, type FixedParams, type ParamPriors } from '../fit/constraints';
import { minimise } from '../numerics/nelder-mead';
import { biomassPath, referencePoints, type SurplusModelName, type SurplusParams } from './surplus';
import { productionModel } from './registry';
import type { ShapeParam } from './production-model';
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
  /** Parameters held at a given value instead of estimated (data-poor stocks, profiles). */
  fixed?: FixedParams;
  /** Priors on r and B0/K: the objective becomes a penalised likelihood. */
  priors?: ParamPriors;
  /** Allow the first year's biomass above K (B0/K up to 1.5); the fit then warns when it is. */
  allowAboveK?: boolean;
  /** Error model: observation error only (default), or state-space (process and observation error, Kalman filter on the first index). */
  errors?: 'observation' | 'state-space';
}

/** A series that cannot be fitted as asked, with a message for the assessor. */
export class FitInputError extends Error {
  constructor(readonly code: string, message: string) {
    super(message);
  }
}

export interface SurplusProblem {
  model: SurplusModelName;
  bounds: Bound[];
  /** The shape parameters estimated (their bounds are named by label and follow r, K and d0). */
  shapes: ShapeParam[];
  catches: number[];
  filledYears: number[];
  nObs: number;
  decode(u: number[]): SurplusParams & { d0: number };
  path(u: number[]): { biomass: number[]; collapseYear: number | null };
  /** The objective: negative log-likelihood plus the prior penalty, if any. */
  nll(u: number[]): number;
  /** −ln prior density at u (0 without priors). */
  penalty(u: number[]): number;
  /** Fixed catchability per survey name. */
  fixedQ: Record<string, number>;
}

const COLLAPSE_PENALTY = 1e10;
/** A largest annual harvest rate below this cannot scale the biomass (our threshold). */
export const NEGLIGIBLE_HARVEST_RATE = 1e-3;

const NO_REMOVALS = 'The biomass scale cannot be estimated without removals: every catch in the series is zero or negligible, so any carrying capacity fits the survey equally well. Fix K or the survey catchability q to fit it.';

/** The likelihood problem for a series: bounds, decoding of free parameters and the objective. */
export function surplusProblem(series: StockSeries, opts: SurplusFitOptions): SurplusProblem {
  const { catches, filledYears } = filledCatches(series);
  const fixed = opts.fixed ?? {};
  const fixedQ = fixed.q ?? {};
  const pinned = fixed.K !== undefined || Object.keys(fixedQ).length > 0;
  const maxCatch = Math.max(...catches, 0);
  if (!(maxCatch > 0) && !pinned) throw new FitInputError('NO_REMOVALS', NO_REMOVALS);
  const scale = maxCatch > 0 ? maxCatch : fixed.K !== undefined ? fixed.K / 10 : pinnedScale(series, fixedQ);
  const m = productionModel(opts.model);
  const shapes = m.shape.filter((s) => !(s.name === 'p' && opts.shape !== undefined));
  const all: Bound[] = [
    { name: 'r', lo: m.rBounds?.[0] ?? 0.005, hi: m.rBounds?.[1] ?? 3, log: true },
    { name: 'K', lo: 0.5 * scale, hi: 1e4 * scale, log: true },
    { name: 'd0', lo: 0.05, hi: opts.allowAboveK ? 1.5 : 1, log: false },
    ...shapes.map((s) => ({ name: s.label, lo: s.lo, hi: s.hi, log: s.log })),
  ];
  const stateSpace = opts.errors === 'state-space';
  const firstIx = series.indices[0]!;
  const ixValues = firstIx.values.filter((v): v is number => v !== null);
  if (stateSpace) {
    const q0 = ixValues.reduce((a, v) => a + v, 0) / ixValues.length / (10 * scale);
    all.push({ name: 'q', lo: q0 * 1e-4, hi: q0 * 1e4, log: true }, { name: 'σ_p', lo: 0.005, hi: 1, log: true }, { name: 'σ_obs', lo: 0.01, hi: 2, log: true });
  }
  // why: with MSY held (profiles), r follows from K and the shape, so r is not a free parameter
  const bounds = all.filter((b) => !(b.name === 'r' && (fixed.r !== undefined || fixed.msy !== undefined)) && !(b.name === 'K' && fixed.K !== undefined) && !(b.name === 'd0' && fixed.d0 !== undefined));
  const at = (name: string) => bounds.findIndex((b) => b.name === name);
  const free = (name: string, u: number[]) => toNatural(bounds[at(name)]!, u[at(name)]!);
  const nObs = series.indices.reduce((s, ix) => s + ix.values.filter((v) => v !== null).length, 0);
  const shapeNatural = (u: number[], r: number, K: number) => {
    const out: Pick<SurplusParams, 'p' | 'A' | 'c' | 'a'> = {};
    if (opts.model === 'pella-tomlinson') out.p = opts.shape ?? 1;
    for (const s of shapes) out[s.name] = s.toNatural(free(s.label, u), r, K);
    return out;
  };
  const decode = (u: number[]) => {
    const K = fixed.K ?? free('K', u);
    const d0 = fixed.d0 ?? free('d0', u);
    // MSY scales as r·K times a function of the scale-free shape, so r = MSY / MSY(r = 1, K = 1)
    const r = fixed.r ?? (fixed.msy !== undefined ? fixed.msy / (K * referencePoints(opts.model, { r: 1, K: 1, ...shapeNatural(u, 1, 1) }).msy) : free('r', u));
    return { r, K, d0, ...shapeNatural(u, r, K) };
  };
  const path = (u: number[]) => {
    const p = decode(u);
    return biomassPath(opts.model, p, p.d0 * p.K, catches, { tol: opts.tol ?? 1e-8 });
  };
  const penalty = (u: number[]) => (opts.priors ? priorPenalty(opts.priors, decode(u)) : 0);
  const ssNll = (u: number[]) => {
    const p = decode(u);
    const step = (B: number, C: number) => {
      const r = biomassPath(opts.model, p, B, [C], { tol: opts.tol ?? 1e-8 });
      return r.collapseYear !== null ? null : r.biomass[1]!;
    };
    const res = stateSpaceNll({ step, catches, index: firstIx.values, B0: p.d0 * p.K, q: free('q', u), sdProc: free('σ_p', u), sdObs: free('σ_obs', u) });
    return Number.isFinite(res.nll) ? res.nll + penalty(u) : COLLAPSE_PENALTY;
  };
  const nll = (u: number[]) => {
    if (stateSpace) return ssNll(u);
    const { biomass, collapseYear } = path(u);
    if (collapseYear !== null) return COLLAPSE_PENALTY * (1 + (catches.length - collapseYear) / catches.length);
    let total = 0;
    for (const ix of series.indices) {
      const fit = concentratedIndexFit(ix.values, biomass, ix.cv, fixedQ[ix.name]);
      if (!fit) return COLLAPSE_PENALTY * 3;
      total += fit.nll;
    }
    return total + penalty(u);
  };
  return { model: opts.model, bounds, shapes, catches, filledYears, nObs, decode, path, nll, penalty, fixedQ };
}

/** Biomass scale from a survey with known catchability (index / q), for a series without removals. */
function pinnedScale(series: StockSeries, fixedQ: Record<string, number>): number {
  const ix = series.indices.find((i) => fixedQ[i.name] !== undefined)!;
  const values = ix.values.filter((v): v is number => v !== null);
  return Math.max(...values) / fixedQ[ix.name]! / 10;
}

/** Grid of start points on the free scale, best first. */
function gridStarts(problem: SurplusProblem, count: number): number[][] {
  const scale = Math.max(...problem.catches, 1e-9);
  const points: { u: number[]; f: number }[] = [];
  const seen = new Set<string>();
  const shapeGrid = problem.shapes.reduce<Record<string, number>[]>((acc, s) => acc.flatMap((a) => s.starts.map((v) => ({ ...a, [s.label]: v }))), [{}]);
  for (const r of [0.08, 0.2, 0.45, 1.0]) {
    for (const k of [3, 6, 12, 25, 60]) {
      for (const d of [0.5, 0.95]) {
        for (const sh of shapeGrid) {
          const natural: Record<string, number> = { r, K: k * scale, d0: d, ...sh, 'σ_p': 0.05, 'σ_obs': 0.2 };
          const qB = problem.bounds.find((b) => b.name === 'q');
          if (qB) natural.q = Math.sqrt(qB.lo * qB.hi) * (10 / k);
          const u = problem.bounds.map((b) => toFree(b, natural[b.name]!));
          const key = u.join(',');
          if (seen.has(key)) continue;
          seen.add(key);
          points.push({ u, f: problem.nll(u) });
        }
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

/** The free vector with K multiplied by `factor` (other parameters unchanged), clamped to K's bounds. */
function scaledK(problem: SurplusProblem, u: number[], factor: number): number[] {
  const i = problem.bounds.findIndex((b) => b.name === 'K');
  if (i < 0) return u;
  const b = problem.bounds[i]!;
  const w = u.slice();
  w[i] = toFree(b, Math.min(b.hi * (1 - 1e-9), toNatural(b, u[i]!) * factor));
  return w;
}

/** Runs the starts and a final polish from the best; no intervals (see summariseFit). */
export function fitSurplusRaw(series: StockSeries, opts: SurplusFitOptions): RawFit {
  const problem = surplusProblem(series, opts);
  if (problem.bounds.length === 0) {
    return { problem, u: [], nll: problem.nll([]), iterations: 0, evaluations: 1, simplexSize: 0, hitIterationLimit: false, startValues: [problem.nll([])], startPoints: [[]] };
  }
  let evaluations = 0;
  const f = (u: number[]) => { evaluations++; return problem.nll(u); };
  const starts = opts.initial ? [opts.initial] : gridStarts(problem, opts.starts ?? 3);
  const runs = starts.map((s) => minimise(f, s));
  runs.sort((a, b) => a.fx - b.fx);
  const polish = minimise(f, runs[0]!.x);
  const best = polish.fx <= runs[0]!.fx ? polish : runs[0]!;
  if (!opts.initial && opts.fixed?.K === undefined && Object.keys(problem.fixedQ).length === 0) {
    const { biomass } = problem.path(best.x);
    const maxRate = Math.max(...problem.catches.map((c, t) => c / Math.max(biomass[t]!, 1e-300)));
    // negligible removals leave the likelihood flat in K: ten times the biomass scale fits as well
    if (!(maxRate >= NEGLIGIBLE_HARVEST_RATE) && Math.abs(problem.nll(scaledK(problem, best.x, 10)) - best.fx) < 0.01) throw new FitInputError('NO_REMOVALS', NO_REMOVALS);
  }
  return {
    problem, u: best.x, nll: best.fx,
    iterations: runs.reduce((s, r) => s + r.iterations, 0) + polish.iterations,
    evaluations, simplexSize: polish.simplexSize, hitIterationLimit: polish.hitIterationLimit,
    startValues: runs.map((r) => r.fx), startPoints: runs.map((r) => r.x),
  };
}
