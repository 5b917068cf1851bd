/**
 * Maximum-likelihood fit of a predator-prey model to one survey per species (prey index first,
 * predator index second): lognormal errors with q and σ concentrated out per survey (Polacheck,
 * Hilborn & Punt 1993). The conversion efficiency e and, for Rosenzweig-MacArthur, the saturation
 * s = a·h·K (handling time h = s/(a·K)) are fixed by the assessor or estimated; every fixed quantity
 * is returned with its value and the reason it is fixed.
 */
import { covarianceFromHessian, deltaVariance, hessian } from '../numerics/hessian';
import { concentratedIndexFit } from '../fit/likelihood';
import { minimise } from '../numerics/nelder-mead';
import { equilibriumStability, interiorEquilibrium, predatorPreyPath, type PredatorPreySpec } from './predator-prey';
import { filledCatches, type StockSeries } from '../data/series';
import { type Bound, rangePosition, toFree, toNatural } from '../numerics/transforms';
import type { Estimate } from '../fit/fit-summary';

export type LinkedModelName = 'rosenzweig-macarthur' | 'lotka-volterra';

export interface PredatorPreyFitOptions {
  model: LinkedModelName;
  /** Conversion efficiency e: a value to fix it at (default 0.25), or 'estimate'. */
  conversion?: number | 'estimate';
  /** Rosenzweig-MacArthur saturation s = a·h·K: a value to fix it at (default 0.5), or 'estimate'. */
  saturation?: number | 'estimate';
  /** Start the optimiser here (free scale) and skip the multi-start search (bootstrap refits). */
  initial?: number[];
  /** ODE tolerance (default 1e-7). */
  tol?: number;
}

export const DEFAULT_CONVERSION = 0.25;
export const DEFAULT_SATURATION = 0.5;

export interface FixedQuantity {
  name: string;
  value: number;
  unit: string;
  reason: string;
}

export interface LinkedIndexSummary {
  name: string;
  species: 'prey' | 'predator';
  q: number;
  sigma: number;
  observed: (number | null)[];
  /** q̂·B_t per year. */
  fitted: number[];
  residuals: (number | null)[];
}

export interface PredatorPreyFit {
  model: LinkedModelName;
  spec: PredatorPreySpec;
  start: [number, number];
  /** The optimum on the optimiser's free scale (for bootstrap refits). */
  free: number[];
  estimates: Estimate[];
  fixed: FixedQuantity[];
  logLik: number;
  aic: number;
  aicc: number;
  nParams: number;
  nObs: number;
  prey: number[];
  predator: number[];
  indices: LinkedIndexSummary[];
  equilibrium: { prey: number; predator: number; stable: boolean; eigen: { re: number[]; im: number[] } } | null;
  convergence: { converged: boolean; iterations: number; evaluations: number; simplexSize: number; warnings: string[] };
}

const PENALTY = 1e10;

