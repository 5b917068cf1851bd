/**
 * Stochastic projections under a constant catch: each bootstrap replicate's parameters, its
 * end-of-series biomass, and lognormal process noise B_{t+1} = S(B_t, C)·exp(σ_p·ε − σ_p²/2).
 */
import type { Replicate } from '../uncertainty/bootstrap';
import { quantile } from '../uncertainty/bootstrap';
import { createRng } from '../numerics/random';
import { biomassPath, productionSlope, type SurplusModelName } from '../surplus/surplus';
import { equilibriaAt } from '../surplus/fold';

export interface ProjectionRequest {
  model: SurplusModelName;
  replicates: Replicate[];
  catchLevel: number;
  years: number;
  processSd: number;
  /** Limit reference point as a fraction of each replicate's B_MSY (common practice: 0.5). */
  limitFraction: number;
  seed: number;
}

export interface ProjectionResult {
  catchLevel: number;
  /** Share of replicates whose fold harvest h* is below this catch. */
  pPassFold: number;
  /** Share of replicates that fall below the limit reference point within the horizon. */
  pBelowLimit: number;
  /** Share that collapse (reach zero) within the horizon. */
  pCollapse: number;
  /** Per projected year (0 = end of series): median, 5% and 95% of biomass. */
  median: number[];
  lower: number[];
  upper: number[];
  /** Median return rate at the stable equilibrium for this catch (0 where past the fold). */
  returnRate: number;
}

/** Projects every replicate `years` ahead under the catch and summarises the spread. */
export function project(req: ProjectionRequest): ProjectionResult {
  const rng = createRng(req.seed);
  const paths: number[][] = [];
  let below = 0, collapsed = 0, passed = 0;
  const rates: number[] = [];
  for (const rep of req.replicates) {
    const params = { r: rep.r, K: rep.K, p: rep.p };
    let B = rep.bEnd;
    const path = [B];
    let hitLimit = B < req.limitFraction * rep.bMsy;
    for (let y = 0; y < req.years; y++) {
      const step = biomassPath(req.model, params, B, [req.catchLevel]);
      const noise = Math.exp(req.processSd * rng.normal() - (req.processSd ** 2) / 2);
      B = step.collapseYear !== null ? 0 : step.biomass[1]! * noise;
      path.push(B);
      if (B < req.limitFraction * rep.bMsy) hitLimit = true;
    }
    if (hitLimit) below++;
    if (B === 0) collapsed++;
    if (req.catchLevel > rep.hStar) passed++;
    rates.push(returnRateAt(req.model, params, rep.hStar, req.catchLevel));
    paths.push(path);
  }
  const n = req.replicates.length;
  const at = (y: number) => paths.map((p) => p[y]!);
  const ys = Array.from({ length: req.years + 1 }, (_, y) => y);
  return {
    catchLevel: req.catchLevel, pPassFold: passed / n, pBelowLimit: below / n, pCollapse: collapsed / n,
    median: ys.map((y) => quantile(at(y), 0.5)), lower: ys.map((y) => quantile(at(y), 0.05)), upper: ys.map((y) => quantile(at(y), 0.95)),
    returnRate: quantile(rates, 0.5),
  };
}

function returnRateAt(model: SurplusModelName, params: { r: number; K: number; p: number }, hStar: number, h: number): number {
  if (h >= hStar) return 0;
  if (model === 'schaefer') return params.r * Math.sqrt(1 - h / hStar);
  const eq = equilibriaAt(model, params, { hStar }, h);
  return eq ? Math.max(0, -productionSlope(model, params, eq.stable)) : 0;
}
