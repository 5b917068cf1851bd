/** Quota proposals: figures computed from the run by the engine; submitted proposals are frozen. */
import type { Sequelize, Transaction } from 'sequelize';
import { recordAudit } from '../audit/audit.service';
import type { ProjectionResult } from '../engine/projection/projection';
import { projectLevel, stateMarginAt } from '../engine/assessment';
import type { SurplusModelName } from '../engine/surplus/surplus';
import { ConflictError, HttpError, NotFoundError } from '../http/http-error';
import { Run } from '../runs/run.model';
import type { RunResults, SurplusRunResults } from '../runs/run.schemas';
import { pairFigures, pairStudyFor, proposableLinked } from './pair-figures';
import type { MailSender } from '../mail/mail-sender';
import { OutboxMail } from '../mail/outbox.model';
import { Stock } from '../stocks/stock.model';
import { User } from '../users/user.model';
import { Proposal } from './proposal.model';
import { listItems } from '../board/proposal-standing';
import { reserveDesignFigures } from './reserve-design';
import type { CandidateFigures, CreateProposalBody, ProposalFigures, ProposalListItem, ProposalView, UpdateProposalBody } from './proposal.schemas';

/** Figures for a proposal from its run: a single-stock quota, or a pair of catches on linked stocks. */
async function runFigures(runId: number, quota: number, predatorQuota: number | null | undefined, unit: string | null): Promise<{ run: Run; figures: ProposalFigures; predatorQuota: number | null }> {
  const run = await Run.findByPk(runId);
  if (!run) throw new NotFoundError('Run');
  const results = run.results ? (JSON.parse(run.results) as RunResults) : null;
  const u = unit ?? (await Stock.findByPk(run.stockId))!.unit;
  if (run.status === 'succeeded' && results?.kind === 'predator-prey') {
    const linked = proposableLinked(run, results, predatorQuota);
    return { run, figures: pairFigures(run, linked, pairStudyFor(run, linked, quota, predatorQuota!), u), predatorQuota: predatorQuota! };
  }
  if (predatorQuota !== undefined && predatorQuota !== null) throw new HttpError(422, 'NOT_LINKED', 'A predator catch belongs to proposals for linked stocks only.', { predatorQuota: ['not for a single stock'] });
  const { results: single } = await surplusResults(runId);
  return { run, figures: figuresFor(run, single, quota, u), predatorQuota: null };
}

async function surplusResults(runId: number): Promise<{ run: Run; results: SurplusRunResults }> {
  const run = await Run.findByPk(runId);
  if (!run) throw new NotFoundError('Run');
  const results = run.results ? (JSON.parse(run.results) as SurplusRunResults) : null;
  if (run.status !== 'succeeded' || results?.kind !== 'surplus' || !results.quota || !results.bootstrap) {
    throw new HttpError(422, 'RUN_NOT_PROPOSABLE', 'A proposal needs a finished single-stock run with a bootstrap (at least 100 replicates).');
  }
  return { run, results };
}

/** The run's projection at a level: the same function, replicates and seed as the run's own table. */
export function quotaProjection(run: Run, results: SurplusRunResults, catchLevel: number): ProjectionResult {
  const o = run.options;
  return projectLevel(run.model as SurplusModelName, results.bootstrap!.draws, catchLevel, { years: o.years, processSd: o.processSd, limitFraction: o.limit, seed: results.quota?.seed ?? o.seed, control: o.control ?? 'catch' });
}

function endFigures(p: ProjectionResult): CandidateFigures {
  return {
    catchLevel: p.catchLevel, pPassFold: p.pPassFold, pBelowLimit: p.pBelowLimit, returnRate: p.returnRate,
    medianEnd: p.median[p.median.length - 1]!, lowerEnd: p.lower[p.lower.length - 1]!, upperEnd: p.upper[p.upper.length - 1]!,
    ...(p.pCrossThreshold === undefined ? {} : { pCrossThreshold: p.pCrossThreshold }),
  };
}

/** Engine figures for a quota: margin to the fold, risks and projections, from the run's bootstrap draws. */
export function figuresFor(run: Run, results: SurplusRunResults, quota: number, unit: string, atQuota = quotaProjection(run, results, quota)): ProposalFigures {
  const o = run.options;
  const { median, lower5, upper95 } = results.quota!.proposal.hStar;
  return {
    unit, model: run.model, foldHarvest: { median, lower5, upper95 },
    marginToFold: { absolute: median - quota, fraction: (median - quota) / median },
    marginToFoldLower: { absolute: lower5 - quota, fraction: (lower5 - quota) / lower5 },
    msy: results.fit.reference.msy, bOverBmsy: results.fit.status.bOverBmsy, fOverFmsy: results.fit.status.fOverFmsy,
    risk: o.risk, projectionYears: o.years, limitFraction: o.limit, control: o.control ?? 'catch',
    stateMargin: stateMarginAt(run.model as SurplusModelName, results.fit, o.control ?? 'catch', atQuota),
    ...(results.quota!.rebuild ? { rebuild: results.quota!.rebuild } : {}),
    atQuota: endFigures(atQuota),
    candidates: results.quota!.candidates.map(endFigures),
    engineProposal: results.quota!.proposal.proposed,
  };
}

export class ProposalService {
  constructor(private readonly sequelize: Sequelize, private readonly mail: MailSender | null = null, private readonly publicUrl = '') {}

