/**
 * Data-poor options: parameters held at a value, and priors on r and B0/K that turn the fit into a
 * penalised likelihood (objective = −ln L − ln π(θ)).
 */
import { betaNegLogDensity, betaShapes, lognormalNegLogDensity } from '../numerics/distributions';

export interface FixedParams {
  r?: number;
  K?: number;
  /** B0/K, the depletion at the start of the series. */
  d0?: number;
  /** Catchability per survey name. */
  q?: Record<string, number>;
  /** MSY held (r then follows from K and the shape): used by likelihood profiles. */
  msy?: number;
}

export type Prior =
  | { kind: 'lognormal'; median: number; sdLog: number }
  | { kind: 'beta'; mean: number; sd: number };

export interface ParamPriors {
  r?: Prior;
  d0?: Prior;
}

/** −ln π(x) for one prior. */
export function priorNegLog(prior: Prior, x: number): number {
  if (prior.kind === 'lognormal') return lognormalNegLogDensity(x, prior.median, prior.sdLog);
  const ab = betaShapes(prior.mean, prior.sd);
  if (!ab) throw new Error(`a beta prior with mean ${prior.mean} and sd ${prior.sd} does not exist (the mean must lie in (0, 1) and sd² < mean·(1 − mean))`);
  return betaNegLogDensity(x, ab.a, ab.b);
}

/** The penalty −Σ ln π(θ) of the priors given, at the natural parameters (large where a prior gives zero density). */
export function priorPenalty(priors: ParamPriors, p: { r: number; d0: number }): number {
  let total = 0;
  if (priors.r) total += priorNegLog(priors.r, p.r);
  if (priors.d0) total += priorNegLog(priors.d0, p.d0);
  return Number.isFinite(total) ? total : 1e9;
}

/** A sentence that says which parameters were fixed or given priors (empty when neither). */
export function constraintNote(fixed: FixedParams | undefined, priors: ParamPriors | undefined): string {
  const parts: string[] = [];
  const names: Record<string, string> = { r: 'r', K: 'K', d0: 'B0/K' };
  for (const k of ['r', 'K', 'd0'] as const) if (fixed?.[k] !== undefined) parts.push(`${names[k]} fixed at ${fixed[k]}`);
  for (const [ix, q] of Object.entries(fixed?.q ?? {})) parts.push(`q of ${ix} fixed at ${q}`);
  for (const k of ['r', 'd0'] as const) {
    const p = priors?.[k];
    if (p?.kind === 'lognormal') parts.push(`lognormal prior on ${names[k]} (median ${p.median}, sd of log ${p.sdLog})`);
    if (p?.kind === 'beta') parts.push(`beta prior on ${names[k]} (mean ${p.mean}, sd ${p.sd})`);
  }
  return parts.join('; ');
}
