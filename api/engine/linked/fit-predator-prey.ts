/**
 * Maximum-likelihood fit of a predator-prey model to one survey per species (prey index first,
 * predator index second): lognormal errors with q and σ concentrated out per survey. The
 * Rosenzweig-MacArthur conversion efficiency e and handling time h are fixed (common practice:
 * they are rarely identifiable from two abundance series).
 */
import { covarianceFromHessian, deltaVariance, hessian } from '../numerics/hessian';
import { concentratedIndexFit } from '../fit/likelihood';
import { minimise } from '../numerics/nelder-mead';
import { equilibriumStability, interiorEquilibrium, predatorPreyPath, type PredatorPreySpec } from './predator-prey';
import { filledCatches, type StockSeries } from '../data/series';
import { type Bound, toFree, toNatural } from '../numerics/transforms';
import type { Estimate } from '../fit/fit-summary';

export interface PredatorPreyFitOptions {
  model: 'rosenzweig-macarthur' | 'lotka-volterra';
  /** RM conversion efficiency (default 0.25) and handling time (default: 1/(a·K) scale, see below). */
  e?: number;
  handling?: number;
}

export interface PredatorPreyFit {
  model: string;
  spec: PredatorPreySpec;
  start: [number, number];
  estimates: Estimate[];
  logLik: number;
  aic: number;
  prey: number[];
  predator: number[];
  indices: { name: string; q: number; sigma: number; residuals: (number | null)[] }[];
  equilibrium: { prey: number; predator: number; stable: boolean; eigen: { re: number[]; im: number[] } } | null;
  convergence: { iterations: number; evaluations: number; simplexSize: number; warnings: string[] };
}

const PENALTY = 1e10;

/** Fits r, K, attack rate, predator mortality and both starting sizes. */
export function fitPredatorPrey(series: StockSeries, opts: PredatorPreyFitOptions): PredatorPreyFit {
  if (series.indices.length < 2) throw new Error('a predator-prey fit needs a prey survey and a predator survey');
  const preyC = filledCatches(series, 'catches').catches;
  const predC = filledCatches(series, 'predatorCatches').catches;
  const scale = Math.max(...preyC, 1);
  const pScale = Math.max(...predC, 1);
  const bounds: Bound[] = [
    { name: 'r', lo: 0.01, hi: 5, log: true },
    { name: 'K', lo: scale, hi: 1e4 * scale, log: true },
    { name: 'attack', lo: 1e-12, hi: 10, log: true },
    { name: 'mortality', lo: 0.01, hi: 3, log: true },
    { name: 'N0/K', lo: 0.05, hi: 1.2, log: false },
    { name: 'P0', lo: 0.5 * pScale, hi: 1e4 * pScale, log: true },
  ];
  const e = opts.e ?? 0.25;
  const decode = (u: number[]) => {
    const [r, K, a, m, d0, P0] = u.map((v, i) => toNatural(bounds[i]!, v)) as [number, number, number, number, number, number];
    const handling = opts.handling ?? 0.5 / (a * K);
    const spec: PredatorPreySpec = opts.model === 'lotka-volterra'
      ? { model: 'lotka-volterra', params: { a: r, K, b: a, c: m, d: e * a } }
      : { model: 'rosenzweig-macarthur', params: { r, K, a, h: handling, e, m } };
    return { spec, start: [d0 * K, P0] as [number, number] };
  };
  const evaluate = (u: number[]) => {
    const { spec, start } = decode(u);
    const path = predatorPreyPath(spec, start, preyC, predC, 1e-7);
    if (path.collapseYear !== null) return { nll: PENALTY * (2 - path.collapseYear / preyC.length), path, fits: null };
    const a = concentratedIndexFit(series.indices[0]!.values, path.prey, series.indices[0]!.cv);
    const b = concentratedIndexFit(series.indices[1]!.values, path.predator, series.indices[1]!.cv);
    if (!a || !b) return { nll: PENALTY, path, fits: null };
    return { nll: a.nll + b.nll, path, fits: [a, b] };
  };
  let evaluations = 0;
  const nll = (u: number[]) => { evaluations++; return evaluate(u).nll; };
  // Starts at an interior equilibrium N* = 0.4K, P*: with h = 0.5/(aK), P* = 0.72·r/a and m = e·a·N*/1.2.
  const starts: number[][] = [];
  for (const r of [0.6, 1.2, 2]) for (const k of [4, 8, 15]) for (const pk of [5, 12, 25]) {
    const K = k * scale, P = pk * pScale, a = (0.72 * r) / P;
    const m = Math.min(2.9, Math.max(0.011, (e * a * 0.4 * K) / 1.2));
    starts.push([toFree(bounds[0]!, r), toFree(bounds[1]!, K), toFree(bounds[2]!, a), toFree(bounds[3]!, m), toFree(bounds[4]!, 0.5), toFree(bounds[5]!, P)]);
  }
  const ranked = starts.map((u) => ({ u, f: nll(u) })).sort((x, y) => x.f - y.f);
  let best = minimise(nll, ranked[0]!.u, 3000);
  const second = minimise(nll, ranked[1]!.u, 3000);
  if (second.fx < best.fx) best = second;
  let iterations = best.iterations;
  for (let i = 0; i < 2; i++) {
    const again = minimise(nll, best.x, 3000);
    iterations += again.iterations;
    if (again.fx < best.fx) best = again;
  }
  const warnings: string[] = [];
  const H = hessian(nll, best.x);
  const cov = covarianceFromHessian(H);
  if (!cov.cov) warnings.push('The Hessian is not positive definite: some parameters are not identifiable from these surveys; intervals are withheld.');
  bounds.forEach((b, i) => {
    const x = toNatural(b, best.x[i]!);
    if (Math.abs(x - b.lo) / b.lo < 1e-3 || Math.abs(b.hi - x) / b.hi < 1e-3) warnings.push(`${b.name} sits on its bound: the estimate is not reliable.`);
  });
  const estimates: Estimate[] = bounds.map((b, i) => {
    const value = toNatural(b, best.x[i]!);
    if (!cov.cov) return { name: b.name, value, se: null, ci95: null };
    const seLog = Math.sqrt(Math.max(0, deltaVariance((x) => Math.log(toNatural(b, x[i]!)), best.x, cov.cov)));
    return { name: b.name, value, se: value * seLog, ci95: [value * Math.exp(-1.96 * seLog), value * Math.exp(1.96 * seLog)] };
  });
  const final = evaluate(best.x);
  const { spec, start } = decode(best.x);
  const [N, P] = interiorEquilibrium(spec);
  const eq = N > 0 && P > 0 ? { prey: N, predator: P, ...equilibriumStability(spec, {}, N, P) } : null;
  const k = bounds.length + 4;
  return {
    model: opts.model, spec, start, estimates, logLik: -best.fx, aic: 2 * k + 2 * best.fx,
    prey: final.path.prey, predator: final.path.predator,
    indices: (final.fits ?? []).map((f, i) => ({ name: series.indices[i]!.name, q: f.q, sigma: f.sigma, residuals: f.residuals })),
    equilibrium: eq ? { prey: eq.prey, predator: eq.predator, stable: eq.stable, eigen: eq.eigen } : null,
    convergence: { iterations, evaluations, simplexSize: best.simplexSize, warnings },
  };
}
