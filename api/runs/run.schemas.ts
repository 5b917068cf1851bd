/** Contract of the runs API: shared with the client through `import type`. */
import { z } from 'zod';
import type { Branch } from '../engine/numerics/continuation';
import type { EarlyWarning } from '../engine/diagnostics/early-warning';
import type { PredatorPreyFit } from '../engine/linked/fit-predator-prey';
import type { SurplusFitSummary } from '../engine/fit/fit-summary';
import type { FoldAnalysis } from '../engine/surplus/fold';
import type { QuotaStudy } from '../engine/assessment';
import type { Replicate } from '../engine/uncertainty/bootstrap';
import type { SurplusDiagnostics } from '../engine/diagnostics/diagnose';
import type { LinkedAssessment } from '../engine/linked/linked-assessment';
import type { CatchPlane } from '../engine/linked/catch-plane';
import type { LinkedReplicate } from '../engine/linked/bootstrap-linked';
import type { PairStudy } from '../engine/linked/pair-study';
import type { DiscreteAssessment } from '../engine/discrete/assess-discrete';
import type { SpatialStudy } from '../engine/spatial/assess-spatial';

export const SURPLUS_MODELS = ['schaefer', 'pella-tomlinson', 'fox', 'allee', 'predation'] as const;
export const PREDATOR_PREY_MODELS = ['rosenzweig-macarthur', 'lotka-volterra'] as const;
export const DISCRETE_RUN_MODELS = ['ricker', 'beverton-holt'] as const;
export const SPATIAL_RUN_MODELS = ['reaction-diffusion'] as const;

const interval = z.tuple([z.number().min(0), z.number().min(0)]).refine((v) => v[1] > v[0], { message: 'a reserve ends after it starts' });

/** A reserve study: growth, movement and fishing outside reserves, on a coast or a masked grid, for up to six designs. */
export const spatialOptionsSchema = z.object({
  growth: z.enum(['logistic', 'allee']).default('logistic'),
  r: z.number().gt(0).max(20),
  K: z.number().gt(0).max(1e9),
  D: z.number().gt(0).max(1e6),
  A: z.number().gt(0).optional(),
  fishing: z.number().min(0).max(50),
  habitat: z.discriminatedUnion('kind', [
    z.object({ kind: z.literal('coast'), length: z.number().gt(0).max(10_000), cells: z.number().int().min(20).max(1000).default(200) }).strict(),
    z.object({ kind: z.literal('grid'), cellKm: z.number().gt(0).max(1000) }).strict(),
  ]),
  designs: z.array(z.object({
    name: z.string().trim().min(1).max(60),
    reserves: z.array(interval).max(20).optional(),
    maskCsv: z.string().max(20_000).optional(),
  }).strict()).min(1).max(6),
}).strict()
  .refine((v) => v.growth !== 'allee' || (v.A !== undefined && v.A < v.K), { path: ['A'], message: 'the Allee threshold A must be given and below K' })
  .refine((v) => v.designs.every((d) => (v.habitat.kind === 'coast' ? d.maskCsv === undefined : d.maskCsv !== undefined && d.reserves === undefined)), { path: ['designs'], message: 'coast designs list reserves in km; grid designs give a mask' })
  .refine((v) => v.habitat.kind !== 'coast' || v.designs.every((d) => (d.reserves ?? []).every(([, b]) => b <= (v.habitat as { length: number }).length)), { path: ['designs'], message: 'every reserve must lie on the coast' });

export type SpatialRunOptions = z.infer<typeof spatialOptionsSchema>;

const prior = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('lognormal'), median: z.number().positive().max(1e9), sdLog: z.number().gt(0).max(5) }).strict(),
  z.object({ kind: z.literal('beta'), mean: z.number().gt(0).lt(1), sd: z.number().gt(0).lt(0.5) }).strict()
    .refine((p) => p.sd ** 2 < p.mean * (1 - p.mean), { path: ['sd'], message: 'a beta prior needs sd² below mean·(1 − mean)' }),
]);

/** Data-poor options: values held instead of estimated, and priors (then the fit is a penalised likelihood). */
export const fixedSchema = z.object({
  r: z.number().gt(0).max(3).optional(),
  K: z.number().positive().max(1e12).optional(),
  d0: z.number().min(0.05).max(1.5).optional(),
  /** Catchability per survey name. */
  q: z.record(z.string().min(1).max(80), z.number().positive().max(1e9)).optional(),
}).strict();

export const priorsSchema = z.object({ r: prior.optional(), d0: prior.optional() }).strict();

