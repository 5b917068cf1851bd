/** Contract of the board API: shared with the client through `import type`. */
import { z } from 'zod';

export const commentSchema = z.object({
  body: z.string().trim().min(2, 'write a comment').max(4000),
  parentId: z.number().int().positive().nullish(),
}).strict();

export const voteSchema = z.object({
  choice: z.enum(['approve', 'reject', 'abstain']),
  reason: z.string().trim().min(3, 'give a reason for the vote').max(2000),
}).strict();

export const decisionSchema = z.object({
  outcome: z.enum(['approved', 'rejected']),
  /** The approved limit; defaults to the proposed quota. */
  limit: z.number().positive().max(1e9).optional(),
  reason: z.string().trim().min(10, 'state the reason for the decision').max(4000),
  /** Needed to approve a limit above the lower 5% of the fold harvest. */
  override: z.boolean().default(false),
}).strict();

export const rulesSchema = z.object({
  quorum: z.number().int().min(1).max(50),
  majority: z.number().min(0.5).max(1),
  /** Whether the chair may correct a published limit alone (otherwise a correction needs a new board vote). */
  chairMayCorrect: z.boolean().optional(),
}).strict();

export interface CommentView { id: number; parentId: number | null; authorId: number; authorName: string; body: string; createdAt: string; replies: CommentView[] }
export interface VoteView { voterId: number; voterName: string; choice: 'approve' | 'reject' | 'abstain'; reason: string; updatedAt: string }
export interface DecisionView {
  outcome: 'approved' | 'rejected'; approvedLimit: number | null; reason: string; override: boolean; votes: { approve: number; reject: number; abstain: number };
  decidedByName: string; createdAt: string;
  /** The newest advisory of this proposal (after any correction). */
  advisoryId: number | null;
  /** Set when this decision, by a new vote on a revision, corrected an earlier proposal's published limit. */
  corrects: { proposalId: number; docId: string; limit: number } | null;
}
/** A correction of this proposal's published limit, with its own decision record. */
export interface CorrectionView {
  id: number; kind: 'chair' | 'vote'; correctedLimit: number; previousLimit: number; reason: string; override: boolean;
  votes: { approve: number; reject: number; abstain: number } | null; decidedByName: string; createdAt: string;
  advisoryId: number; docId: string; supersededDocId: string;
  /** For a new vote: the revised proposal the board voted on. */
  viaProposalId: number | null;
}
export interface RulesView { quorum: number; majority: number; chairMayCorrect: boolean }
export interface AuditView { id: number; actorName: string | null; action: string; entityType: string; entityId: number | null; before: unknown; after: unknown; createdAt: string }
export interface BoardView {
  rules: RulesView;
  comments: CommentView[];
  corrections: CorrectionView[];
  votes: VoteView[];
  decision: DecisionView | null;
  audit: AuditView[];
}
