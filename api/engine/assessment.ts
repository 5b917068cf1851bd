/** The engine's entry points for one stock: fit with fold analysis, bootstrap, and a quota study. */
import { bootstrapInWorkers } from './uncertainty/bootstrap-pool';
import { quantile, runBootstrap, type Replicate } from './uncertainty/bootstrap';
import { fitSurplusRaw, type SurplusFitOptions } from './surplus/fit-surplus';
import { summariseFit, type SurplusFitSummary } from './fit/fit-summary';
import { constraintNote } from './fit/constraints';
import { surplusFold, type FoldAnalysis } from './surplus/fold';
import { project, type ProjectionResult } from './projection/projection';
import { proposeQuota, rampF, type QuotaProposal, type RampRule } from './projection/quota';
import { rebuildTable, type RebuildRow } from './projection/rebuild';
import { stateAtControl } from './surplus/equilibria';
import { productionModel } from './surplus/registry';
import type { HarvestControl, SurplusModelName } from './surplus/surplus';
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
  /** The run's one limit reference point, as B_lim/B_MSY (also the ramp rule's limit). */
  limitFraction: number;
  seed: number;
  /** How the proposal and candidates are expressed (default a catch). */
  control?: HarvestControl;
  /** Horizon of the rebuilding table in years (default 30); 0 leaves it out. */
  rebuildYears?: number;
}

/** Where the stock stands against the unstable threshold at the proposed level. */
export interface StateMargin {
  control: HarvestControl;
  level: number;
  current: number;
  /** Upper stable state at this level (null past the fold). */
  stable: number | null;
  /** Unstable threshold below it (0 when the only lower state is extinction; null past the fold). */
  threshold: number | null;
  /** Current biomass minus the threshold, in biomass units and as a fraction of current biomass. */
  distance: number | null;
  fraction: number | null;
  /** Return rate at the stable state (per year). */
  returnRate: number;
  /** Probability of falling below the threshold within the projection years (process noise and parameter uncertainty). */
  pCross: number;
  years: number;
}

export interface QuotaStudy {
  proposal: QuotaProposal;
  candidates: ProjectionResult[];
  intervals: Record<string, [number, number]>;
  /** Absent in runs stored before state margins, rebuilding tables and rule projections. */
  stateMargin?: StateMargin;
  rebuild?: RebuildRow[];
  /** The ramp rule projected as an F rule. */
  ruleProjection?: ProjectionResult;
  /** Seed of the run's one noise stream: every level is projected from it. */
  seed?: number;
}

/** Rounds a level for display tables: whole units for a catch, three significant figures for F. */
export function roundLevel(level: number, control: HarvestControl = 'catch'): number {
  return control === 'F' ? Number(level.toPrecision(3)) : Math.round(level);
}

/** The run's projection at one level: the one function every screen, the PDF and the command line use. */
export function projectLevel(model: SurplusModelName, replicates: Replicate[], level: number, o: Pick<QuotaStudyOptions, 'years' | 'processSd' | 'limitFraction' | 'seed' | 'control'>): ProjectionResult {
  return project({ model, replicates, catchLevel: level, control: o.control ?? 'catch', years: o.years, processSd: o.processSd, limitFraction: o.limitFraction, seed: o.seed });
}

/** The state margin at a projected level: the point estimate's threshold and return rate, and the projection's crossing probability. */
export function stateMarginAt(model: SurplusModelName, fit: Pick<SurplusFitSummary, 'params' | 'biomass'>, control: HarvestControl, projection: ProjectionResult): StateMargin {
  const B = fit.biomass[fit.biomass.length - 1]!;
  const level = projection.catchLevel;
  const s = stateAtControl(productionModel(model), fit.params, control, level);
  return {
    control, level, current: B, stable: s.stable, threshold: s.threshold,
    distance: s.threshold === null ? null : B - s.threshold, fraction: s.threshold === null ? null : (B - s.threshold) / B,
    returnRate: s.returnRate, pCross: projection.pCrossThreshold ?? 0, years: projection.median.length - 1,
  };
}

/** Quota proposal and projections for candidate levels (the proposal is always among them), state margin and rebuilding table. */
export function quotaStudy(model: SurplusModelName, fit: SurplusFitSummary, replicates: Replicate[], opts: QuotaStudyOptions): QuotaStudy {
  const control = opts.control ?? 'catch';
  const B = fit.biomass[fit.biomass.length - 1]!;
  const current = { B, bMsy: fit.reference.bMsy, fMsy: fit.reference.fMsy };
  const proposal = proposeQuota(replicates, current, opts.risk, opts.rule, control);
  const levels = [...new Set([...opts.candidates, roundLevel(proposal.proposed, control)])].sort((a, b) => a - b);
  const candidates = levels.map((level) => projectLevel(model, replicates, level, { ...opts, control }));
  const intervals: Record<string, [number, number]> = {};
  for (const k of ['r', 'K', 'msy', 'hStar', 'bMsy'] as const) intervals[k] = [quantile(replicates.map((r) => r[k]), 0.025), quantile(replicates.map((r) => r[k]), 0.975)];
  const atProposal = candidates.find((c) => c.catchLevel === roundLevel(proposal.proposed, control))!;
  const stateMargin = stateMarginAt(model, fit, control, atProposal);
  const rule = opts.rule;
  const ruleProjection = project({
    model, replicates, catchLevel: 0, control: 'F', years: opts.years, processSd: opts.processSd, limitFraction: opts.limitFraction, seed: opts.seed,
    rule: (b, rep) => rampF(rule, b, rep.bMsy, rep.fMsy),
  });
  const rebuild = (opts.rebuildYears ?? 30) > 0 ? rebuildTable({
    model, replicates, levels: [0, ...levels.filter((l) => l > 0)], control, horizon: opts.rebuildYears ?? 30, processSd: opts.processSd, seed: opts.seed,
    params: fit.params, current: B, bMsy: fit.reference.bMsy,
  }) : undefined;
  return { proposal, candidates, intervals, stateMargin, rebuild, ruleProjection, seed: opts.seed };
}