/** The fitting problem: bounds, decoding and the negative log-likelihood. */
export function linkedProblem(series: StockSeries, opts: PredatorPreyFitOptions) {
  if (series.indices.length < 2) throw new Error('a predator-prey fit needs a prey survey and a predator survey');
  const preyC = filledCatches(series, 'catches').catches;
  const predC = filledCatches(series, 'predatorCatches').catches;
  const scale = Math.max(...preyC, 1);
  const pScale = Math.max(...predC, 1);
  const estE = opts.conversion === 'estimate';
  const estS = opts.model === 'rosenzweig-macarthur' && opts.saturation === 'estimate';
  const eFixed = typeof opts.conversion === 'number' ? opts.conversion : DEFAULT_CONVERSION;
  const sFixed = typeof opts.saturation === 'number' ? opts.saturation : DEFAULT_SATURATION;
  if (!(eFixed > 0 && eFixed <= 1)) throw new Error('the conversion efficiency must lie in (0, 1]');
  if (!(sFixed >= 0 && sFixed <= 20)) throw new Error('the saturation a·h·K must lie in [0, 20]');
  const bounds: Bound[] = [
    { name: 'r', lo: 0.01, hi: 5, log: true },
    { name: 'K', lo: scale, hi: 1e4 * scale, log: true },
    { name: 'attack', lo: 1e-12, hi: 10, log: true },
    { name: 'mortality', lo: 0.01, hi: 3, log: true },
    { name: 'N0/K', lo: 0.05, hi: 1.2, log: false },
    { name: 'P0', lo: 0.5 * pScale, hi: 1e4 * pScale, log: true },
  ];
  if (estE) bounds.push({ name: 'conversion', lo: 0.01, hi: 1, log: true });
  if (estS) bounds.push({ name: 'saturation', lo: 0.01, hi: 20, log: true });
  const decode = (u: number[]) => {
    const [r, K, a, m, d0, P0] = u.slice(0, 6).map((v, i) => toNatural(bounds[i]!, v)) as [number, number, number, number, number, number];
    const e = estE ? toNatural(bounds[6]!, u[6]!) : eFixed;
    const s = estS ? toNatural(bounds[bounds.length - 1]!, u[bounds.length - 1]!) : sFixed;
    const spec: PredatorPreySpec = opts.model === 'lotka-volterra'
      ? { model: 'lotka-volterra', params: { a: r, K, b: a, c: m, d: e * a } }
      : { model: 'rosenzweig-macarthur', params: { r, K, a, h: s / (a * K), e, m } };
    return { spec, start: [d0 * K, P0] as [number, number], e, s };
  };
  const tol = opts.tol ?? 1e-7;
  const evaluate = (u: number[]) => {
    const { spec, start } = decode(u);
    const path = predatorPreyPath(spec, start, preyC, predC, tol);
    if (path.collapseYear !== null) return { nll: PENALTY * (2 - path.collapseYear / preyC.length), path, fits: null };
    const a = concentratedIndexFit(series.indices[0]!.values, path.prey, series.indices[0]!.cv);
    const b = concentratedIndexFit(series.indices[1]!.values, path.predator, series.indices[1]!.cv);
    if (!a || !b) return { nll: PENALTY, path, fits: null };
    return { nll: a.nll + b.nll, path, fits: [a, b] };
  };
  const nObs = series.indices.slice(0, 2).reduce((n, ix) => n + ix.values.filter((v) => v !== null).length, 0);
  return { bounds, decode, evaluate, preyC, predC, scale, pScale, estE, estS, eFixed, sFixed, nObs };
}

type Problem = ReturnType<typeof linkedProblem>;

/** Start points at interior equilibria N* = 0.4K with P* from the prey isocline and m from the predator one. */
function startPoints(p: Problem): number[][] {
  const e = p.eFixed;
  const out: number[][] = [];
  for (const r of [0.6, 1.2, 2]) for (const k of [4, 8, 15]) for (const pk of [5, 12, 25]) {
    const K = k * p.scale, P = pk * p.pScale, a = (0.72 * r) / P;
    const m = Math.min(2.9, Math.max(0.011, (e * a * 0.4 * K) / 1.2));
    const u = [toFree(p.bounds[0]!, r), toFree(p.bounds[1]!, K), toFree(p.bounds[2]!, a), toFree(p.bounds[3]!, m), toFree(p.bounds[4]!, 0.5), toFree(p.bounds[5]!, P)];
    if (p.estE) u.push(toFree(p.bounds[6]!, e));
    if (p.estS) u.push(toFree(p.bounds[p.bounds.length - 1]!, p.sFixed));
    out.push(u);
  }
  return out;
}

/** Fits r, K, attack rate, predator mortality, both starting sizes and, if asked, e and s. */
export function fitPredatorPrey(series: StockSeries, opts: PredatorPreyFitOptions): PredatorPreyFit {
  const p = linkedProblem(series, opts);
  let evaluations = 0;
  const nll = (u: number[]) => { evaluations++; return p.evaluate(u).nll; };
  let best;
  let iterations = 0;
  if (opts.initial) {
    best = minimise(nll, opts.initial, 1500);
    iterations = best.iterations;
  } else {
    const ranked = startPoints(p).map((u) => ({ u, f: nll(u) })).sort((x, y) => x.f - y.f);
    best = minimise(nll, ranked[0]!.u, 3000);
    const second = minimise(nll, ranked[1]!.u, 3000);
    iterations = best.iterations + second.iterations;
    if (second.fx < best.fx) best = second;
    for (let i = 0; i < 2; i++) {
      const again = minimise(nll, best.x, 3000);
      iterations += again.iterations;
      if (again.fx < best.fx) best = again;
    }
  }
  return summarise(series, opts, p, best.x, best.fx, { iterations, evaluations, simplexSize: best.simplexSize, hitLimit: best.hitIterationLimit }, !opts.initial);
}

