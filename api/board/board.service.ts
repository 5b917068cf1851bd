/** The quota board: comments, votes, the chair's decision; every action audited, a decision in one transaction. */
import { Op, type Sequelize, type Transaction } from 'sequelize';
import { AuditEvent } from '../audit/audit-event.model';
import { recordAudit } from '../audit/audit.service';
import { Advisory } from '../advisories/advisory.model';
import { AdvisoryPublisher } from '../advisories/advisory.publisher';
import { ConflictError, ForbiddenError, HttpError, NotFoundError } from '../http/http-error';
import { Proposal } from '../proposals/proposal.model';
import { userNames } from '../users/user-names';
import type { ProposalListItem } from '../proposals/proposal.schemas';
import { listItems } from './proposal-standing';
import { BoardRules, Comment, Correction, Decision, Vote, type VoteCount } from './board.models';
import type { AuditView, BoardView, CommentView, CorrectionView, RulesView } from './board.schemas';

export class BoardService {
  constructor(private readonly sequelize: Sequelize, private readonly publisher: AdvisoryPublisher) {}

  async rules(): Promise<RulesView> {
    const r = (await BoardRules.findByPk(1))!;
    return { quorum: r.quorum, majority: r.majority, chairMayCorrect: r.chairMayCorrect };
  }

  async setRules(actorId: number, body: { quorum: number; majority: number; chairMayCorrect?: boolean }): Promise<RulesView> {
    return this.sequelize.transaction(async (t) => {
      const r = (await BoardRules.findByPk(1, { transaction: t, lock: t.LOCK.UPDATE }))!;
      const before = { quorum: r.quorum, majority: r.majority, chairMayCorrect: r.chairMayCorrect };
      const after = { quorum: body.quorum, majority: body.majority, chairMayCorrect: body.chairMayCorrect ?? r.chairMayCorrect };
      await r.update({ ...after, updatedBy: actorId }, { transaction: t });
      await recordAudit({ actorId, action: 'board.rules', entityType: 'board_rules', entityId: 1, before, after }, t);
      return after;
    });
  }

  async comment(actor: Express.User, proposalId: number, body: { body: string; parentId?: number | null }) {
    await this.submitted(proposalId);
    if (body.parentId && !(await Comment.findOne({ where: { id: body.parentId, proposalId } }))) throw new NotFoundError('The comment being answered');
    return this.sequelize.transaction(async (t) => {
      const c = await Comment.create({ proposalId, parentId: body.parentId ?? null, authorId: actor.id, body: body.body }, { transaction: t });
      await recordAudit({ actorId: actor.id, action: 'proposal.comment', entityType: 'proposal', entityId: proposalId, after: { commentId: c.id, parentId: c.parentId, body: c.body } }, t);
      return { id: c.id };
    });
  }

  async vote(actor: Express.User, proposalId: number, body: { choice: 'approve' | 'reject' | 'abstain'; reason: string }) {
    await this.submitted(proposalId);
    return this.sequelize.transaction(async (t) => {
      if (await Decision.findOne({ where: { proposalId }, transaction: t })) throw new ConflictError('ALREADY_DECIDED', 'The board has already decided this proposal.');
      const existing = await Vote.findOne({ where: { proposalId, voterId: actor.id }, transaction: t, lock: t.LOCK.UPDATE });
      const before = existing ? { choice: existing.choice, reason: existing.reason } : null;
      if (existing) await existing.update(body, { transaction: t });
      else await Vote.create({ proposalId, voterId: actor.id, ...body }, { transaction: t });
      await recordAudit({ actorId: actor.id, action: existing ? 'proposal.vote.change' : 'proposal.vote', entityType: 'proposal', entityId: proposalId, before, after: body }, t);
      return body;
    });
  }

