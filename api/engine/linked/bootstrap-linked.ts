/**
 * Residual bootstrap of a predator-prey fit (Efron & Tibshirani 1993, ch. 9): each survey's pseudo
 * index is q̂·B̂_t·e^{ε*} with ε* drawn with replacement from that survey's own log residuals; each
 * replicate is refitted from the maximum-likelihood point. Replicate k draws from its own seeded
 * stream, so chunks on several workers give the same replicates as one thread.
 */
import { createRng } from '../numerics/random';
import { interiorEquilibrium, type PredatorPreySpec } from './predator-prey';
import { fitPredatorPrey, type PredatorPreyFit, type PredatorPreyFitOptions } from './fit-predator-prey';
import type { StockSeries } from '../data/series';

export interface LinkedReplicate {
  spec: PredatorPreySpec;
  start: [number, number];
  /** Populations at the end of the last year. */
  end: [number, number];
  equilibrium: [number, number];
  logLik: number;
  converged: boolean;
}

export interface LinkedBootstrapRequest {
  series: StockSeries;
  options: PredatorPreyFitOptions;
  fit: Pick<PredatorPreyFit, 'free' | 'indices'>;
  replicates: number;
  seed: number;
  offset?: number;
}

/** Pseudo-data for replicate number k. */
export function linkedPseudoSeries(req: LinkedBootstrapRequest, k: number): StockSeries {
  const rng = createRng((req.seed + 7919 * k) >>> 0);
  return {
    ...req.series,
    indices: req.series.indices.map((ix, j) => {
      const fitted = req.fit.indices[j];
      if (!fitted) return ix;
      const pool = fitted.residuals.filter((v): v is number => v !== null);
      return { ...ix, values: ix.values.map((v, t) => (v === null ? null : fitted.fitted[t]! * Math.exp(pool[rng.int(pool.length)]!))) };
    }),
  };
}

/** Runs replicates offset … offset+replicates−1 with progress; stops early when asked. */
export function runLinkedBootstrap(req: LinkedBootstrapRequest, onProgress?: (done: number) => void, shouldStop?: () => boolean): LinkedReplicate[] {
  const out: LinkedReplicate[] = [];
  const offset = req.offset ?? 0;
  for (let i = 0; i < req.replicates; i++) {
    if (shouldStop?.()) break;
    const f = fitPredatorPrey(linkedPseudoSeries(req, offset + i), { ...req.options, initial: req.fit.free, tol: 1e-6 });
    const n = f.prey.length - 1;
    out.push({
      spec: f.spec, start: f.start, end: [f.prey[n]!, f.predator[n]!], equilibrium: interiorEquilibrium(f.spec),
      logLik: f.logLik, converged: f.convergence.converged,
    });
    onProgress?.(i + 1);
  }
  return out;
}

/** Percentile interval of a parameter over the replicates. */
export function replicateInterval(reps: LinkedReplicate[], get: (r: LinkedReplicate) => number, lo = 0.025, hi = 0.975): [number, number] {
  const v = reps.map(get).filter(Number.isFinite).sort((a, b) => a - b);
  const q = (p: number) => { const h = (v.length - 1) * p; const i = Math.floor(h); return v[i]! + (h - i) * ((v[Math.min(i + 1, v.length - 1)] ?? v[i]!) - v[i]!); };
  return [q(lo), q(hi)];
}
