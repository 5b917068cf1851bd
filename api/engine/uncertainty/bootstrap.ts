/**
 * Parametric bootstrap by resampling residuals (Efron & Tibshirani 1993, ch. 9): pseudo-indices
 * I*_t = q̂·B̂_t·e^{ε*_t} with ε* drawn with replacement from each survey's fitted log residuals,
 * refitted from the maximum-likelihood point.
 */
import { fitSurplusRaw, type SurplusFitOptions } from '../surplus/fit-surplus';
import type { SurplusFitSummary } from '../fit/fit-summary';
import { createRng } from '../numerics/random';
import { referencePoints, type SurplusParams } from '../surplus/surplus';
import { analyseEquilibria } from '../surplus/equilibria';
import { productionModel } from '../surplus/registry';
import type { StockSeries } from '../data/series';

export interface Replicate {
  r: number;
  K: number;
  p: number;
  d0: number;
  msy: number;
  bMsy: number;
  fMsy: number;
  /** Allee threshold and predation parameters of the replicate, for the depensation models. */
  A?: number;
  c?: number;
  a?: number;
  /** Fold harvest of the replicate: the catch at which its upper stable state disappears (MSY for concave production). */
  hStar: number;
  /** Fishing mortality at which its upper stable state ends (fold or transcritical; absent when none, and in older runs). */
  fStar?: number;
  /** Biomass at the end of the series. */
  bEnd: number;
  converged: boolean;
}

export interface BootstrapRequest {
  series: StockSeries;
  options: SurplusFitOptions;
  fit: Pick<SurplusFitSummary, 'free' | 'indices' | 'years'>;
  replicates: number;
  seed: number;
  /** First replicate number of this chunk (so chunks on several workers draw distinct streams). */
  offset?: number;
}

/** Pseudo-data for replicate number `k`. */
export function pseudoSeries(req: BootstrapRequest, k: number): StockSeries {
  const rng = createRng((req.seed + 7919 * k) >>> 0);
  return {
    ...req.series,
    indices: req.series.indices.map((ix, j) => {
      const fitted = req.fit.indices[j]!;
      const pool = fitted.residuals.filter((v): v is number => v !== null);
      return { ...ix, values: ix.values.map((v, t) => (v === null ? null : fitted.fitted[t]! * Math.exp(pool[rng.int(pool.length)]!))) };
    }),
  };
}

/** Runs replicates offset … offset+replicates−1, reporting progress; stops early when `shouldStop` says so. */
export function runBootstrap(req: BootstrapRequest, onProgress?: (done: number) => void, shouldStop?: () => boolean): Replicate[] {
  const out: Replicate[] = [];
  const offset = req.offset ?? 0;
  for (let i = 0; i < req.replicates; i++) {
    if (shouldStop?.()) break;
    const data = pseudoSeries(req, offset + i);
    const raw = fitSurplusRaw(data, { ...req.options, initial: req.fit.free });
    const p = raw.problem.decode(raw.u);
    const ref = referencePoints(raw.problem.model, p);
    const path = raw.problem.path(raw.u);
    out.push({
      r: p.r, K: p.K, p: p.p ?? 1, d0: p.d0, ...shapeOf(p), ...ref, hStar: analyseEquilibria(productionModel(raw.problem.model), p, 'catch').collapse?.at ?? 0,
      ...fStarOf(raw.problem.model, p),
      bEnd: path.biomass[path.biomass.length - 1]!, converged: !raw.hitIterationLimit,
    });
    if (onProgress && (i % 10 === 9 || i === req.replicates - 1)) onProgress(i + 1);
  }
  return out;
}

function fStarOf(model: string, p: SurplusParams): Pick<Replicate, 'fStar'> {
  const at = analyseEquilibria(productionModel(model), p, 'F').collapse?.at;
  return at === undefined ? {} : { fStar: at };
}

function shapeOf(p: SurplusParams): Pick<Replicate, 'A' | 'c' | 'a'> {
  const out: Pick<Replicate, 'A' | 'c' | 'a'> = {};
  if (p.A !== undefined) out.A = p.A;
  if (p.c !== undefined) out.c = p.c;
  if (p.a !== undefined) out.a = p.a;
  return out;
}

/** Empirical quantile (type 7, as R's default). */
export function quantile(values: number[], prob: number): number {
  const s = [...values].sort((a, b) => a - b);
  if (s.length === 0) return NaN;
  const h = (s.length - 1) * prob;
  const lo = Math.floor(h);
  return s[lo]! + (h - lo) * ((s[Math.min(lo + 1, s.length - 1)]!) - s[lo]!);
}
