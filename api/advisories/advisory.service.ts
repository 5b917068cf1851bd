/** Reading advisories (licensees only for regions they subscribe to) and publishing corrections. */
import { Op, type Sequelize } from 'sequelize';
import { BoardRules, Decision } from '../board/board.models';
import { ConflictError, ForbiddenError, HttpError, NotFoundError } from '../http/http-error';
import { Proposal } from '../proposals/proposal.model';
import { Region } from '../regions/region.model';
import { Stock } from '../stocks/stock.model';
import { Subscription } from '../subscriptions/subscription.models';
import { Advisory } from './advisory.model';
import type { AdvisoryPublisher } from './advisory.publisher';
import type { AdvisoryView } from './advisory.schemas';

const META = ['id', 'docId', 'stockId', 'regionId', 'decisionId', 'approvedLimit', 'override', 'title', 'summary', 'sha256', 'supersedesId', 'supersededById', 'publishedAt', 'publishedBy'] as const;

/** Regions whose advisories this licensee may read now. */
export async function subscribedRegions(userId: number): Promise<number[]> {
  const subs = await Subscription.findAll({ where: { userId, ...Subscription.givingAccess() }, attributes: ['regionId'] });
  return [...new Set(subs.map((s) => s.regionId))];
}

export class AdvisoryService {
  constructor(private readonly sequelize: Sequelize, private readonly publisher: AdvisoryPublisher) {}

  async list(viewer: Express.User, q?: string): Promise<AdvisoryView[]> {
    const where: Record<string | symbol, unknown> = {};
    if (viewer.role === 'licensee') where.regionId = await subscribedRegions(viewer.id);
    if (q) where[Op.or] = [{ title: { [Op.like]: `%${q}%` } }, { summary: { [Op.like]: `%${q}%` } }, { docId: { [Op.like]: `%${q}%` } }];
    const rows = await Advisory.findAll({ where, attributes: [...META], order: [['publishedAt', 'DESC'], ['id', 'DESC']] });
    return this.views(rows);
  }

  async get(viewer: Express.User, id: number): Promise<Advisory> {
    const a = await Advisory.findByPk(id);
    if (!a) throw new NotFoundError('Advisory');
    if (viewer.role === 'licensee' && !(await subscribedRegions(viewer.id)).includes(a.regionId)) {
      throw new HttpError(403, 'NOT_SUBSCRIBED', 'Your subscription does not cover this region.');
    }
    return a;
  }

  async view(viewer: Express.User, id: number): Promise<AdvisoryView> {
    return (await this.views([await this.get(viewer, id)]))[0]!;
  }

  /** A correction: a new advisory with the corrected limit that supersedes this one (which stays as it was). */
  async supersede(actor: Express.User, id: number, body: { limit: number; reason: string; override: boolean }): Promise<AdvisoryView> {
    if (!actor.boardChair) throw new ForbiddenError('Only the chair of the board publishes a correction.');
    const created = await this.sequelize.transaction(async (t) => {
      const old = await Advisory.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
      if (!old) throw new NotFoundError('Advisory');
      if (old.supersededById) throw new ConflictError('ALREADY_SUPERSEDED', 'This advisory has already been superseded; correct the newest one.');
      const rules = await BoardRules.snapshot(t);
      if (!rules.chairMayCorrect) {
        throw new ConflictError('CORRECTION_NEEDS_VOTE', "The board's rules require a new vote for a correction: the assessor revises the proposal, and the board votes on the revised limit.");
      }
      const decision = (await Decision.findByPk(old.decisionId, { transaction: t }))!;
      const proposal = (await Proposal.findByPk(decision.proposalId, { transaction: t }))!;
      const lower = proposal.figures.foldHarvest.lower5;
      if (body.limit > lower && !body.override) throw new HttpError(422, 'OVERRIDE_REQUIRED', `A limit above the lower 5% of the fold harvest (${Math.round(lower)}) needs an explicit override.`);
      return this.publisher.publish({ decision, proposal, limit: body.limit, override: body.limit > lower, actorId: actor.id, supersedes: { advisory: old, reason: body.reason, kind: 'chair', votes: null, rules, proposalId: proposal.id } }, t);
    });
    this.publisher.afterCommit();
    return (await this.views([created]))[0]!;
  }

  private async views(rows: Advisory[]): Promise<AdvisoryView[]> {
    const stocks = new Map((await Stock.findAll({ where: { id: rows.map((r) => r.stockId) } })).map((s) => [s.id, s.name]));
    const regions = new Map((await Region.findAll({ where: { id: rows.map((r) => r.regionId) } })).map((r) => [r.id, r.name]));
    return rows.map((a) => ({
      id: a.id, docId: a.docId, stockId: a.stockId, stockName: stocks.get(a.stockId) ?? '', regionId: a.regionId, regionName: regions.get(a.regionId) ?? '',
      approvedLimit: a.approvedLimit, override: a.override, title: a.title, summary: a.summary, sha256: a.sha256,
      supersedesId: a.supersedesId, supersededById: a.supersededById, publishedAt: a.publishedAt.toISOString(),
    }));
  }
}
