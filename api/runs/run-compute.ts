/** What one run computes, from a series and its options, reporting progress: engine calls only, no I/O. */
import { assessSurplus, bootstrapFit, quotaStudy } from '../engine/assessment';
import { quantile } from '../engine/uncertainty/bootstrap';
import { earlyWarning } from '../engine/diagnostics/early-warning';
import { diagnoseSurplus } from '../engine/diagnostics/diagnose';
import { fitPredatorPrey } from '../engine/linked/fit-predator-prey';
import { harvestBifurcations, interiorEquilibrium } from '../engine/linked/predator-prey';
import { filledCatches, type StockSeries } from '../engine/data/series';
import type { SurplusModelName } from '../engine/surplus/surplus';
import type { PredatorPreyRunResults, RunOptions, RunResults, SurplusRunResults } from './run.schemas';

export type Progress = (fraction: number, stage: string) => void;

async function surplusRun(series: StockSeries, model: SurplusModelName, o: RunOptions, progress: Progress): Promise<SurplusRunResults> {
  progress(0.02, o.priors ? 'Fitting the model (penalised likelihood)' : 'Fitting the model');
  const opts = { model, shape: model === 'pella-tomlinson' ? o.shape : undefined, fixed: o.fixed, priors: o.priors };
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
  progress(0.92, 'Projecting candidate quotas');
  const h = reps.map((r) => r.hStar);
  const quota = quotaStudy(model, fit, reps, {
    risk: o.risk, rule: { limit: o.limit, trigger: o.trigger, fTargetOverFmsy: o.fTarget },
    candidates: o.candidates.length ? o.candidates : [0.5, 0.75, 1, 1.1].map((f) => Math.round(f * quantile(h, 0.05))),
    years: o.years, processSd: o.processSd, limitFraction: o.limitFraction, seed: o.seed,
  });
  return {
    kind: 'surplus', fit, fold, earlyWarning: ew, quota, diagnostics,
    bootstrap: { replicates: reps.length, hStar: { p5: quantile(h, 0.05), p50: quantile(h, 0.5), p95: quantile(h, 0.95) }, intervals: quota.intervals, draws: reps },
  };
}

function predatorPreyRun(series: StockSeries, model: 'rosenzweig-macarthur' | 'lotka-volterra', o: RunOptions, progress: Progress): PredatorPreyRunResults {
  progress(0.05, 'Fitting the predator-prey model');
  const fit = fitPredatorPrey(series, { model, e: o.conversion });
  progress(0.7, 'Continuing equilibria in prey and predator catch');
  const preyCatch = filledCatches(series, 'catches').catches;
  const predatorCatch = filledCatches(series, 'predatorCatches').catches;
  const [N, P] = interiorEquilibrium(fit.spec);
  const empty = { points: [], events: [] };
  const ok = N > 0 && P > 0;
  const bifurcations = {
    preyCatch: ok ? harvestBifurcations(fit.spec, {}, 'preyCatch', [N, P], 4 * Math.max(...preyCatch)) : empty,
    predatorCatch: ok ? harvestBifurcations(fit.spec, {}, 'predatorCatch', [N, P], 4 * Math.max(...predatorCatch)) : empty,
  };
  const K = fit.spec.params.K;
  const preyNullcline: [number, number][] = [];
  if (fit.spec.model === 'rosenzweig-macarthur') {
    const { r, a, h } = fit.spec.params;
    for (let i = 1; i <= 60; i++) { const n = (K * i) / 60; preyNullcline.push([n, (r / a) * (1 - n / K) * (1 + a * h * n)]); }
  } else {
    const { a, b } = fit.spec.params;
    for (let i = 1; i <= 60; i++) { const n = (K * i) / 60; preyNullcline.push([n, (a / b) * (1 - n / K)]); }
  }
  progress(0.98, 'Done');
  return { kind: 'predator-prey', fit, years: series.years, preyCatch, predatorCatch, bifurcations, preyNullcline, predatorNullcline: ok ? N : null };
}

/** Runs the model a run asks for. */
export async function computeRun(series: StockSeries, model: string, options: RunOptions, progress: Progress): Promise<RunResults> {
  if (model === 'rosenzweig-macarthur' || model === 'lotka-volterra') return predatorPreyRun(series, model, options, progress);
  return surplusRun(series, model as SurplusModelName, options, progress);
}
