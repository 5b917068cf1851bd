/**
 * Rebuilding: years for a depleted stock to reach B_MSY under candidate harvest levels (including
 * zero), from the run's replicates and the same noise streams as its projections; and a plain
 * statement where recovery is impossible at a level (past the fold, below the threshold, or held on
 * the lower branch beyond the recovery fold).
 */
import { quantile, type Replicate } from '../uncertainty/bootstrap';
import { replicatePath, replicateStream } from './projection';
import { stateAtControl, analyseEquilibria } from '../surplus/equilibria';
import { productionModel } from '../surplus/registry';
import type { HarvestControl, SurplusModelName, SurplusParams } from '../surplus/surplus';

export interface RebuildRow {
  level: number;
  control: HarvestControl;
  /** Years to first reach B_MSY: median and 5–95% over replicates; null where beyond the horizon. */
  median: number | null;
  p5: number | null;
  p95: number | null;
  /** Share of replicates that reach B_MSY within the horizon. */
  pWithin: number;
  /** Why the stock cannot rebuild at this level (point estimate), or null. */
  impossible: string | null;
}

export interface RebuildRequest {
  model: SurplusModelName;
  replicates: Replicate[];
  levels: number[];
  control: HarvestControl;
  horizon: number;
  processSd: number;
  seed: number;
  /** Point estimate and current biomass, for the plain statements. */
  params: SurplusParams;
  current: number;
  bMsy: number;
}

/** Why recovery to B_MSY is impossible at a level, from the point estimate; null when it is possible. */
export function recoveryObstacle(model: SurplusModelName, params: SurplusParams, control: HarvestControl, level: number, current: number, bMsy: number): string | null {
  const m = productionModel(model);
  const unit = control === 'F' ? `F = ${level.toPrecision(3)}` : `a catch of ${Math.round(level).toLocaleString('en-GB')}`;
  const s = stateAtControl(m, params, control, level);
  if (s.stable === null) return `Impossible: ${unit} is past the fold; there is no stable stock at this level.`;
  if (s.threshold !== null && s.threshold > 0 && current < s.threshold) {
    const a = analyseEquilibria(m, params, control);
    const lowerHolds = a.lower && level >= a.lower.from && level <= a.lower.to;
    return lowerHolds
      ? `Impossible: at ${unit} the stock is held on the lower branch; it returns only below the recovery fold${a.recovery ? ` (${a.recovery.at.toPrecision(3)})` : ''}.`
      : `Impossible: the stock is below the threshold of ${Math.round(s.threshold).toLocaleString('en-GB')} at ${unit} and declines${m.depensation ? ' (depensation)' : ''}.`;
  }
  if (s.stable < bMsy * (1 - 1e-9)) return `Not to B_MSY: at ${unit} the stock settles at ${Math.round(s.stable).toLocaleString('en-GB')}, below B_MSY.`;
  return null;
}

/** The rebuilding table: one row per level. */
export function rebuildTable(req: RebuildRequest): RebuildRow[] {
  return req.levels.map((level) => {
    const years = req.replicates.map((rep, i) => {
      if (rep.bEnd >= rep.bMsy) return 0;
      const path = replicatePath(req.model, rep, level, req.control, req.horizon, req.processSd, replicateStream(req.seed, i), (B) => B >= rep.bMsy);
      const k = path.findIndex((B) => B >= rep.bMsy);
      return k < 0 ? Infinity : k;
    });
    const q = (p: number) => { const v = quantile(years, p); return Number.isFinite(v) ? v : null; };
    return {
      level, control: req.control, median: q(0.5), p5: q(0.05), p95: q(0.95),
      pWithin: years.filter(Number.isFinite).length / years.length,
      impossible: recoveryObstacle(req.model, req.params, req.control, level, req.current, req.bMsy),
    };
  });
}
