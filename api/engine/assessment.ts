/** The engine's entry points for one stock: fit with fold analysis, bootstrap, and a quota study. */
import { bootstrapInWorkers } from './uncertainty/bootstrap-pool';
import { quantile, runBootstrap, type Replicate } from './uncertainty/bootstrap';
import { fitSurplusRaw, type SurplusFitOptions } from './surplus/fit-surplus';
import { summariseFit, type SurplusFitSummary } from './fit/fit-summary';
import { constraintNote } from './fit/constraints';
import { surplusFold, type FoldAnalysis } from './surplus/fold';
import { project, type ProjectionResult } from './projection/projection';
import { proposeQuota, type QuotaProposal, type RampRule } from './projection/quota';
import type { StockSeries } from './data/series';

export const ENGINE_VERSION = '0.1.0';

export interface Assessment {
  fit: SurplusFitSummary;
  fold: FoldAnalysis;
}

/** Fits a surplus-production model and continues its equilibria in harvest to the fold. */
export function assessSurplus(series: StockSeries, opts: SurplusFitOptions): Assessment {
  const fit = summariseFit(series, fitSurplusRaw(series, opts), { constraints: constraintNote(opts.fixed, opts.priors) });
  const fold = surplusFold(fit.model as SurplusFitOptions['model'], fit.params);
  return { fit: { ...fit, hStar: fold.hStar }, fold };
}

export interface BootstrapOptions {
  replicates: number;
  seed: number;
  workers?: number;
  onProgress?: (done: number, total: number) => void;
  signal?: AbortSignal;
}

/** Bootstrap replicates of a fit, in worker threads (workers: 0 runs them on this thread). */
export async function bootstrapFit(series: StockSeries, opts: SurplusFitOptions, fit: SurplusFitSummary, b: BootstrapOptions): Promise<Replicate[]> {
  const req = { series, options: opts, fit: { free: fit.free, indices: fit.indices, years: fit.years }, replicates: b.replicates, seed: b.seed };
  if (b.workers === 0) return runBootstrap(req, (d) => b.onProgress?.(d, b.replicates), () => b.signal?.aborted ?? false);
  return bootstrapInWorkers(req, { workers: b.workers, onProgress: b.onProgress, signal: b.signal });
}

export interface QuotaStudyOptions {
  risk: number;
  rule: RampRule;
  candidates: number[];
  years: number;
  processSd: number;
  limitFraction: number;
  seed: number;
}

export interface QuotaStudy {
  proposal: QuotaProposal;
  candidates: ProjectionResult[];
  intervals: Record<string, [number, number]>;
}

/** Quota proposal and projections for candidate catches (the proposal is always among them). */
export function quotaStudy(model: SurplusFitOptions['model'], fit: SurplusFitSummary, replicates: Replicate[], opts: QuotaStudyOptions): QuotaStudy {
  const current = { B: fit.biomass[fit.biomass.length - 1]!, bMsy: fit.reference.bMsy, fMsy: fit.reference.fMsy };
  const proposal = proposeQuota(replicates, current, opts.risk, opts.rule);
  const levels = [...new Set([...opts.candidates, Math.round(proposal.proposed)])].sort((a, b) => a - b);
  const candidates = levels.map((catchLevel, i) => project({
    model, replicates, catchLevel, years: opts.years, processSd: opts.processSd, limitFraction: opts.limitFraction, seed: opts.seed + i,
  }));
  const intervals: Record<string, [number, number]> = {};
  for (const k of ['r', 'K', 'msy', 'hStar', 'bMsy'] as const) intervals[k] = [quantile(replicates.map((r) => r[k]), 0.025), quantile(replicates.map((r) => r[k]), 0.975)];
  return { proposal, candidates, intervals };
}
