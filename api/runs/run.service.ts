/** Starting, reading, comparing and cancelling model runs. */
import type { Sequelize } from 'sequelize';
import { recordAudit } from '../audit/audit.service';
import { Dataset } from '../datasets/dataset.model';
import { ENGINE_VERSION } from '../engine/assessment';
import { ConflictError, HttpError, NotFoundError } from '../http/http-error';
import { Run } from './run.model';
import type { RunQueue } from './run-queue';
import { PREDATOR_PREY_MODELS, type RunResults, type RunSummary, type RunView, type StartRunBody } from './run.schemas';

export class RunService {
  constructor(private readonly sequelize: Sequelize, private readonly queue: RunQueue) {}

  /** Records the run with its inputs and queues it; the work happens in a worker thread. */
  async start(actorId: number, body: StartRunBody): Promise<RunView> {
    const dataset = await Dataset.findByPk(body.datasetId);
    if (!dataset) throw new NotFoundError('Dataset');
    const linkedModel = (PREDATOR_PREY_MODELS as readonly string[]).includes(body.model);
    if (linkedModel !== (dataset.kind === 'predator-prey')) {
      throw new HttpError(422, 'MODEL_DATA_MISMATCH', linkedModel
        ? 'A predator-prey model needs a linked dataset with prey and predator columns.'
        : 'This dataset is a linked predator-prey series: choose Rosenzweig-MacArthur or Lotka-Volterra.');
    }
    if (linkedModel && (body.fixed || body.priors)) {
      throw new HttpError(422, 'OPTION_NOT_FOR_MODEL', 'Fixed values and priors apply to the surplus-production models only.', { fixed: ['not for predator-prey models'] });
    }
    const unknownQ = Object.keys(body.fixed?.q ?? {}).filter((n) => !dataset.indexNames.includes(n));
    if (unknownQ.length) {
      throw new HttpError(422, 'UNKNOWN_SURVEY', `The dataset has no survey named ${unknownQ.join(', ')} (it has ${dataset.indexNames.join(', ')}).`, { 'fixed.q': [`unknown survey ${unknownQ.join(', ')}`] });
    }
    const { datasetId, model, ...options } = body;
    const run = await this.sequelize.transaction(async (t) => {
      const r = await Run.create({
        stockId: dataset.stockId, datasetId, model, options, status: 'queued', stage: 'Waiting to start', engineVersion: ENGINE_VERSION,
        results: null, error: null, durationMs: null, createdBy: actorId, startedAt: null, finishedAt: null,
      }, { transaction: t });
      await recordAudit({ actorId, action: 'run.start', entityType: 'run', entityId: r.id, after: { datasetId, model, options } }, t);
      return r;
    });
    this.queue.enqueue(run.id);
    return run.toView(dataset.version);
  }

  async get(id: number): Promise<{ run: RunView; results: RunResults | null }> {
    const run = await Run.findByPk(id);
    if (!run) throw new NotFoundError('Run');
    const dataset = await Dataset.findByPk(run.datasetId, { attributes: ['version'] });
    return { run: run.toView(dataset?.version ?? null), results: run.results ? (JSON.parse(run.results) as RunResults) : null };
  }

  /** Every run of a stock, newest first, with the figures that compare models side by side. */
  async listForStock(stockId: number): Promise<RunSummary[]> {
    const runs = await Run.findAll({ where: { stockId }, order: [['id', 'DESC']] });
    const versions = new Map((await Dataset.findAll({ where: { stockId }, attributes: ['id', 'version'] })).map((d) => [d.id, d.version]));
    return runs.map((r) => {
      const res = r.results ? (JSON.parse(r.results) as RunResults) : null;
      const s = res?.kind === 'surplus' ? res : null;
      return {
        ...r.toView(versions.get(r.datasetId) ?? null),
        logLik: res ? res.fit.logLik : null, aic: res ? res.fit.aic : null,
        msy: s?.fit.reference.msy ?? null, foldHarvest: s?.fold.hStar ?? null,
        bOverBmsy: s?.fit.status.bOverBmsy ?? null, fOverFmsy: s?.fit.status.fOverFmsy ?? null,
        proposedQuota: s?.quota?.proposal.proposed ?? null,
      };
    });
  }

  async cancel(actorId: number, id: number): Promise<RunView> {
    const run = await Run.findByPk(id);
    if (!run) throw new NotFoundError('Run');
    if (run.status !== 'queued' && run.status !== 'running') throw new ConflictError('RUN_FINISHED', `This run has already ${run.status}.`);
    await this.queue.cancel(id);
    await this.sequelize.transaction((t) => recordAudit({ actorId, action: 'run.cancel', entityType: 'run', entityId: id }, t));
    await run.reload();
    return run.toView();
  }
}
