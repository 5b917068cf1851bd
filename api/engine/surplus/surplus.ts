/**
 * Surplus-production models dB/dt = g(B) − C(t), their reference points, and the biomass path
 * under annual catches (constant rate within each year), integrated with odex.
 */
import { logisticHarvest } from './logistic-harvest';
import { integrate } from '../numerics/ode';

export type SurplusModelName = 'schaefer' | 'pella-tomlinson' | 'fox';

export interface SurplusParams {
  r: number;
  K: number;
  /** Pella-Tomlinson shape p (1 = Schaefer); ignored by the other models. */
  p?: number;
}

export interface ReferencePoints {
  msy: number;
  bMsy: number;
  fMsy: number;
}

/** Production g(B). Schaefer rB(1 − B/K); Pella-Tomlinson (r/p)B(1 − (B/K)^p); Fox rB·ln(K/B). */
export function production(model: SurplusModelName, { r, K, p = 1 }: SurplusParams, B: number): number {
  if (B <= 0) return 0;
  switch (model) {
    case 'schaefer':
      return r * B * (1 - B / K);
    case 'pella-tomlinson':
      return (r / p) * B * (1 - Math.pow(B / K, p));
    case 'fox':
      return r * B * Math.log(K / B);
  }
}

/** dg/dB, the linearisation used for stability and return rates. */
export function productionSlope(model: SurplusModelName, { r, K, p = 1 }: SurplusParams, B: number): number {
  const b = Math.max(B, 1e-300);
  switch (model) {
    case 'schaefer':
      return r * (1 - (2 * b) / K);
    case 'pella-tomlinson':
      return (r / p) * (1 - (1 + p) * Math.pow(b / K, p));
    case 'fox':
      return r * (Math.log(K / b) - 1);
  }
}

/**
 * MSY, B_MSY and F_MSY = MSY/B_MSY. Schaefer (1954): rK/4, K/2, r/2. Pella & Tomlinson (1969), in
 * the (r/p) form: B_MSY = K(1+p)^(−1/p), MSY = rK(1+p)^(−(1+p)/p), F_MSY = r/(1+p). Fox (1970): rK/e, K/e, r.
 */
export function referencePoints(model: SurplusModelName, { r, K, p = 1 }: SurplusParams): ReferencePoints {
  switch (model) {
    case 'schaefer':
      return { msy: (r * K) / 4, bMsy: K / 2, fMsy: r / 2 };
    case 'pella-tomlinson': {
      const bMsy = K * Math.pow(1 + p, -1 / p);
      return { msy: r * K * Math.pow(1 + p, -(1 + p) / p), bMsy, fMsy: r / (1 + p) };
    }
    case 'fox':
      return { msy: (r * K) / Math.E, bMsy: K / Math.E, fMsy: r };
  }
}

export interface BiomassPath {
  /** Biomass at the start of each year, and one more entry for the start of the year after the last. */
  biomass: number[];
  /** Index of the first year in which the stock reached zero, or null. */
  collapseYear: number | null;
}

export interface PathOptions {
  /** odex tolerance (default 1e-9). */
  tol?: number;
  /** Integrate the Schaefer model with odex too, instead of its exact solution. */
  forceOdex?: boolean;
}

/**
 * One year of dB/dt = g(B) − C. Schaefer uses the exact solution of the same ODE (why: fits and
 * bootstraps evaluate hundreds of thousands of years; the specs hold it to the odex path at 1e-8);
 * the other models are integrated with odex.
 */
function stepYear(model: SurplusModelName, params: SurplusParams, B: number, C: number, opts: PathOptions): { B: number; collapsed: boolean } {
  if (model === 'schaefer' && !opts.forceOdex) {
    const step = logisticHarvest(params.r, params.K, C, B, 1);
    return { B: step.N, collapsed: step.collapseTime !== null };
  }
  const res = integrate((_t, y) => [production(model, params, y[0]!) - C], 0, [B], 1, { tol: opts.tol ?? 1e-9, stopAtZero: true });
  return { B: res.collapsed ? 0 : res.y[0]!, collapsed: res.collapsed };
}

/**
 * Biomass at the start of each year from B(0) = B0, with catches[i] removed at a constant rate
 * during year i. A path that reaches zero stays at zero (collapse), never negative or NaN.
 */
export function biomassPath(model: SurplusModelName, params: SurplusParams, B0: number, catches: number[], opts: PathOptions = {}): BiomassPath {
  const biomass = [B0];
  let B = B0;
  let collapseYear: number | null = null;
  for (let i = 0; i < catches.length; i++) {
    if (collapseYear !== null) {
      biomass.push(0);
      continue;
    }
    const step = stepYear(model, params, B, catches[i]!, opts);
    B = step.B;
    if (step.collapsed) collapseYear = i;
    biomass.push(B);
  }
  return { biomass, collapseYear };
}
