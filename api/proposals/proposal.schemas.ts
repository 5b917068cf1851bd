/** Contract of the proposals API: shared with the client through `import type`. */
import { z } from 'zod';
import type { StateMargin } from '../engine/assessment';
import type { RebuildRow } from '../engine/projection/rebuild';

/** Which design of which reserve-study run a proposal carries (optional). */
export const reserveDesignRefSchema = z.object({ runId: z.number().int().positive(), index: z.number().int().min(0).max(5) }).strict();

export const createProposalSchema = z.object({
  runId: z.number().int().positive(),
  quota: z.number().positive('the quota must be above zero').max(1e9),
  /** Linked stocks: the predator catch proposed together with the prey catch (`quota`). */
  predatorQuota: z.number().min(0, 'the predator catch cannot be negative').max(1e9).optional(),
  rationale: z.string().trim().min(20, 'give the reasoning in at least 20 characters').max(5000),
  reserveDesign: reserveDesignRefSchema.optional(),
}).strict();

export const updateProposalSchema = z.object({
  quota: z.number().positive('the quota must be above zero').max(1e9).optional(),
  predatorQuota: z.number().min(0, 'the predator catch cannot be negative').max(1e9).optional(),
  rationale: z.string().trim().min(20, 'give the reasoning in at least 20 characters').max(5000).optional(),
}).strict().refine((v) => v.quota !== undefined || v.rationale !== undefined || v.predatorQuota !== undefined, { message: 'nothing to change' });

export type CreateProposalBody = z.infer<typeof createProposalSchema>;
export type UpdateProposalBody = z.infer<typeof updateProposalSchema>;

/** A reserve design as frozen with a proposal (copied from its reserve-study run). */
export interface ReserveDesignFigures {
  runId: number;
  name: string;
  growth: string;
  params: { r: number; K: number; D: number; A?: number };
  /** Fishing mortality outside the reserves (1/yr). */
  fishing: number;
  areaUnit: 'km' | 'km²';
  nx: number;
  ny: number;
  h: number;
  cells: number[];
  reserve: number[];
  density: number[];
  reserveArea: number;
  reserveShare: number;
  reserveCount: number;
  total: number;
  yield: number;
  spillover: number;
  persists: boolean;
  criticalF: number | null;
  lossKind: 'extinction' | 'fold' | null;
  recoveryYears: number | null;
  frontSpeed: number | null;
}

export interface CandidateFigures {
  catchLevel: number;
  pPassFold: number;
  pBelowLimit: number;
  medianEnd: number;
  lowerEnd: number;
  upperEnd: number;
  returnRate: number;
  /** Probability of falling below the unstable threshold at this level within the projection (absent in older proposals). */
  pCrossThreshold?: number;
}

/** The figures frozen with a proposal, all computed by the engine from its run. */
export interface ProposalFigures {
  unit: string;
  model: string;
  foldHarvest: { median: number; lower5: number; upper95: number };
  marginToFold: { absolute: number; fraction: number };
  marginToFoldLower: { absolute: number; fraction: number };
  msy: number;
  bOverBmsy: number;
  fOverFmsy: number;
  risk: number;
  projectionYears: number;
  /** The run's one limit reference point as B_lim/B_MSY. */
  limitFraction: number;
  /** How the quota is expressed: a catch per year or a fishing mortality F (absent in older proposals: a catch). */
  control?: 'catch' | 'F';
  /** Where the stock stands against the unstable threshold at the quota (absent in older proposals). */
  stateMargin?: StateMargin;
  /** Years to rebuild to B_MSY under candidate levels, from the run (absent in older proposals). */
  rebuild?: RebuildRow[];
  atQuota: CandidateFigures;
  candidates: CandidateFigures[];
  /** Catch the run's rule proposed (fold risk and ramp rule). */
  engineProposal: number;
  /** The reserve design chosen with the quota, when the proposal carries one. */
  reserveDesign?: ReserveDesignFigures;
  /**
   * Linked stocks: the pair's margins in the catch plane. The single-stock fields then read along the
   * ray from no catch through the pair, in prey catch: foldHarvest is where the replicates' rays meet
   * their first curve (fold, Hopf or predator loss).
   */
  pair?: PairFigures;
}

export interface PairFigures {
  preyCatch: number;
  predatorCatch: number;
  preyAxis: { kind: string; at: number | null; margin: number | null };
  predatorAxis: { kind: string; at: number | null; margin: number | null };
  pCross: number;
  pCrossByKind: Record<string, number>;
  pPreyBelowLimit: number;
  pPredatorBelowLimit: number;
  pPreyLost: number;
  pPredatorLost: number;
  preyEnd: { median: number; lower: number; upper: number };
  predatorEnd: { median: number; lower: number; upper: number };
}

export interface ProposalView {
  id: number;
  stockId: number;
  runId: number;
  revisesId: number | null;
  status: 'draft' | 'submitted';
  quota: number;
  predatorQuota: number | null;
  rationale: string;
  figures: ProposalFigures;
  createdBy: number;
  createdByName: string | null;
  submittedAt: string | null;
  createdAt: string;
  updatedAt: string;
}

/** Where a submitted proposal stands with the board: its decision and the limit now in force. */
export interface ProposalStanding {
  outcome: 'approved' | 'rejected';
  /** The limit in force: the newest advisory's (after any correction), or null when rejected. */
  limit: number | null;
  /** The limit was corrected after the decision (by a chair's correction or a new vote). */
  corrected: boolean;
  decidedAt: string;
}

/** A proposal in a list: who drafted it, for which stock and region, and where it stands. */
export type ProposalListItem = ProposalView & { stockName: string; regionName: string; standing: ProposalStanding | null };
