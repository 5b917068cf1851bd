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
}).strict();

export interface CommentView { id: number; parentId: number | null; authorId: number; authorName: string; body: string; createdAt: string; replies: CommentView[] }
export interface VoteView { voterId: number; voterName: string; choice: 'approve' | 'reject' | 'abstain'; reason: string; updatedAt: string }
export interface DecisionView { outcome: 'approved' | 'rejected'; approvedLimit: number | null; reason: string; override: boolean; votes: { approve: number; reject: number; abstain: number }; decidedByName: string; createdAt: string; advisoryId: number | null }
export interface AuditView { id: number; actorName: string | null; action: string; entityType: string; entityId: number | null; before: unknown; after: unknown; createdAt: string }
export interface BoardView {
  rules: { quorum: number; majority: number };
  comments: CommentView[];
  votes: VoteView[];
  decision: DecisionView | null;
  audit: AuditView[];
}