function summarise(series: StockSeries, opts: PredatorPreyFitOptions, p: Problem, u: number[], fx: number,
  run: { iterations: number; evaluations: number; simplexSize: number; hitLimit: boolean }, intervals: boolean): PredatorPreyFit {
  const warnings: string[] = [];
  const nll = (x: number[]) => p.evaluate(x).nll;
  const cov = intervals ? covarianceFromHessian(hessian(nll, u)) : null;
  if (cov && !cov.cov) warnings.push('The Hessian is not positive definite: some parameters are not identifiable from these surveys; intervals are withheld.');
  else if (cov && cov.conditionNumber > 1e10) warnings.push(`The Hessian is ill-conditioned (condition number ${cov.conditionNumber.toExponential(1)}): some parameters are weakly identified.`);
  p.bounds.forEach((b, i) => {
    const pos = rangePosition(u[i]!);
    if (pos < 1e-3 || pos > 1 - 1e-3) warnings.push(`${b.name} sits on its bound (${b.lo}–${b.hi}): the estimate is not reliable.`);
  });
  if (run.hitLimit) warnings.push('The optimiser stopped at its iteration limit.');
  const { spec, start, e, s } = p.decode(u);
  const derivedQ: [string, (x: number[]) => number][] = p.bounds.map((b, i) => [b.name, (x: number[]) => toNatural(b, x[i]!)]);
  if (spec.model === 'rosenzweig-macarthur') derivedQ.push(['handling', (x) => { const d = p.decode(x).spec.params as { h: number }; return d.h; }]);
  derivedQ.push(['N*', (x) => interiorEquilibrium(p.decode(x).spec)[0]], ['P*', (x) => interiorEquilibrium(p.decode(x).spec)[1]]);
  const estimates: Estimate[] = derivedQ.map(([name, g]) => {
    const value = g(u);
    if (!cov?.cov || !(value > 0)) return { name, value, se: null, ci95: null };
    const seLog = Math.sqrt(Math.max(0, deltaVariance((x) => Math.log(g(x)), u, cov.cov)));
    return { name, value, se: value * seLog, ci95: [value * Math.exp(-1.96 * seLog), value * Math.exp(1.96 * seLog)] };
  });
  for (const [flag, name, label] of [[p.estE, 'conversion', 'conversion efficiency e'], [p.estS, 'saturation', 'saturation a·h·K (handling time)']] as const) {
    if (!flag || !intervals) continue;
    const est = estimates.find((x) => x.name === name)!;
    if (!est.ci95 || est.ci95[1] / est.ci95[0] > 10) warnings.push(`These surveys cannot identify the ${label}: its 95% interval ${est.ci95 ? 'spans more than a factor of 10' : 'cannot be computed'}. Fix it at a value from diet or growth studies.`);
  }
  if (cov?.cov) {
    const c = cov.cov;
    for (let i = 0; i < p.bounds.length; i++) for (let j = i + 1; j < p.bounds.length; j++) {
      const rho = c[i]![j]! / Math.sqrt(c[i]![i]! * c[j]![j]!);
      if (Math.abs(rho) > 0.95) warnings.push(`${p.bounds[i]!.name} and ${p.bounds[j]!.name} are strongly correlated (ρ = ${rho.toFixed(2)} on the fitted scale): the data determine a combination of them, not each.`);
    }
  }
  const final = p.evaluate(u);
  const path = final.path;
  const [N, P] = interiorEquilibrium(spec);
  const eq = N > 0 && P > 0 ? { prey: N, predator: P, ...equilibriumStability(spec, {}, N, P) } : null;
  if (eq) {
    for (const [label, v, xs] of [['prey', eq.prey, path.prey], ['predator', eq.predator, path.predator]] as const) {
      const lo = Math.min(...xs), hi = Math.max(...xs);
      if (v < lo || v > hi) warnings.push(`The unharvested ${label} equilibrium (${Math.round(v).toLocaleString('en-GB')}) lies outside the fitted ${label} trajectory (${Math.round(lo).toLocaleString('en-GB')}–${Math.round(hi).toLocaleString('en-GB')}): it is an extrapolation beyond what these surveys show.`);
    }
  }
  const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;
  const ratio = mean(path.predator) / mean(path.prey);
  // common practice: roughly 10–20% of prey production reaches the next trophic level (Lindeman 1942)
  if (ratio > 0.5) warnings.push(`Fitted predator biomass is ${Math.round(ratio * 100)}% of prey biomass, implausibly high for a fish predator and its prey: the predator's absolute size is tied to the conversion efficiency and the predator catches and is poorly identified by relative surveys.`);
  const indices: LinkedIndexSummary[] = (final.fits ?? []).map((f, i) => ({
    name: series.indices[i]!.name, species: i === 0 ? 'prey' : 'predator', q: f.q, sigma: f.sigma,
    observed: series.indices[i]!.values, residuals: f.residuals, fitted: series.years.map((_, t) => f.q * (i === 0 ? path.prey : path.predator)[t]!),
  }));
  const nParams = p.bounds.length + 4;
  const aic = 2 * nParams + 2 * fx;
  return {
    model: opts.model, spec, start, free: u, estimates, fixed: fixedQuantities(opts.model, p, e, s, spec), logLik: -fx, aic,
    aicc: p.nObs - nParams - 1 > 0 ? aic + (2 * nParams * (nParams + 1)) / (p.nObs - nParams - 1) : Infinity,
    nParams, nObs: p.nObs, prey: path.prey, predator: path.predator, indices,
    equilibrium: eq ? { prey: eq.prey, predator: eq.predator, stable: eq.stable, eigen: eq.eigen } : null,
    convergence: { converged: !warnings.some((w) => /not positive definite|iteration limit/.test(w)), iterations: run.iterations, evaluations: run.evaluations, simplexSize: run.simplexSize, warnings },
  };
}

