/** The engine's entry points for linked stocks (predator-prey pairs and three-level food chains). */
import { filledCatches, type StockSeries } from '../data/series';
import type { Branch } from '../numerics/continuation';
import { quantile } from '../uncertainty/bootstrap';
import { runLinkedBootstrap, type LinkedReplicate } from './bootstrap-linked';
import { linkedBootstrapInWorkers } from './bootstrap-linked-pool';
import { catchPlane, type CatchPlane } from './catch-plane';
import { chainLyapunov, maximaDiagram, poincareSection, predictabilityHorizon, sampleAttractor, type MaximaColumn } from './chain-dynamics';
import { compareLinkedFits, fitPredatorPrey, type LinkedModelName, type PredatorPreyFit, type PredatorPreyFitOptions } from './fit-predator-prey';
import type { ChainHarvest, FoodChainParams } from './food-chain';
import { harvestBifurcations, interiorEquilibrium } from './predator-prey';

export interface LinkedAssessment {
  fit: PredatorPreyFit;
  /** Both models fitted to the same data: the comparison the assessor reads. */
  comparison: ReturnType<typeof compareLinkedFits>;
  bifurcations: { preyCatch: Branch; predatorCatch: Branch };
  catchPlane: CatchPlane;
  preyNullcline: [number, number][];
  predatorNullcline: number | null;
  preyCatch: number[];
  predatorCatch: number[];
}

/** Fits the chosen model (and the other one for comparison), continues the equilibria and maps the catch plane. */
export function assessLinked(series: StockSeries, opts: PredatorPreyFitOptions, progress?: (f: number, stage: string) => void): LinkedAssessment {
  progress?.(0.02, 'Fitting the predator-prey model');
  const fit = fitPredatorPrey(series, opts);
  progress?.(0.2, 'Fitting the other model for comparison');
  const other: LinkedModelName = opts.model === 'lotka-volterra' ? 'rosenzweig-macarthur' : 'lotka-volterra';
  let comparison = compareLinkedFits([fit]);
  try {
    comparison = compareLinkedFits([fit, fitPredatorPrey(series, { ...opts, model: other, saturation: undefined })]);
  } catch { /* the comparison is informative only; the chosen model's fit stands alone */ }
  progress?.(0.35, 'Continuing equilibria in prey and predator catch');
  const preyCatch = filledCatches(series, 'catches').catches;
  const predatorCatch = filledCatches(series, 'predatorCatches').catches;
  const [N, P] = interiorEquilibrium(fit.spec);
  const ok = N > 0 && P > 0;
  const empty = { points: [], events: [] };
  const preyMax = 4 * Math.max(...preyCatch, 1), predatorMax = 4 * Math.max(...predatorCatch, 1);
  const bifurcations = {
    preyCatch: ok ? harvestBifurcations(fit.spec, {}, 'preyCatch', [N, P], preyMax) : empty,
    predatorCatch: ok ? harvestBifurcations(fit.spec, {}, 'predatorCatch', [N, P], predatorMax) : empty,
  };
  progress?.(0.45, 'Mapping the catch plane');
  const plane = catchPlane(fit.spec, preyMax, predatorMax, 24);
  const K = fit.spec.params.K;
  const preyNullcline: [number, number][] = [];
  for (let i = 1; i <= 60; i++) {
    const n = (K * i) / 60;
    preyNullcline.push([n, fit.spec.model === 'rosenzweig-macarthur'
      ? (fit.spec.params.r / fit.spec.params.a) * (1 - n / K) * (1 + fit.spec.params.a * fit.spec.params.h * n)
      : (fit.spec.params.a / fit.spec.params.b) * (1 - n / K)]);
  }
  return { fit, comparison, bifurcations, catchPlane: plane, preyNullcline, predatorNullcline: ok ? N : null, preyCatch, predatorCatch };
}

export interface LinkedBootstrapOptions {
  replicates: number;
  seed: number;
  workers?: number;
  onProgress?: (done: number, total: number) => void;
  signal?: AbortSignal;
}

