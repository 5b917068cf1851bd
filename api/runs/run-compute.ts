/** What one run computes, from a series and its options, reporting progress: engine calls only, no I/O. */
import { assessSurplus, bootstrapFit, quotaStudy, roundLevel } from '../engine/assessment';
import { collapsePoints } from '../engine/projection/quota';
import { quantile } from '../engine/uncertainty/bootstrap';
import { earlyWarning } from '../engine/diagnostics/early-warning';
import { diagnoseSurplus } from '../engine/diagnostics/diagnose';
import { assessLinked, bootstrapLinked, linkedIntervals } from '../engine/linked/linked-assessment';
import type { LinkedModelName } from '../engine/linked/fit-predator-prey';
import { pairStudy } from '../engine/linked/pair-study';
import type { StockSeries } from '../engine/data/series';
import type { SurplusModelName } from '../engine/surplus/surplus';
import { assessDiscrete } from '../engine/discrete/assess-discrete';
import { spatialStudy } from '../engine/spatial/assess-spatial';
import { parseMaskCsv } from '../engine/spatial/mask-csv';
import type { PredatorPreyRunResults, RunOptions, RunResults, SurplusRunResults } from './run.schemas';

export type Progress = (fraction: number, stage: string) => void;

async function surplusRun(series: StockSeries, model: SurplusModelName, o: RunOptions, progress: Progress): Promise<SurplusRunResults> {
  progress(0.02, o.priors ? 'Fitting the model (penalised likelihood)' : 'Fitting the model');
  const opts = { model, shape: model === 'pella-tomlinson' ? o.shape : undefined, fixed: o.fixed, priors: o.priors, allowAboveK: o.allowAboveK ?? false, errors: o.errors ?? 'observation' };
  const { fit, fold } = assessSurplus(series, opts);
  progress(0.1, 'Fit done; continuing the equilibria to the fold');
  const resid = fit.indices[0]!.residuals.map((r, i) => [series.years[i]!, r] as const).filter((p): p is readonly [number, number] => p[1] !== null);
  const ew = resid.length >= 12 ? earlyWarning(resid.map((p) => p[0]), resid.map((p) => p[1])) : null;
  const share = o.bootstrap === 0 ? 0.88 : 0.3;
  const diagnostics = o.diagnostics === false ? null : diagnoseSurplus(series, opts, fit, {
    peel: o.peel ?? 5, jitter: o.jitter ?? 20, seed: o.seed,
    onProgress: (f, stage) => progress(0.1 + share * f, `Diagnostics: ${stage}`),
  });
  if (o.bootstrap === 0) return { kind: 'surplus', fit, fold, bootstrap: null, quota: null, earlyWarning: ew, diagnostics };
  const start = 0.1 + share;
  const reps = await bootstrapFit(series, opts, fit, {
    replicates: o.bootstrap, seed: o.seed, workers: 2,
    onProgress: (done, total) => progress(start + ((0.9 - start) * done) / total, `Bootstrap ${done} of ${total}`),
  });
  progress(0.92, 'Projecting candidate quotas and the rebuilding table');
  const h = reps.map((r) => r.hStar);
  const control = o.control ?? 'catch';
  const collapse5 = quantile(collapsePoints(reps, control).filter(Number.isFinite), 0.05);
  const quota = quotaStudy(model, fit, reps, {
    risk: o.risk, rule: { limit: o.limit, trigger: o.trigger, fTargetOverFmsy: o.fTarget }, control,
    candidates: o.candidates.length ? o.candidates : [0.5, 0.75, 1, 1.1].map((f) => roundLevel(f * collapse5, control)).filter((v) => Number.isFinite(v)),
    years: o.years, processSd: o.processSd, limitFraction: o.limit, seed: o.seed,
  });
  return {
    kind: 'surplus', fit, fold, earlyWarning: ew, quota, diagnostics,
    bootstrap: { replicates: reps.length, hStar: { p5: quantile(h, 0.05), p50: quantile(h, 0.5), p95: quantile(h, 0.95) }, intervals: quota.intervals, draws: reps },
  };
}

async function predatorPreyRun(series: StockSeries, model: LinkedModelName, o: RunOptions, progress: Progress): Promise<PredatorPreyRunResults> {
  const opts = { model, conversion: o.conversion, saturation: o.saturation };
  const a = assessLinked(series, opts, (f, stage) => progress(0.4 * f, stage));
  const reps = o.bootstrap > 0
    ? await bootstrapLinked(series, opts, a.fit, { replicates: o.bootstrap, seed: o.seed, workers: 2, onProgress: (d, t) => progress(0.2 + (0.7 * d) / t, `Bootstrap ${d} of ${t}`) })
    : [];
  progress(0.92, 'Margins of the present catches in the catch plane');
  const n = a.preyCatch.length - 1;
  const current = pairStudy(a.fit.spec, reps, a.preyCatch[n]!, a.predatorCatch[n]!, {
    years: o.years, processSd: o.processSd, limitFraction: o.limitFraction, seed: o.seed + 101, preyMax: a.catchPlane.preyMax, predatorMax: a.catchPlane.predatorMax,
  });
  progress(0.99, 'Done');
  return {
    kind: 'predator-prey', years: series.years, ...a,
    bootstrap: reps.length ? { replicates: reps.length, intervals: linkedIntervals(reps), draws: reps } : null,
    current,
  };
}

function spatialRun(o: RunOptions, progress: Progress): RunResults {
  const sp = o.spatial!;
  const designs = sp.designs.map((d) => {
    if (d.maskCsv === undefined) return { name: d.name, reserves: d.reserves ?? [] };
    const m = parseMaskCsv(d.maskCsv);
    if (!m.ok) throw new Error(`the mask of design "${d.name}" is not valid (line ${m.errors[0]!.line}: ${m.errors[0]!.problem})`);
    return { name: d.name, mask: m.mask };
  });
  return spatialStudy({
    growth: sp.growth, params: { r: sp.r, K: sp.K, D: sp.D, ...(sp.A !== undefined ? { A: sp.A } : {}) }, fishing: sp.fishing,
    habitat: sp.habitat.kind === 'coast' ? { kind: 'coast', length: sp.habitat.length, cells: sp.habitat.cells } : { kind: 'grid', cellKm: sp.habitat.cellKm },
    designs, onProgress: progress,
  });
}

/** Runs the model a run asks for. */
export async function computeRun(series: StockSeries, model: string, options: RunOptions, progress: Progress): Promise<RunResults> {
  if (model === 'reaction-diffusion') return spatialRun(options, progress);
  if (model === 'ricker' || model === 'beverton-holt') {
    return assessDiscrete(series, { model, bootstrap: options.bootstrap, seed: options.seed, risk: options.risk, onProgress: progress });
  }
  if (model === 'rosenzweig-macarthur' || model === 'lotka-volterra') return predatorPreyRun(series, model, { ...options, conversion: options.conversion ?? 0.25 }, progress);
  return surplusRun(series, model as SurplusModelName, options, progress);
}
