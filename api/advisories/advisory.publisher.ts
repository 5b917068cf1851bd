/** Publishing an approved limit: the PDF, its SHA-256, the advisory row and the subscribers' e-mails, in the decision's transaction. */
import { createHash } from 'node:crypto';
import type { Transaction } from 'sequelize';
import { recordAudit } from '../audit/audit.service';
import { Correction, Decision, type RulesSnapshot, type VoteCount } from '../board/board.models';
import type { MailSender } from '../mail/mail-sender';
import { OutboxMail } from '../mail/outbox.model';
import { figuresFor, quotaProjection } from '../proposals/proposal.service';
import type { Proposal } from '../proposals/proposal.model';
import { Region } from '../regions/region.model';
import { Run } from '../runs/run.model';
import type { RunResults, SurplusRunResults } from '../runs/run.schemas';
import type { ProposalFigures } from '../proposals/proposal.schemas';
import { pairFigures, pairStudyFor } from '../proposals/pair-figures';
import { renderPairAdvisoryPdf } from './pair-advisory-pdf';
import { Stock } from '../stocks/stock.model';
import { Subscription } from '../subscriptions/subscription.models';
import { User } from '../users/user.model';
import { Advisory } from './advisory.model';
import { renderAdvisoryPdf } from './advisory-pdf';

/** A correction being published: what it supersedes, how it was decided and why. */
export interface CorrectionInput {
  advisory: Advisory;
  reason: string;
  /** The chair alone under the board's rules, or a new board vote on a revised proposal. */
  kind: 'chair' | 'vote';
  /** The votes on the correction itself (a new vote); null for the chair's correction. */
  votes: VoteCount | null;
  rules: RulesSnapshot;
  /** The proposal whose published limit is corrected. */
  proposalId: number;
}

const n0 = (v: number) => Math.round(v).toLocaleString('en-GB');

export class AdvisoryPublisher {
  constructor(private readonly mail: MailSender, private readonly publicUrl: string) {}