/** Bootstrap replicates of a predator-prey fit, in worker threads (workers: 0 runs them on this thread). */
export function bootstrapLinked(series: StockSeries, opts: PredatorPreyFitOptions, fit: PredatorPreyFit, b: LinkedBootstrapOptions): Promise<LinkedReplicate[]> {
  const req = { series, options: { ...opts, initial: undefined }, fit: { free: fit.free, indices: fit.indices }, replicates: b.replicates, seed: b.seed };
  if (b.workers === 0) return Promise.resolve(runLinkedBootstrap(req, (d) => b.onProgress?.(d, b.replicates), () => b.signal?.aborted ?? false));
  return linkedBootstrapInWorkers(req, { workers: b.workers, onProgress: b.onProgress, signal: b.signal });
}

/** Percentile intervals (2.5–97.5%) of the estimated parameters and the unharvested equilibrium over the replicates. */
export function linkedIntervals(reps: LinkedReplicate[]): Record<string, [number, number]> {
  const out: Record<string, [number, number]> = {};
  const q = (xs: number[]): [number, number] => [quantile(xs, 0.025), quantile(xs, 0.975)];
  if (!reps.length) return out;
  const params = reps[0]!.spec.params as unknown as Record<string, number>;
  for (const k of Object.keys(params)) out[k] = q(reps.map((r) => (r.spec.params as unknown as Record<string, number>)[k]!));
  out['N*'] = q(reps.map((r) => r.equilibrium[0]));
  out['P*'] = q(reps.map((r) => r.equilibrium[1]));
  return out;
}

export interface ChainStudyOptions {
  /** Relative initial error (the survey error), default 0.05. */
  error?: number;
  harvest?: ChainHarvest;
  /** Level whose fishing mortality the successive-maxima diagram varies, and its largest value. */
  diagram?: { level: 0 | 1 | 2; maxRate: number; steps: number } | null;
  onProgress?: (f: number, stage: string) => void;
}

export interface ChainStudy {
  lyapunov: number[];
  horizonYears: number | null;
  error: number;
  tolerance: number;
  regime: 'equilibrium' | 'cycle' | 'chaos';
  attractor: { step: number; points: number[][]; logSd: number[]; mean: number[] };
  poincare: { prey: number; top: number }[];
  diagram: MaximaColumn[] | null;
}

/** Lyapunov spectrum, predictability horizon, attractor, Poincaré section and successive-maxima diagram of a chain. */
export function chainStudy(p: FoodChainParams, y0: number[], o: ChainStudyOptions = {}): ChainStudy {
  const error = o.error ?? 0.05;
  const h = o.harvest ?? {};
  o.onProgress?.(0.05, 'Settling on the attractor');
  const attractor = sampleAttractor(p, y0, h, { transient: 1000 / p.r, years: 1000 / p.r, step: 0.25 / p.r });
  o.onProgress?.(0.25, 'Lyapunov exponents');
  const start = attractor.points[attractor.points.length - 1]!;
  const lyapunov = start.every((v) => v > 0) ? chainLyapunov(p, start, h, { transient: 0, onProgress: (f) => o.onProgress?.(0.25 + 0.35 * f, 'Lyapunov exponents') }) : [0, 0, 0];
  const living = attractor.logSd.filter((v, k) => v > 0 && start[k]! > 0);
  const tolerance = living.length ? Math.min(...living) : 0;
  const lambda1 = lyapunov[0]!;
  const horizon = predictabilityHorizon(lambda1, error, tolerance);
  const regime = lambda1 > 1e-3 * p.r ? 'chaos' : attractor.logSd.some((v) => v > 1e-3) ? 'cycle' : 'equilibrium';
  let diagram: MaximaColumn[] | null = null;
  if (o.diagram) {
    const { level, maxRate, steps } = o.diagram;
    const rates = Array.from({ length: steps + 1 }, (_, i) => (maxRate * i) / steps);
    diagram = maximaDiagram(p, y0, level, rates, { transient: 600 / p.r, years: 900 / p.r, onProgress: (f) => o.onProgress?.(0.6 + 0.38 * f, 'Successive maxima against fishing mortality') });
  }
  const thin = Math.max(1, Math.floor(attractor.points.length / 1500));
  return {
    lyapunov, horizonYears: Number.isFinite(horizon) ? horizon : null, error, tolerance, regime,
    attractor: { ...attractor, points: attractor.points.filter((_, i) => i % thin === 0), step: attractor.step * thin },
    poincare: poincareSection(attractor), diagram,
  };
}
