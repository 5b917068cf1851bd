/**
 * A proposal for a pair of catches on linked stocks: its margins in the catch plane, the bootstrap
 * cloud of the first curve met along the ray from no catch through the proposal, the probability of
 * crossing it, and stochastic projections of both species under the pair.
 */
import { createRng } from '../numerics/random';
import { quantile } from '../uncertainty/bootstrap';
import { equilibriumAt, pairMargins, type CurveKind, type PairMargins } from './catch-plane';
import { yearStep, type PredatorPreySpec } from './predator-prey';
import type { LinkedReplicate } from './bootstrap-linked';

export interface Band { median: number[]; lower: number[]; upper: number[] }

export interface PairStudy {
  preyCatch: number;
  predatorCatch: number;
  /** Margins on the maximum-likelihood fit. */
  margins: PairMargins;
  /** Where each replicate's ray first meets a curve (replicates that meet none within 3× the proposal are left out). */
  cloud: { preyCatch: number; predatorCatch: number; kind: CurveKind }[];
  /** Share of replicates for which the proposal lies on or beyond a curve (or whose equilibrium is unstable without catch). */
  pCross: number;
  /** Share by the kind of curve crossed. */
  pCrossByKind: Record<CurveKind, number>;
  /** 5%, 50% and 95% of the fraction of the proposal at which the replicates' rays meet a curve (3 = none within 3×). */
  rayFraction: { p5: number; p50: number; p95: number } | null;
  projection: {
    years: number;
    prey: Band;
    predator: Band;
    pPreyBelowLimit: number;
    pPredatorBelowLimit: number;
    pPreyLost: number;
    pPredatorLost: number;
    limitFraction: number;
  };
}

const RAY_LIMIT = 3;

export interface PairStudyOptions {
  years: number;
  processSd: number;
  limitFraction: number;
  seed: number;
  preyMax: number;
  predatorMax: number;
  onProgress?: (done: number, total: number) => void;
}

/** Stochastic projections of both species from each replicate's final state under constant catches. */
export function projectPair(reps: LinkedReplicate[], preyCatch: number, predatorCatch: number, o: Pick<PairStudyOptions, 'years' | 'processSd' | 'limitFraction' | 'seed'>): PairStudy['projection'] {
  const rng = createRng(o.seed);
  const paths: [number[], number[]][] = [];
  let preyBelow = 0, predBelow = 0, preyLost = 0, predLost = 0;
  for (const rep of reps) {
    let y = rep.end.slice();
    const pp = [y[0]!], pd = [y[1]!];
    const limit = rep.equilibrium.map((v) => o.limitFraction * Math.max(v, 0));
    let below = [y[0]! < limit[0]!, y[1]! < limit[1]!];
    for (let t = 0; t < o.years; t++) {
      y = yearStep(rep.spec, y, preyCatch, predatorCatch, 1e-6);
      y = y.map((v) => v * Math.exp(o.processSd * rng.normal() - o.processSd ** 2 / 2));
      pp.push(y[0]!); pd.push(y[1]!);
      below = below.map((b, k) => b || y[k]! < limit[k]!);
    }
    if (below[0]) preyBelow++;
    if (below[1]) predBelow++;
    if (y[0] === 0) preyLost++;
    if (y[1] === 0) predLost++;
    paths.push([pp, pd]);
  }
  const n = Math.max(reps.length, 1);
  const band = (k: 0 | 1): Band => {
    const ys = Array.from({ length: o.years + 1 }, (_, t) => paths.map((p) => p[k][t]!));
    return { median: ys.map((v) => quantile(v, 0.5)), lower: ys.map((v) => quantile(v, 0.05)), upper: ys.map((v) => quantile(v, 0.95)) };
  };
  return {
    years: o.years, prey: band(0), predator: band(1), limitFraction: o.limitFraction,
    pPreyBelowLimit: preyBelow / n, pPredatorBelowLimit: predBelow / n, pPreyLost: preyLost / n, pPredatorLost: predLost / n,
  };
}

/** The full study of a pair of catches. */
export function pairStudy(spec: PredatorPreySpec, reps: LinkedReplicate[], preyCatch: number, predatorCatch: number, o: PairStudyOptions): PairStudy {
  if (!(preyCatch >= 0 && predatorCatch >= 0) || preyCatch + predatorCatch === 0) throw new Error('a pair of catches needs at least one catch above zero and none below');
  const margins = pairMargins(spec, preyCatch, predatorCatch, o.preyMax, o.predatorMax);
  const cloud: PairStudy['cloud'] = [];
  const fractions: number[] = [];
  const byKind: Record<CurveKind, number> = { fold: 0, hopf: 0, transcritical: 0 };
  let crossed = 0;
  reps.forEach((rep, i) => {
    const eq = equilibriumAt(rep.spec, preyCatch, predatorCatch);
    const c = eq?.crossing;
    if (!eq) { crossed++; }
    else if (c && c.kind !== 'none' && c.at && c.rayFraction !== null) {
      cloud.push({ ...c.at, kind: c.kind });
      fractions.push(c.rayFraction);
      if (c.rayFraction <= 1) { crossed++; byKind[c.kind]++; }
    } else fractions.push(RAY_LIMIT);
    o.onProgress?.(i + 1, reps.length);
  });
  const n = Math.max(reps.length, 1);
  return {
    preyCatch, predatorCatch, margins, cloud, pCross: crossed / n,
    pCrossByKind: { fold: byKind.fold / n, hopf: byKind.hopf / n, transcritical: byKind.transcritical / n },
    rayFraction: fractions.length ? { p5: quantile(fractions, 0.05), p50: quantile(fractions, 0.5), p95: quantile(fractions, 0.95) } : null,
    projection: projectPair(reps, preyCatch, predatorCatch, o),
  };
}
