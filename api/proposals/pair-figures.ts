/** Figures for a pair of catches on linked stocks, computed by the engine from the run's bootstrap draws. */
import { pairStudy, type PairStudy } from '../engine/linked/pair-study';
import { HttpError } from '../http/http-error';
import type { Run } from '../runs/run.model';
import type { PredatorPreyRunResults } from '../runs/run.schemas';
import type { ProposalFigures } from './proposal.schemas';

export const MIN_LINKED_REPLICATES = 20;

/** The run's linked results, or a 422 naming what a pair proposal needs. */
export function proposableLinked(run: Run, results: PredatorPreyRunResults, predatorQuota: number | undefined | null): PredatorPreyRunResults {
  if (!results.bootstrap || results.bootstrap.replicates < MIN_LINKED_REPLICATES || !results.catchPlane) {
    throw new HttpError(422, 'RUN_NOT_PROPOSABLE', `A pair proposal needs a finished predator-prey run with a bootstrap (at least ${MIN_LINKED_REPLICATES} replicates).`);
  }
  if (predatorQuota === undefined || predatorQuota === null) {
    throw new HttpError(422, 'PREDATOR_CATCH_REQUIRED', 'A proposal for linked stocks gives the prey catch and the predator catch together.', { predatorQuota: ['required for linked stocks'] });
  }
  void run;
  return results;
}

/** The run's study of a pair of catches (the same seed as the run, so the same pair gives the same figures). */
export function pairStudyFor(run: Run, results: PredatorPreyRunResults, prey: number, predator: number): PairStudy {
  const o = run.options;
  return pairStudy(results.fit.spec, results.bootstrap!.draws, prey, predator, {
    years: o.years, processSd: o.processSd, limitFraction: o.limitFraction, seed: o.seed + 101,
    preyMax: results.catchPlane!.preyMax, predatorMax: results.catchPlane!.predatorMax,
  });
}

const ends = (b: { median: number[]; lower: number[]; upper: number[] }) => ({ median: b.median[b.median.length - 1]!, lower: b.lower[b.lower.length - 1]!, upper: b.upper[b.upper.length - 1]! });

/**
 * Proposal figures for a pair: the single-stock fields read along the ray from no catch through the
 * pair (in prey catch), the pair's own margins along each catch, crossing risk and both projections.
 */
export function pairFigures(run: Run, results: PredatorPreyRunResults, s: PairStudy, unit: string): ProposalFigures {
  const o = run.options;
  const ray = s.rayFraction ?? { p5: 3, p50: 3, p95: 3 };
  const median = ray.p50 * s.preyCatch, lower5 = ray.p5 * s.preyCatch, upper95 = ray.p95 * s.preyCatch;
  const prey = ends(s.projection.prey), predator = ends(s.projection.predator);
  const pBelow = Math.max(s.projection.pPreyBelowLimit, s.projection.pPredatorBelowLimit);
  const at = { catchLevel: s.preyCatch, pPassFold: s.pCross, pBelowLimit: pBelow, medianEnd: prey.median, lowerEnd: prey.lower, upperEnd: prey.upper, returnRate: NaN };
  return {
    unit, model: run.model, foldHarvest: { median, lower5, upper95 },
    marginToFold: { absolute: median - s.preyCatch, fraction: (median - s.preyCatch) / median },
    marginToFoldLower: { absolute: lower5 - s.preyCatch, fraction: (lower5 - s.preyCatch) / lower5 },
    msy: NaN, bOverBmsy: NaN, fOverFmsy: NaN, risk: o.risk, projectionYears: o.years, limitFraction: o.limitFraction,
    atQuota: at, candidates: [], engineProposal: results.current?.preyCatch ?? s.preyCatch,
    pair: {
      preyCatch: s.preyCatch, predatorCatch: s.predatorCatch, preyAxis: s.margins.preyAxis, predatorAxis: s.margins.predatorAxis,
      pCross: s.pCross, pCrossByKind: s.pCrossByKind, pPreyBelowLimit: s.projection.pPreyBelowLimit, pPredatorBelowLimit: s.projection.pPredatorBelowLimit,
      pPreyLost: s.projection.pPreyLost, pPredatorLost: s.projection.pPredatorLost, preyEnd: prey, predatorEnd: predator,
    },
  };
}
