/**
 * Stochastic projections under a constant catch or a constant fishing mortality F: each bootstrap
 * replicate's parameters, its end-of-series biomass, and lognormal process noise
 * B_{t+1} = S(B_t)·exp(σ_p·ε − σ_p²/2). One run draws its noise from one seed: replicate i always
 * gets the same deviates (its own stream), so every harvest level, every screen, the PDF and the
 * command line see the same figure for the same level (common random numbers).
 */
import type { Replicate } from '../uncertainty/bootstrap';
import { quantile } from '../uncertainty/bootstrap';
import { createRng, type Rng } from '../numerics/random';
import { biomassPath, type HarvestControl, type SurplusModelName, type SurplusParams } from '../surplus/surplus';
import { analyseEquilibria, stateAtControl } from '../surplus/equilibria';
import { productionModel } from '../surplus/registry';

export interface ProjectionRequest {
  model: SurplusModelName;
  replicates: Replicate[];
  /** Harvest level: a catch per year, or F per year when control is 'F'. */
  catchLevel: number;
  control?: HarvestControl;
  years: number;
  processSd: number;
  /** The limit reference point as a fraction of each replicate's B_MSY (one value for the whole run). */
  limitFraction: number;
  seed: number;
  /** A state-dependent level (a harvest control rule): replaces catchLevel year by year. */
  rule?: (B: number, rep: Replicate) => number;
}

export interface ProjectionResult {
  /** Harvest level (catch, or F when control is 'F'). */
  catchLevel: number;
  control?: HarvestControl;
  /** Share of replicates whose collapse point (h* or F*) is below this level. */
  pPassFold: number;
  /** Share of replicates that fall below the limit reference point within the horizon. */
  pBelowLimit: number;
  /** Share that collapse (reach zero) within the horizon. */
  pCollapse: number;
  /** Share whose path falls below the unstable threshold at this level within the horizon (past the fold: all). */
  pCrossThreshold?: number;
  /** Median over replicates of the unstable threshold at this level (0 where extinction is the only lower state). */
  thresholdMedian?: number | null;
  /** Per projected year (0 = end of series): median, 5% and 95% of biomass. */
  median: number[];
  lower: number[];
  upper: number[];
  /** Median return rate at the stable equilibrium for this level (0 where past the fold). */
  returnRate: number;
}

/** The noise stream of replicate i in a run with this seed. */
export function replicateStream(seed: number, i: number): Rng {
  return createRng((seed ^ Math.imul(i + 1, 0x9e3779b1)) >>> 0);
}

/** Natural parameters of a replicate. */
export function replicateParams(rep: Replicate): SurplusParams {
  const p: SurplusParams = { r: rep.r, K: rep.K, p: rep.p };
  if (rep.A !== undefined) p.A = rep.A;
  if (rep.c !== undefined) p.c = rep.c;
  if (rep.a !== undefined) p.a = rep.a;
  return p;
}

/** One replicate's path under a constant level, with its noise stream; stops at `stop` when given. */
export function replicatePath(model: SurplusModelName, rep: Replicate, level: number | ((B: number, rep: Replicate) => number), control: HarvestControl, years: number, processSd: number, rng: Rng, stop?: (B: number) => boolean): number[] {
  const params = replicateParams(rep);
  let B = rep.bEnd;
  const path = [B];
  for (let y = 0; y < years; y++) {
    const eps = rng.normal();
    if (B > 0) {
      const step = biomassPath(model, params, B, [typeof level === 'number' ? level : level(B, rep)], { control });
      B = step.collapseYear !== null ? 0 : step.biomass[1]! * Math.exp(processSd * eps - processSd ** 2 / 2);
    }
    path.push(B);
    if (stop?.(B)) break;
  }
  return path;
}

/** Projects every replicate `years` ahead at the level and summarises the spread. */
export function project(req: ProjectionRequest): ProjectionResult {
  const control = req.control ?? 'catch';
  const m = productionModel(req.model);
  const paths: number[][] = [];
  let below = 0, collapsed = 0, passed = 0, crossed = 0;
  const rates: number[] = [];
  const thresholds: number[] = [];
  req.replicates.forEach((rep, i) => {
    const params = replicateParams(rep);
    const path = replicatePath(req.model, rep, req.rule ?? req.catchLevel, control, req.years, req.processSd, replicateStream(req.seed, i));
    const limit = req.limitFraction * rep.bMsy;
    if (path.some((B) => B < limit)) below++;
    if (path[path.length - 1] === 0) collapsed++;
    const collapseAt = control === 'catch' ? rep.hStar : rep.fStar ?? analyseEquilibria(m, params, 'F').collapse?.at ?? Infinity;
    if (req.catchLevel > collapseAt) passed++;
    const s = stateAtControl(m, params, control, req.catchLevel);
    rates.push(s.returnRate);
    if (s.threshold === null) crossed++;
    else {
      thresholds.push(s.threshold);
      if (path.some((B) => B < s.threshold! || B === 0)) crossed++;
    }
    paths.push(path);
  });
  const n = req.replicates.length;
  const at = (y: number) => paths.map((p) => p[y]!);
  const ys = Array.from({ length: req.years + 1 }, (_, y) => y);
  return {
    catchLevel: req.catchLevel, control, pPassFold: passed / n, pBelowLimit: below / n, pCollapse: collapsed / n,
    pCrossThreshold: crossed / n, thresholdMedian: thresholds.length * 2 > n ? quantile(thresholds, 0.5) : null,
    median: ys.map((y) => quantile(at(y), 0.5)), lower: ys.map((y) => quantile(at(y), 0.05)), upper: ys.map((y) => quantile(at(y), 0.95)),
    returnRate: quantile(rates, 0.5),
  };
}