function fixedQuantities(model: LinkedModelName, p: Problem, e: number, s: number, spec: PredatorPreySpec): FixedQuantity[] {
  const out: FixedQuantity[] = [];
  if (!p.estE) {
    out.push({ name: 'Conversion efficiency e', value: e, unit: '',
      reason: e === DEFAULT_CONVERSION
        ? 'Fixed at the default 0.25 (common practice: 0.1–0.3 of prey eaten becomes predator biomass); two relative surveys rarely identify it. Set it from diet and growth studies, or estimate it.'
        : 'Fixed by the assessor.' });
  }
  if (model === 'rosenzweig-macarthur' && !p.estS) {
    const h = (spec.params as { h: number }).h;
    out.push({ name: 'Saturation a·h·K', value: s, unit: '',
      reason: `${s === DEFAULT_SATURATION ? 'Fixed at the default 0.5' : 'Fixed by the assessor'}: the handling time is h = s/(a·K) = ${h.toPrecision(3)} yr, so predators feeding at prey carrying capacity eat ${Math.round((100 * s) / (1 + s))}% of their maximum ration. Two abundance surveys rarely identify it.` });
  }
  if (model === 'lotka-volterra') out.push({ name: 'Functional response', value: 0, unit: '', reason: 'Lotka-Volterra eats in proportion to prey density (no handling time): the handling time is zero by the model\'s definition.' });
  return out;
}

/** Lotka-Volterra against Rosenzweig-MacArthur on the same data: log-likelihood, AIC, AICc and ΔAICc. */
export function compareLinkedFits(fits: PredatorPreyFit[]) {
  const best = Math.min(...fits.map((f) => f.aicc));
  return fits.map((f) => ({ model: f.model, logLik: f.logLik, nParams: f.nParams, nObs: f.nObs, aic: f.aic, aicc: f.aicc, deltaAicc: f.aicc - best }));
}