  /** Records the chair's decision; an approval publishes the advisory in the same transaction. */
  async decide(actor: Express.User, proposalId: number, body: { outcome: 'approved' | 'rejected'; limit?: number; reason: string; override: boolean }) {
    if (!actor.boardChair) throw new ForbiddenError('Only the chair of the board records its decision.');
    const proposal = await this.submitted(proposalId);
    const rules = await this.rules();
    const result = await this.sequelize.transaction(async (t) => {
      await Proposal.findByPk(proposalId, { transaction: t, lock: t.LOCK.UPDATE });
      if (await Decision.findOne({ where: { proposalId }, transaction: t })) throw new ConflictError('ALREADY_DECIDED', 'The board has already decided this proposal.');
      const votes = await Vote.findAll({ where: { proposalId }, transaction: t });
      const count: VoteCount = { approve: 0, reject: 0, abstain: 0 };
      for (const v of votes) count[v.choice]++;
      if (votes.length < rules.quorum) throw new ConflictError('QUORUM_NOT_MET', `${votes.length} vote(s) cast; the board's quorum is ${rules.quorum}.`);
      const decided = count.approve + count.reject;
      const carried = decided > 0 && count.approve / decided > rules.majority;
      if ((body.outcome === 'approved') !== carried) {
        throw new ConflictError('OUTCOME_AGAINST_VOTES', `The votes (${count.approve} approve, ${count.reject} reject, ${count.abstain} abstain) ${carried ? 'carry' : 'do not carry'} the proposal under a majority above ${Math.round(rules.majority * 100)}%.`);
      }
      const limit = body.outcome === 'approved' ? body.limit ?? proposal.quota : null;
      const lower = proposal.figures.foldHarvest.lower5;
      if (limit !== null && limit > lower && !body.override) {
        throw new HttpError(422, 'OVERRIDE_REQUIRED', `A limit of ${limit} is above the lower 5% of the fold harvest (${Number(lower.toFixed(2))}): approving it needs an explicit override.`, { override: ['required above the fold\'s lower bound'] });
      }
      const decision = await Decision.create({
        proposalId, outcome: body.outcome, approvedLimit: limit, reason: body.reason, override: limit !== null && limit > lower,
        votes: count, decidedBy: actor.id,
      }, { transaction: t });
      await recordAudit({ actorId: actor.id, action: `proposal.${body.outcome}`, entityType: 'proposal', entityId: proposalId, before: { quota: proposal.quota }, after: { limit, override: decision.override, votes: count, reason: body.reason } }, t);
      // A revision approved while an earlier version's advisory is in force corrects it, by this new vote.
      const corrected = limit !== null ? await this.advisoryInForce(proposal, t) : null;
      const supersedes = corrected ? {
        advisory: corrected.advisory, reason: body.reason, kind: 'vote' as const, votes: count, rules: await BoardRules.snapshot(t), proposalId: corrected.proposalId,
      } : undefined;
      const advisory = limit !== null ? await this.publisher.publish({ decision, proposal, limit, override: decision.override, actorId: actor.id, supersedes }, t) : null;
      return { decisionId: decision.id, advisoryId: advisory?.id ?? null };
    });
    this.publisher.afterCommit();
    return result;
  }

