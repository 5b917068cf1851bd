/** Contract of the runs API: shared with the client through `import type`. */
import { z } from 'zod';
import type { Branch } from '../engine/numerics/continuation';
import type { EarlyWarning } from '../engine/diagnostics/early-warning';
import type { PredatorPreyFit } from '../engine/linked/fit-predator-prey';
import type { SurplusFitSummary } from '../engine/fit/fit-summary';
import type { FoldAnalysis } from '../engine/surplus/fold';
import type { QuotaStudy } from '../engine/assessment';
import type { Replicate } from '../engine/uncertainty/bootstrap';

export const SURPLUS_MODELS = ['schaefer', 'pella-tomlinson', 'fox'] as const;
export const PREDATOR_PREY_MODELS = ['rosenzweig-macarthur', 'lotka-volterra'] as const;

export const startRunSchema = z.object({
  datasetId: z.number().int().positive(),
  model: z.enum([...SURPLUS_MODELS, ...PREDATOR_PREY_MODELS]),
  shape: z.number().min(0.05).max(5).optional(),
  bootstrap: z.number().int().min(0).max(5000).default(500),
  seed: z.number().int().min(0).max(2_147_483_647).default(1),
  risk: z.number().gt(0).lt(0.5).default(0.05),
  limit: z.number().min(0).max(2).default(0.4),
  trigger: z.number().min(0).max(3).default(0.8),
  fTarget: z.number().gt(0).max(2).default(1),
  candidates: z.array(z.number().min(0)).max(12).default([]),
  years: z.number().int().min(1).max(50).default(10),
  processSd: z.number().min(0).max(1).default(0.1),
  limitFraction: z.number().min(0.05).max(1).default(0.5),
  conversion: z.number().gt(0).max(1).default(0.25),
}).strict().refine((v) => v.trigger > v.limit, { path: ['trigger'], message: 'the trigger must be above the limit' });

export type StartRunBody = z.infer<typeof startRunSchema>;
export type RunOptions = Omit<StartRunBody, 'datasetId' | 'model'>;
export type RunStatus = 'queued' | 'running' | 'succeeded' | 'failed' | 'cancelled';

export interface SurplusRunResults {
  kind: 'surplus';
  fit: SurplusFitSummary;
  fold: FoldAnalysis;
  bootstrap: {
    replicates: number;
    hStar: { p5: number; p50: number; p95: number };
    intervals: Record<string, [number, number]>;
    /** Every replicate, kept so that figures for any catch can be recomputed from the run. */
    draws: Replicate[];
  } | null;
  quota: QuotaStudy | null;
  earlyWarning: EarlyWarning | null;
}

export interface PredatorPreyRunResults {
  kind: 'predator-prey';
  fit: PredatorPreyFit;
  years: number[];
  preyCatch: number[];
  predatorCatch: number[];
  bifurcations: { preyCatch: Branch; predatorCatch: Branch };
  /** Prey nullcline as [N, P] points; the predator nullcline is the vertical line N = predatorNullcline. */
  preyNullcline: [number, number][];
  predatorNullcline: number | null;
}

export type RunResults = SurplusRunResults | PredatorPreyRunResults;

export interface RunView {
  id: number;
  stockId: number;
  datasetId: number;
  datasetVersion: number | null;
  model: string;
  options: RunOptions;
  status: RunStatus;
  progress: number;
  stage: string | null;
  engineVersion: string;
  error: string | null;
  durationMs: number | null;
  createdBy: number;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
}

/** One row of the model comparison table. */
export interface RunSummary extends RunView {
  logLik: number | null;
  aic: number | null;
  msy: number | null;
  foldHarvest: number | null;
  bOverBmsy: number | null;
  fOverFmsy: number | null;
  proposedQuota: number | null;
}