  /** Writes the advisory for an approved limit (and, for a correction, links it to the one it supersedes). */
  async publish(p: { decision: Decision; proposal: Proposal; limit: number; override: boolean; actorId: number; supersedes?: CorrectionInput }, t: Transaction): Promise<Advisory> {
    const { decision, proposal, limit, override, actorId } = p;
    const supersedes = p.supersedes ?? null;
    const run = (await Run.findByPk(proposal.runId, { transaction: t }))!;
    const parsed = JSON.parse(run.results!) as RunResults;
    const stock = (await Stock.findByPk(proposal.stockId, { transaction: t }))!;
    const region = (await Region.findByPk(stock.regionId, { transaction: t }))!;
    const chair = (await User.findByPk(decision.decidedBy, { transaction: t }))!;
    const actor = actorId === chair.id ? chair : (await User.findByPk(actorId, { transaction: t }))!;
    const original = supersedes ? (await Decision.findByPk(supersedes.advisory.decisionId, { transaction: t }))! : null;
    const year = new Date().getUTCFullYear();
    const seq = (await Advisory.count({ transaction: t })) + 1;
    const docId = `BM-${year}-${stock.code.toUpperCase()}-${String(seq).padStart(4, '0')}`;
    const publishedAt = new Date();
    let f: ProposalFigures;
    let pdf: Buffer;
    if (parsed.kind === 'predator-prey') {
      // a pair moves along its ray: the predator limit keeps the proposed ratio to the prey limit
      const predatorLimit = (proposal.predatorQuota ?? 0) * (limit / proposal.quota);
      const study = pairStudyFor(run, parsed, limit, predatorLimit);
      f = pairFigures(run, parsed, study, stock.unit);
      const last = parsed.years.length - 1;
      pdf = await renderPairAdvisoryPdf({
        docId, stockName: stock.name, regionName: region.name, unit: stock.unit, publishedAt, preyLimit: limit, predatorLimit, override,
        supersedes: supersedes ? { docId: supersedes.advisory.docId, reason: supersedes.reason } : null,
        pair: f.pair!, rayMedian: f.foldHarvest.median, projectionYears: f.projectionYears,
        decision: { reason: decision.reason, votes: decision.votes, chairName: chair.name, decidedAt: decision.createdAt },
        plane: parsed.catchPlane!, current: { preyCatch: parsed.preyCatch[last]!, predatorCatch: parsed.predatorCatch[last]! }, cloud: study.cloud,
        projection: { startYear: parsed.years[last]! + 1, prey: study.projection.prey, predator: study.projection.predator },
        fixed: parsed.fit.fixed ?? [],
      });
    } else {
      const results = parsed as SurplusRunResults;
      // one projection serves both the figures and the chart of the PDF
      const proj = quotaProjection(run, results, limit);
      f = figuresFor(run, results, limit, stock.unit, proj);
      pdf = await renderAdvisoryPdf({
        docId, stockName: stock.name, regionName: region.name, unit: stock.unit, publishedAt, limit, proposalQuota: proposal.quota, override,
        supersedes: supersedes ? { docId: supersedes.advisory.docId, reason: supersedes.reason } : null,
        correction: supersedes && original ? {
          kind: supersedes.kind, reason: supersedes.reason, votes: supersedes.votes, byName: actor.name, at: publishedAt, proposalId: proposal.id,
          previous: { docId: supersedes.advisory.docId, limit: supersedes.advisory.approvedLimit, votes: original.votes, decidedAt: original.createdAt },
        } : null,
        figures: {
          marginAbs: f.marginToFold.absolute, marginFrac: f.marginToFold.fraction, marginLowerAbs: f.marginToFoldLower.absolute, marginLowerFrac: f.marginToFoldLower.fraction,
          hStar: f.foldHarvest, msy: f.msy, bOverBmsy: f.bOverBmsy, fOverFmsy: f.fOverFmsy, pPassFold: f.atQuota.pPassFold, pBelowLimit: f.atQuota.pBelowLimit, projectionYears: f.projectionYears,
          ...(f.stateMargin ? { stateMargin: f.stateMargin } : {}), control: f.control ?? 'catch',
        },
        decision: { reason: decision.reason, votes: decision.votes, chairName: chair.name, decidedAt: decision.createdAt },
        fold: { table: results.fold.table, hStar: results.fold.hStar, bFold: results.fold.bFold, band: { p5: results.bootstrap!.hStar.p5, p95: results.bootstrap!.hStar.p95 } },
        catches: results.fit.catches,
        projection: { startYear: results.fit.years[results.fit.years.length - 1]! + 1, median: proj.median, lower: proj.lower, upper: proj.upper, limitRef: f.limitFraction * results.fit.reference.bMsy },
        ...(proposal.figures.reserveDesign ? { reserveDesign: proposal.figures.reserveDesign } : {}),
      });
    }
    const sha256 = createHash('sha256').update(pdf).digest('hex');
    const pairText = f.pair ? ` of prey and ${n0(f.pair.predatorCatch)} ${stock.unit} of predator` : '';
    const title = `${stock.name}: ${n0(limit)} ${stock.unit}${pairText} per year${supersedes ? ' (corrected)' : ''}`;
    const margin = f.pair
      ? `with a ${(f.pair.pCross * 100).toFixed(1)}% probability that the pair lies beyond a fold, Hopf or predator-loss curve of the catch plane`
      : `${n0(f.marginToFold.absolute)} ${stock.unit} (${(f.marginToFold.fraction * 100).toFixed(1)}%) below the median fold harvest`;
    const opening = !supersedes ? `The quota board approved a harvest limit of ${n0(limit)} ${stock.unit}${pairText} per year for ${stock.name} (${region.name})`
      : supersedes.kind === 'chair'
        ? `The chair of the quota board corrected the harvest limit for ${stock.name} (${region.name}) from ${n0(supersedes.advisory.approvedLimit)} to ${n0(limit)} ${stock.unit} per year, without a board vote, as the board's rules allow`
        : `By a new vote, the quota board corrected the harvest limit for ${stock.name} (${region.name}) from ${n0(supersedes.advisory.approvedLimit)} to ${n0(limit)} ${stock.unit} per year`;
    const summary = `${opening}, ${margin}.${override ? ' The limit was approved by override above the lower 5% of the fold harvest.' : ''}`;
    const advisory = await Advisory.create({
      docId, stockId: stock.id, regionId: region.id, decisionId: decision.id, supersedesId: supersedes?.advisory.id ?? null, supersededById: null,
      approvedLimit: limit, override, title, summary, pdf, sha256, publishedBy: actorId,
    }, { transaction: t });
    if (supersedes) {
      await Advisory.update({ supersededById: advisory.id }, { where: { id: supersedes.advisory.id }, transaction: t });
      const c = await Correction.create({
        advisoryId: advisory.id, supersedesAdvisoryId: supersedes.advisory.id, proposalId: supersedes.proposalId, decisionId: decision.id,
        kind: supersedes.kind, correctedLimit: limit, previousLimit: supersedes.advisory.approvedLimit, reason: supersedes.reason, override,
        votes: supersedes.votes, rules: supersedes.rules, decidedBy: actorId,
      }, { transaction: t });
      await recordAudit({
        actorId, action: `proposal.correct.${supersedes.kind}`, entityType: 'proposal', entityId: supersedes.proposalId,
        before: { limit: supersedes.advisory.approvedLimit, docId: supersedes.advisory.docId },
        after: { correctionId: c.id, kind: supersedes.kind, limit, docId, reason: supersedes.reason, votes: supersedes.votes, chairMayCorrect: supersedes.rules.chairMayCorrect },
      }, t);
    }
    await recordAudit({ actorId, action: supersedes ? 'advisory.supersede' : 'advisory.publish', entityType: 'advisory', entityId: advisory.id, after: { docId, sha256, limit, supersedes: supersedes?.advisory.docId ?? null } }, t);
    const subscribers = await Subscription.findAll({ where: { regionId: region.id, ...Subscription.givingAccess() }, transaction: t });
    // each licensee's choice: every advisory, corrections only, or the weekly digest (queued elsewhere)
    const wanted = supersedes ? ['every', 'corrections'] : ['every'];
    const users = await User.findAll({ where: { id: [...new Set(subscribers.map((s) => s.userId))], active: true, mailPreference: wanted }, transaction: t });
    for (const u of users) {
      await OutboxMail.create({
        dedupeKey: `advisory:${advisory.id}:user:${u.id}`, toAddress: u.email, advisoryId: advisory.id,
        subject: supersedes ? `Correction to harvest advisory ${supersedes.advisory.docId}: ${title}` : `Harvest advisory ${docId}: ${title}`,
        body: `${summary}\n\nThe advisory is attached and in your portal: ${this.publicUrl}/portal\n\nDocument ${docId}, SHA-256 ${sha256}.\n\nThese figures are scientific advice to a competent authority, subject to local regulation and licensed practice.`,
        lastError: null, messageId: null, nextAttemptAt: new Date(), sentAt: null,
      }, { transaction: t });
    }
    return advisory;
  }

  /** Starts sending what the committed transaction queued (never inside it). */
  afterCommit(): void {
    this.mail.kick();
  }
}