export const startRunSchema = z.object({
  datasetId: z.number().int().positive(),
  model: z.enum([...SURPLUS_MODELS, ...PREDATOR_PREY_MODELS, ...DISCRETE_RUN_MODELS, ...SPATIAL_RUN_MODELS]),
  shape: z.number().min(0.05).max(5).optional(),
  /** Replicates; default 500 for single stocks and 100 for linked ones (each linked refit integrates two species). */
  bootstrap: z.number().int().min(0).max(5000).optional(),
  seed: z.number().int().min(0).max(2_147_483_647).default(1),
  risk: z.number().gt(0).lt(0.5).default(0.05),
  /** The one limit reference point, B_lim/B_MSY: the ramp rule's limit and the line every projection counts falls below. */
  limit: z.number().min(0).max(2).default(0.4),
  /** How the proposal is expressed: a constant catch, or a fishing mortality F. */
  control: z.enum(['catch', 'F']).default('catch'),
  /** Allow the first year's biomass above K (B0/K up to 1.5), with a warning. */
  allowAboveK: z.boolean().default(false),
  /** Single stocks: observation error only, or state-space (process and observation error); compare by AIC. */
  errors: z.enum(['observation', 'state-space']).default('observation'),
  trigger: z.number().min(0).max(3).default(0.8),
  fTarget: z.number().gt(0).max(2).default(1),
  candidates: z.array(z.number().min(0)).max(12).default([]),
  years: z.number().int().min(1).max(50).default(10),
  processSd: z.number().min(0).max(1).default(0.1),
  /** Linked stocks only: limit as a fraction of each species' equilibrium (single stocks use `limit`). */
  limitFraction: z.number().min(0.05).max(1).default(0.5),
  /** Predator-prey: conversion efficiency e, fixed at a value or estimated. */
  conversion: z.union([z.number().gt(0, 'above 0').max(1, 'at most 1'), z.literal('estimate')]).default(0.25),
  /** Rosenzweig-MacArthur: saturation a·h·K (handling time h = s/(aK)), fixed at a value or estimated. */
  saturation: z.union([z.number().min(0).max(20, 'at most 20'), z.literal('estimate')]).default(0.5),
  diagnostics: z.boolean().default(true),
  peel: z.number().int().min(1).max(10).default(5),
  jitter: z.number().int().min(0).max(100).default(20),
  fixed: fixedSchema.optional(),
  priors: priorsSchema.optional(),
  spatial: spatialOptionsSchema.optional(),
  /** Queue class: high-priority runs are taken before normal ones, normal before low. */
  priority: z.enum(['high', 'normal', 'low']).default('normal'),
}).strict().refine((v) => v.trigger > v.limit, { path: ['trigger'], message: 'the trigger must be above the limit' })
  .refine((v) => (v.model === 'reaction-diffusion') === (v.spatial !== undefined), { path: ['spatial'], message: 'a reaction-diffusion run needs its reserve study, and only it has one' })
  .transform((v) => ({ ...v, bootstrap: v.bootstrap ?? ((PREDATOR_PREY_MODELS as readonly string[]).includes(v.model) ? 100 : 500) }));

export type StartRunBody = z.infer<typeof startRunSchema>;
/** Options as stored: runs from before the diagnostics, data-poor and queue options lack those fields. */
export type RunOptions = Omit<StartRunBody, 'datasetId' | 'model' | 'diagnostics' | 'peel' | 'jitter' | 'priority'> & Partial<Pick<StartRunBody, 'diagnostics' | 'peel' | 'jitter' | 'priority'>>;
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
  /** Retrospective, hindcast, profiles, residual checks and jitter (absent on runs made before they existed). */
  diagnostics?: SurplusDiagnostics | null;
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
  /** Absent on runs made before model comparison, catch planes and linked bootstraps were added. */
  comparison?: LinkedAssessment['comparison'];
  catchPlane?: CatchPlane;
  bootstrap?: { replicates: number; intervals: Record<string, [number, number]>; draws: LinkedReplicate[] } | null;
  /** Margins, crossing risk and projections at the last year's pair of catches. */
  current?: PairStudy;
}

export type DiscreteRunResults = DiscreteAssessment;
export type SpatialRunResults = SpatialStudy;

export type RunResults = SurplusRunResults | PredatorPreyRunResults | DiscreteRunResults | SpatialRunResults;

/** What the run's event stream (GET /api/runs/:id/events) sends: the run as stored, then progress from its worker. */
export type RunStreamEvent = { type: 'run'; run: RunView } | { type: 'progress'; fraction: number; stage: string };

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
