/**
 * Surplus-production models dB/dt = g(B) − removal, their reference points, and the biomass path
 * under annual removals: a catch taken at a constant rate within each year, or a fishing mortality F
 * (removal F·B). The models themselves live one per module, listed in `registry.ts`.
 */
import { logisticHarvest } from './logistic-harvest';
import { integrate } from '../numerics/ode';
import { rk4Scalar } from '../numerics/rk4';
import { taylorYear } from './surplus-taylor';
import { productionModel, type SurplusModelName } from './registry';
import { maximumOf, unfishedEquilibrium } from './equilibria';
import type { ReferencePoints, SurplusParams } from './production-model';

export type { SurplusModelName } from './registry';
export type { ReferencePoints, SurplusParams } from './production-model';

/** How a harvest is expressed: a constant catch per year, or a fishing mortality rate F. */
export type HarvestControl = 'catch' | 'F';

/** Production g(B) of the named model. */
export function production(model: SurplusModelName, params: SurplusParams, B: number): number {
  return productionModel(model).g(params, B);
}

/** dg/dB, the linearisation used for stability and return rates. */
export function productionSlope(model: SurplusModelName, params: SurplusParams, B: number): number {
  return productionModel(model).dg(params, B);
}

/**
 * MSY, B_MSY and F_MSY = MSY/B_MSY: in closed form where published (Schaefer, Pella-Tomlinson, Fox),
 * otherwise the largest value of g on (0, unfished equilibrium], found numerically.
 */
export function referencePoints(model: SurplusModelName, params: SurplusParams): ReferencePoints {
  const m = productionModel(model);
  if (m.reference) return m.reference(params);
  const top = unfishedEquilibrium(m, params);
  if (!(top > 0)) return { msy: 0, bMsy: 0, fMsy: 0 };
  const best = maximumOf((B) => m.g(params, B), (B) => m.dg(params, B), 0, top);
  return { msy: best.value, bMsy: best.at, fMsy: best.value / best.at };
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
  /** Integrate with odex whatever the model's own stepper. */
  forceOdex?: boolean;
  /** Removals are catches (default) or fishing mortality rates. */
  control?: HarvestControl;
}

const RK4_STEPS = 24;

/**
 * One year of dB/dt = g(B) − C (or g(B) − F·B). Schaefer under a catch uses the exact solution of
 * the same ODE (why: fits and bootstraps evaluate hundreds of thousands of years; the specs hold it
 * to the odex path at 1e-8); Pella-Tomlinson and Fox use a Taylor series (surplus-taylor.ts, held
 * to odex at 1e-8 in surplus-taylor.spec.ts); depensation models use fixed-step RK4 (held to odex in
 * the specs); the others are integrated with odex.
 */
function stepYear(model: SurplusModelName, params: SurplusParams, B: number, C: number, opts: PathOptions): { B: number; collapsed: boolean } {
  const m = productionModel(model);
  const fishing = opts.control === 'F';
  if (m.stepper === 'logistic' && !fishing && !opts.forceOdex) {
    const step = logisticHarvest(params.r, params.K, C, B, 1);
    return { B: step.N, collapsed: step.collapseTime !== null };
  }
  if (m.stepper === 'taylor' && m.taylor && !opts.forceOdex) {
    const { a, b, q, nonlinearity } = m.taylor(params);
    // a fishing mortality F only lowers the linear coefficient: g(B) − F·B = (a − F)·B − b·N(B)
    const s = taylorYear(nonlinearity === 'log', fishing ? a - C : a, b, q, fishing ? 0 : C, B);
    return { B: s.B, collapsed: s.collapsed };
  }
  const rhs = fishing ? (b: number) => m.g(params, b) - C * b : (b: number) => m.g(params, b) - C;
  if (m.stepper === 'rk4' && !opts.forceOdex) {
    const s = rk4Scalar(rhs, B, 1, RK4_STEPS);
    return { B: s.y, collapsed: s.collapsed };
  }
  const res = integrate((_t, y) => [rhs(y[0]!)], 0, [B], 1, { tol: opts.tol ?? 1e-9, stopAtZero: true });
  return { B: res.collapsed ? 0 : res.y[0]!, collapsed: res.collapsed };
}

/**
 * Biomass at the start of each year from B(0) = B0, with removals[i] (a catch, or F when
 * control is 'F') taken during year i. A path that reaches zero stays at zero (collapse), never
 * negative or NaN.
 */
export function biomassPath(model: SurplusModelName, params: SurplusParams, B0: number, removals: number[], opts: PathOptions = {}): BiomassPath {
  const biomass = [B0];
  let B = B0;
  let collapseYear: number | null = null;
  for (let i = 0; i < removals.length; i++) {
    if (collapseYear !== null) {
      biomass.push(0);
      continue;
    }
    const step = stepYear(model, params, B, removals[i]!, opts);
    B = step.B;
    if (step.collapsed) collapseYear = i;
    biomass.push(B);
  }
  return { biomass, collapseYear };
}