  async view(proposalId: number): Promise<BoardView> {
    const [comments, votes, decision, rules] = await Promise.all([
      Comment.findAll({ where: { proposalId }, order: [['id', 'ASC']] }),
      Vote.findAll({ where: { proposalId }, order: [['updatedAt', 'ASC']] }),
      Decision.findOne({ where: { proposalId } }),
      this.rules(),
    ]);
    const advisoryIds = decision ? (await Advisory.findAll({ where: { decisionId: decision.id }, attributes: ['id'], order: [['id', 'ASC']] })).map((a) => a.id) : [];
    const corrections = await Correction.findAll({ where: { proposalId }, order: [['id', 'ASC']] });
    const corrects = decision ? await Correction.findOne({ where: { decisionId: decision.id, kind: 'vote' } }) : null;
    const current = await this.newestInChain(advisoryIds);
    const docs = new Map((await Advisory.findAll({
      where: { id: [...corrections.flatMap((c) => [c.advisoryId, c.supersedesAdvisoryId]), ...(corrects ? [corrects.supersedesAdvisoryId] : [])] }, attributes: ['id', 'docId', 'decisionId'],
    })).map((a) => [a.id, a]));
    const votedOn = new Map((await Decision.findAll({ where: { id: corrections.map((c) => c.decisionId) }, attributes: ['id', 'proposalId'] })).map((d) => [d.id, d.proposalId]));
    const audit = await AuditEvent.findAll({
      where: { [Op.or]: [{ entityType: 'proposal', entityId: proposalId }, ...(advisoryIds.length ? [{ entityType: 'advisory', entityId: advisoryIds }] : [])] },
      order: [['id', 'ASC']],
    });
    const names = await userNames([...comments.map((c) => c.authorId), ...votes.map((v) => v.voterId), ...audit.map((a) => a.actorId ?? 0), decision?.decidedBy ?? 0, ...corrections.map((c) => c.decidedBy)]);
    const byId = new Map<number, CommentView>();
    const roots: CommentView[] = [];
    for (const c of comments) {
      const view: CommentView = { id: c.id, parentId: c.parentId, authorId: c.authorId, authorName: names.get(c.authorId) ?? '?', body: c.body, createdAt: c.createdAt.toISOString(), replies: [] };
      byId.set(c.id, view);
      (c.parentId ? byId.get(c.parentId)?.replies ?? roots : roots).push(view);
    }
    return {
      rules, comments: roots,
      votes: votes.map((v) => ({ voterId: v.voterId, voterName: names.get(v.voterId) ?? '?', choice: v.choice, reason: v.reason, updatedAt: v.updatedAt.toISOString() })),
      decision: decision ? {
        outcome: decision.outcome, approvedLimit: decision.approvedLimit, reason: decision.reason, override: decision.override, votes: decision.votes,
        decidedByName: names.get(decision.decidedBy) ?? '?', createdAt: decision.createdAt.toISOString(), advisoryId: current?.id ?? null,
        corrects: corrects ? { proposalId: corrects.proposalId, docId: docs.get(corrects.supersedesAdvisoryId)?.docId ?? '', limit: corrects.previousLimit } : null,
      } : null,
      corrections: corrections.map((c): CorrectionView => ({
        id: c.id, kind: c.kind, correctedLimit: c.correctedLimit, previousLimit: c.previousLimit, reason: c.reason, override: c.override, votes: c.votes,
        decidedByName: names.get(c.decidedBy) ?? '?', createdAt: c.createdAt.toISOString(), advisoryId: c.advisoryId,
        docId: docs.get(c.advisoryId)?.docId ?? '', supersededDocId: docs.get(c.supersedesAdvisoryId)?.docId ?? '',
        viaProposalId: c.kind === 'vote' ? votedOn.get(c.decisionId) ?? null : null,
      })),
      audit: audit.map((a): AuditView => ({ id: a.id, actorName: a.actorId ? names.get(a.actorId) ?? null : null, action: a.action, entityType: a.entityType, entityId: a.entityId, before: a.before, after: a.after, createdAt: a.createdAt.toISOString() })),
    };
  }

  /** Submitted proposals for the board, newest first: who submitted each, for which stock and region, and where it stands. */
  async queue(): Promise<ProposalListItem[]> {
    return listItems(await Proposal.findAll({ where: { status: 'submitted' }, order: [['submittedAt', 'DESC'], ['id', 'DESC']] }));
  }

  /** The advisory in force for an earlier version of this proposal (following its revisions back), if any. */
  private async advisoryInForce(proposal: Proposal, t: Transaction): Promise<{ advisory: Advisory; proposalId: number } | null> {
    let id = proposal.revisesId;
    for (let depth = 0; id !== null && depth < 50; depth++) {
      const earlier = await Proposal.findByPk(id, { transaction: t });
      if (!earlier) return null;
      const d = await Decision.findOne({ where: { proposalId: earlier.id, outcome: 'approved' }, transaction: t });
      if (d) {
        const all = await Advisory.findAll({ where: { decisionId: d.id }, attributes: ['id'], transaction: t });
        const current = await this.newestInChain(all.map((a) => a.id), t);
        if (current) return { advisory: current, proposalId: earlier.id };
      }
      id = earlier.revisesId;
    }
    return null;
  }

  /** Follows supersession from any of these advisories to the one in force. */
  private async newestInChain(ids: number[], t?: Transaction): Promise<Advisory | null> {
    if (ids.length === 0) return null;
    let a = await Advisory.findByPk(ids[0]!, { transaction: t, lock: t ? t.LOCK.UPDATE : undefined });
    for (let i = 0; a?.supersededById && i < 100; i++) a = await Advisory.findByPk(a.supersededById, { transaction: t, lock: t ? t.LOCK.UPDATE : undefined });
    return a;
  }

  private async submitted(id: number): Promise<Proposal> {
    const p = await Proposal.findByPk(id);
    if (!p) throw new NotFoundError('Proposal');
    if (p.status !== 'submitted') throw new ConflictError('PROPOSAL_NOT_SUBMITTED', 'The board only acts on submitted proposals.');
    return p;
  }

}

export type { Transaction };