  async create(actorId: number, body: CreateProposalBody, revisesId: number | null = null, keepDesign?: ProposalFigures['reserveDesign']): Promise<ProposalView> {
    const { run, figures, predatorQuota } = await runFigures(body.runId, body.quota, body.predatorQuota, null);
    if (keepDesign) figures.reserveDesign = keepDesign;
    else if (body.reserveDesign) figures.reserveDesign = await reserveDesignFigures(run.stockId, body.reserveDesign);
    return this.sequelize.transaction(async (t) => {
      const p = await Proposal.create({
        stockId: run.stockId, runId: run.id, revisesId, status: 'draft', quota: body.quota, predatorQuota, rationale: body.rationale,
        figures, createdBy: actorId, submittedAt: null,
      }, { transaction: t });
      await recordAudit({ actorId, action: revisesId ? 'proposal.revise' : 'proposal.create', entityType: 'proposal', entityId: p.id, after: { quota: p.quota, predatorQuota, runId: run.id, revisesId } }, t);
      return this.view(p, t);
    });
  }

  async update(actorId: number, id: number, body: UpdateProposalBody): Promise<ProposalView> {
    return this.sequelize.transaction(async (t) => {
      const p = await this.draft(id, t);
      const before = { quota: p.quota, predatorQuota: p.predatorQuota, rationale: p.rationale };
      const quota = body.quota ?? p.quota;
      let predatorQuota = p.predatorQuota ?? null;
      if (body.quota !== undefined || body.predatorQuota !== undefined) {
        const design = p.figures.reserveDesign;
        const r = await runFigures(p.runId, quota, body.predatorQuota ?? p.predatorQuota, p.figures.unit);
        p.figures = { ...r.figures, ...(design ? { reserveDesign: design } : {}) };
        predatorQuota = r.predatorQuota;
      }
      await p.update({ quota, predatorQuota, rationale: body.rationale ?? p.rationale, figures: p.figures }, { transaction: t });
      await recordAudit({ actorId, action: 'proposal.update', entityType: 'proposal', entityId: id, before, after: { quota: p.quota, predatorQuota, rationale: p.rationale } }, t);
      return this.view(p, t);
    });
  }

  /** Freezes a draft and hands it to the board; each board member is e-mailed once it commits. */
  async submit(actorId: number, id: number): Promise<ProposalView> {
    const view = await this.sequelize.transaction(async (t) => {
      const p = await this.draft(id, t);
      await p.update({ status: 'submitted', submittedAt: new Date() }, { transaction: t });
      await recordAudit({ actorId, action: 'proposal.submit', entityType: 'proposal', entityId: id, before: { status: 'draft' }, after: { status: 'submitted', quota: p.quota } }, t);
      const stock = (await Stock.findByPk(p.stockId, { transaction: t }))!;
      const board = await User.findAll({ where: { role: 'board', active: true }, transaction: t });
      for (const member of board) {
        await OutboxMail.create({
          dedupeKey: `proposal-submitted:${id}:user:${member.id}`, toAddress: member.email, advisoryId: null,
          subject: `Quota proposal #${id} for ${stock.name} awaits the board`,
          body: `A quota proposal of ${Math.round(p.quota).toLocaleString('en-GB')} ${p.figures.unit} per year${p.predatorQuota != null ? ` of prey and ${Math.round(p.predatorQuota).toLocaleString('en-GB')} ${p.figures.unit} of predator` : ''} for ${stock.name} was submitted. Margin to the fold: ${Math.round(p.figures.marginToFold.absolute).toLocaleString('en-GB')} ${p.figures.unit} (${(p.figures.marginToFold.fraction * 100).toFixed(1)}%).\n\nReview, comment and vote in Brinkmark: ${this.publicUrl}/proposals/${id}`,
          lastError: null, messageId: null, nextAttemptAt: new Date(), sentAt: null,
        }, { transaction: t });
      }
      return this.view(p, t);
    });
    this.mail?.kick();
    return view;
  }

  /** A new draft that starts from a submitted proposal (the submitted one stays as it was). */
  async revise(actorId: number, id: number): Promise<ProposalView> {
    const p = await Proposal.findByPk(id);
    if (!p) throw new NotFoundError('Proposal');
    const design = p.figures.reserveDesign;
    return this.create(actorId, { runId: p.runId, quota: p.quota, predatorQuota: p.predatorQuota ?? undefined, rationale: p.rationale }, p.id, design);
  }

  async get(id: number): Promise<ProposalView> {
    const p = await Proposal.findByPk(id);
    if (!p) throw new NotFoundError('Proposal');
    return this.view(p);
  }

  async listForStock(stockId: number, viewer: Express.User): Promise<ProposalListItem[]> {
    const where = viewer.role === 'board' ? { stockId, status: 'submitted' as const } : { stockId };
    return listItems(await Proposal.findAll({ where, order: [['id', 'DESC']] }));
  }

  private async draft(id: number, t: Transaction): Promise<Proposal> {
    const p = await Proposal.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
    if (!p) throw new NotFoundError('Proposal');
    if (p.status !== 'draft') throw new ConflictError('PROPOSAL_FROZEN', 'This proposal has been submitted and is frozen; revise it to make a new draft.');
    return p;
  }

  private async view(p: Proposal, t?: Transaction): Promise<ProposalView> {
    const u = await User.findByPk(p.createdBy, { attributes: ['name'], transaction: t });
    return p.toView(u?.name ?? null);
  }
}
