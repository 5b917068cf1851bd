/**
 * Fit of a stock-recruitment model to spawner/recruit pairs with lognormal error,
 * ln R_t = ln f(S_t; θ) + ε_t, ε ~ N(0, σ²), σ concentrated out (Hilborn & Walters 1992, ch. 7),
 * and a residual bootstrap of the fit (Efron & Tibshirani 1993, ch. 9).
 */
import { minimise } from '../numerics/nelder-mead';
import { createRng } from '../numerics/random';
import type { StockSeries } from '../data/series';
import type { DiscreteModel, DiscreteParams, DiscreteReference } from './stock-recruit';

export interface SrPairs {
  /** Year of spawning for each pair. */
  years: number[];
  spawners: number[];
  recruits: number[];
  /** Harvest rate per year where a catch is known (catch / stock before harvest). */
  harvestRates: (number | null)[];
  source: 'spawners-recruits' | 'biomass';
}

/**
 * Pairs from a series: spawners and recruits as given, or from a biomass series with catch as
 * S_t = B_t − C_t (escapement after a harvest before spawning) and R_t = B_{t+1}.
 */
export function stockRecruitPairs(series: StockSeries): SrPairs {
  const out: SrPairs = { years: [], spawners: [], recruits: [], harvestRates: [], source: series.stockRecruit ? 'spawners-recruits' : 'biomass' };
  if (series.stockRecruit) {
    const { spawners, recruits } = series.stockRecruit;
    series.years.forEach((y, i) => {
      const S = spawners[i], R = recruits[i], C = series.catches[i];
      if (S == null || R == null || S <= 0 || R <= 0) return;
      out.years.push(y); out.spawners.push(S); out.recruits.push(R);
      out.harvestRates.push(C == null ? null : C / (C + S));
    });
    return out;
  }
  const biomass = series.indices.find((ix) => ix.name === 'biomass') ?? series.indices[0];
  if (!biomass) throw new Error('the series has neither spawners and recruits nor a biomass column');
  for (let i = 0; i + 1 < series.years.length; i++) {
    const B = biomass.values[i], Bn = biomass.values[i + 1], C = series.catches[i];
    if (B == null || Bn == null || C == null || B - C <= 0 || Bn <= 0) continue;
    out.years.push(series.years[i]!); out.spawners.push(B - C); out.recruits.push(Bn);
    out.harvestRates.push(C / B);
  }
  return out;
}

export interface SrFit {
  model: string;
  params: DiscreteParams;
  sigma: number;
  logLik: number;
  aic: number;
  aicc: number;
  /** ln R − ln f(S) per pair. */
  residuals: number[];
  fitted: number[];
  reference: DiscreteReference;
  converged: boolean;
}

function logLikOf(model: DiscreteModel, p: DiscreteParams, S: number[], R: number[]): { ll: number; sigma: number; res: number[] } {
  const res = S.map((s, i) => Math.log(R[i]!) - Math.log(model.recruits(s, p)));
  const n = res.length;
  const sigma = Math.sqrt(res.reduce((a, e) => a + e * e, 0) / n);
  const sumLogR = R.reduce((a, r) => a + Math.log(r), 0);
  return { ll: -n * Math.log(sigma) - (n / 2) * (1 + Math.log(2 * Math.PI)) - sumLogR, sigma, res };
}

// Free parameters on the log scale; productivity parameters with a floor (R₀ > 1) are fitted as ln(x − lower)
function toFree(model: DiscreteModel, p: DiscreteParams): number[] {
  return model.params.map((s) => Math.log(p[s.name]! - (s.lower > 1 ? s.lower : 0)));
}
function toNatural(model: DiscreteModel, u: number[]): DiscreteParams {
  const p: DiscreteParams = {};
  model.params.forEach((s, i) => { p[s.name] = Math.exp(u[i]!) + (s.lower > 1 ? s.lower : 0); });
  return p;
}

/** Maximum-likelihood fit from the model's own starting values and two perturbed starts. */
export function fitStockRecruit(model: DiscreteModel, S: number[], R: number[]): SrFit {
  if (S.length < 5) throw new Error(`only ${S.length} spawner/recruit pairs; at least 5 are needed to fit ${model.label}`);
  const nll = (u: number[]) => {
    const p = toNatural(model, u);
    if (model.params.some((s) => !(p[s.name]! >= s.lower && p[s.name]! <= s.upper))) return 1e12;
    const { ll } = logLikOf(model, p, S, R);
    return Number.isFinite(ll) ? -ll : 1e12;
  };
  const x0 = toFree(model, model.start(S, R));
  let best = minimise(nll, x0);
  for (const shift of [-0.5, 0.5]) {
    const m = minimise(nll, x0.map((v) => v + shift));
    if (m.fx < best.fx) best = m;
  }
  const polished = minimise(nll, best.x);
  if (polished.fx <= best.fx) best = polished;
  const params = toNatural(model, best.x);
  const { ll, sigma, res } = logLikOf(model, params, S, R);
  const k = model.params.length + 1;
  const n = S.length;
  return {
    model: model.name, params, sigma, logLik: ll, aic: 2 * k - 2 * ll,
    aicc: n - k - 1 > 0 ? 2 * k - 2 * ll + (2 * k * (k + 1)) / (n - k - 1) : Infinity,
    residuals: res, fitted: S.map((s) => model.recruits(s, params)), reference: model.reference(params),
    converged: !best.hitIterationLimit,
  };
}

export interface SrReplicate {
  params: DiscreteParams;
  uMsy: number;
  sMsy: number;
  msy: number;
}

/** Residual bootstrap: R*_t = f(S_t; θ̂)·e^{ε*_t}, ε* drawn with replacement, refitted. */
export function bootstrapStockRecruit(model: DiscreteModel, S: number[], fit: SrFit, replicates: number, seed: number, onProgress?: (done: number) => void): SrReplicate[] {
  const rng = createRng(seed);
  const out: SrReplicate[] = [];
  for (let b = 0; b < replicates; b++) {
    const Rstar = fit.fitted.map((f) => f * Math.exp(fit.residuals[rng.int(fit.residuals.length)]!));
    const rep = fitStockRecruit(model, S, Rstar);
    out.push({ params: rep.params, uMsy: rep.reference.uMsy, sMsy: rep.reference.sMsy, msy: rep.reference.msy });
    if (onProgress && (b % 20 === 19 || b === replicates - 1)) onProgress(b + 1);
  }
  return out;
}
