/**
 * The worker side of the run queue: claims a run's job (BullMQ moves it to active atomically; the
 * run's row is claimed with a conditional update), computes it in a worker thread, streams progress
 * through the queue, writes the outcome, and stops at once when the run is cancelled.
 */
import { hostname } from 'node:os';
import { type Job, Worker } from 'bullmq';
import { Op } from 'sequelize';
import type { Redis } from 'ioredis';
import type { Config } from '../config';
import { Dataset } from '../datasets/dataset.model';
import { logFailure, whileDatabaseAway } from '../health/retry';
import { parseStockCsv } from '../engine/data/csv';
import { tsWorker } from '../engine/numerics/ts-worker';
import { Run } from './run.model';
import { cancelChannel, jobIdOf, redisConnection, RunJobs, type RunJobData } from './run-jobs';

const PROGRESS_EVERY_MS = 200;
/** The row's progress is refreshed less often: clients follow the queue's events, the row serves lists. */
const PROGRESS_ROW_EVERY_MS = 2_000;

type Outcome = { status: 'succeeded'; results: string } | { status: 'failed'; error: string } | { status: 'cancelled' };
type ThreadMessage = { type: 'progress'; fraction: number; stage: string } | { type: 'done'; results: unknown } | { type: 'failed'; message: string };

export interface RunWorkerOptions {
  /** The worker-thread module that computes one run (tests swap in one that fails). */
  threadUrl?: URL;
  name?: string;
}

export class RunWorker {
  readonly name: string;
  private readonly worker: Worker<RunJobData>;
  private readonly subscriber: Redis;
  private readonly jobs: RunJobs;
  private sweeper: NodeJS.Timeout | null = null;
  private readonly threadUrl: URL;

  constructor(private readonly config: Config, opts: RunWorkerOptions = {}) {
    this.name = opts.name ?? `${hostname()}:${process.pid}`;
    this.threadUrl = opts.threadUrl ?? new URL('./run-worker.ts', import.meta.url);
    this.jobs = new RunJobs(config);
    this.worker = new Worker<RunJobData>(config.RUN_QUEUE, (job, token, signal) => this.process(job, signal), {
      connection: redisConnection(config.REDIS_URL, true),
      concurrency: config.WORKER_CONCURRENCY,
      lockDuration: config.RUN_STALL_MS,
      stalledInterval: config.RUN_STALL_MS,
      maxStalledCount: 1,
    });
    this.worker.on('error', (err) => console.error(`run worker ${this.name}: ${err.message}`));
    this.worker.on('failed', (job, err) => { this.onFailed(job, err).catch(logFailure(`recording the failure of ${job?.id ?? 'a run'}`)); });
    this.subscriber = redisConnection(config.REDIS_URL, true);
    this.subscriber.on('message', (_channel: string, runId: string) => { this.worker.cancelJob(jobIdOf(Number(runId)), 'cancelled'); });
    void this.subscriber.subscribe(cancelChannel(config.RUN_QUEUE)).catch(() => undefined);
  }

  /** Resolves once connected; then sweeps for runs whose job was lost, now and every stall interval. */
  async ready(): Promise<void> {
    await this.worker.waitUntilReady();
    await this.sweep().catch(logFailure('sweeping for lost runs'));
    this.sweeper = setInterval(() => { this.sweep().catch(logFailure('sweeping for lost runs')); }, this.config.RUN_STALL_MS);
    this.sweeper.unref();
  }

  /** Stops taking jobs; a run being computed finishes first unless `force`. */
  async close(force = false): Promise<void> {
    if (this.sweeper) clearInterval(this.sweeper);
    await this.worker.close(force);
    await Promise.allSettled([this.subscriber.quit(), this.jobs.close()]);
  }

  private async process(job: Job<RunJobData>, signal?: AbortSignal): Promise<{ outcome: string }> {
    const { runId } = job.data;
    // the row is claimed once per activation: from queued, or from running when a stalled job is retried
    const [claimed] = await whileDatabaseAway(() => Run.update(
      { status: 'running', attempts: Run.sequelize!.literal('attempts + 1') as unknown as number, worker: this.name, startedAt: new Date(), progress: 0, stage: 'Starting' },
      { where: { id: runId, [Op.or]: [{ status: 'queued' }, { status: 'running', attempts: { [Op.lt]: job.attemptsStarted } }] } },
    ), { label: `run ${runId} claim`, forMs: 60_000 });
    if (claimed === 0) return { outcome: 'not claimed (cancelled or finished)' };
    const run = (await Run.findByPk(runId))!;
    const attempt = run.attempts;
    const dataset = await Dataset.findByPk(run.datasetId);
    const parsed = dataset ? parseStockCsv(dataset.csvText, { lenientNumbers: true }) : null;
    const started = Date.now();
    const outcome: Outcome = parsed?.ok
      ? await this.compute(job, { series: parsed.series, model: run.model, options: run.options }, attempt, signal)
      : { status: 'failed', error: 'The run or its dataset could not be read.' };
    // the outcome waits through a database outage (a job that still cannot write it fails and is retried)
    await whileDatabaseAway(() => this.finish(runId, attempt, outcome, Date.now() - started), { label: `run ${runId} outcome`, forMs: 5 * 60_000 });
    return { outcome: outcome.status };
  }

  /** Computes in a worker thread; an abort (cancel) terminates the thread and everything it started. */
  private compute(job: Job<RunJobData>, input: unknown, attempt: number, signal?: AbortSignal): Promise<Outcome> {
    const runId = job.data.runId;
    return new Promise((resolve) => {
      const thread = tsWorker(this.threadUrl, input);
      let settled = false;
      let lastSent = 0;
      let lastRow = Date.now();
      const settle = (o: Outcome) => {
        if (settled) return;
        settled = true;
        signal?.removeEventListener('abort', onAbort);
        void thread.terminate();
        resolve(o);
      };
      const onAbort = () => settle({ status: 'cancelled' });
      if (signal?.aborted) return settle({ status: 'cancelled' });
      signal?.addEventListener('abort', onAbort, { once: true });
      thread.on('message', (msg: ThreadMessage) => {
        if (msg.type === 'done') return settle({ status: 'succeeded', results: JSON.stringify(msg.results) });
        if (msg.type === 'failed') return settle({ status: 'failed', error: `The fit failed: ${msg.message}` });
        const now = Date.now();
        if (lastSent !== 0 && now - lastSent < PROGRESS_EVERY_MS) return;
        lastSent = now;
        void job.updateProgress({ fraction: msg.fraction, stage: msg.stage }).catch(() => undefined);
        if (now - lastRow >= PROGRESS_ROW_EVERY_MS) {
          lastRow = now;
          void Run.update({ progress: msg.fraction, stage: msg.stage }, { where: { id: runId, status: 'running', attempts: attempt } }).catch(() => undefined);
        }
      });
      thread.on('error', (err) => settle({ status: 'failed', error: `The fit failed: ${err.message}` }));
      thread.on('exit', (code) => settle({ status: 'failed', error: `The run's worker thread stopped unexpectedly (exit code ${code}).` }));
    });
  }

  /** Writes the outcome, only over this claim (a cancelled run stays cancelled). */
  private async finish(runId: number, attempt: number, o: Outcome, durationMs: number): Promise<void> {
    if (o.status === 'cancelled') {
      await Run.update({ stage: null, durationMs, finishedAt: new Date() }, { where: { id: runId, status: 'cancelled', durationMs: null } });
      return;
    }
    await Run.update({
      status: o.status, results: o.status === 'succeeded' ? o.results : null, error: o.status === 'failed' ? o.error : null,
      ...(o.status === 'succeeded' ? { progress: 1 } : {}), stage: null, durationMs, finishedAt: new Date(),
    }, { where: { id: runId, status: 'running', attempts: attempt } });
  }

  /** A job that failed for good (stalled twice, or the database stayed away): its run is marked failed with the reason. */
  private async onFailed(job: Job<RunJobData> | undefined, err: Error): Promise<void> {
    if (!job || (await job.getState()) !== 'failed') return;
    await RunWorker.markLost(job.data.runId, /stalled/i.test(err.message)
      ? `The worker computing this run stopped responding and its retry stopped too (${err.message}). Start it again.`
      : `The run could not be completed: ${err.message}. Start it again.`);
  }

  static async markLost(runId: number, error: string): Promise<number> {
    const [n] = await Run.update({ status: 'failed', error, stage: null, finishedAt: new Date() }, { where: { id: runId, status: ['queued', 'running'] } });
    return n;
  }

  /**
   * Marks failed every unfinished run whose job the queue no longer holds or has already ended
   * (Redis lost its data, a server stopped between recording and queueing, a final failure not yet
   * written): nothing stays queued or running for ever. Runs younger than a stall interval are left alone.
   */
  async sweep(): Promise<number> {
    const before = new Date(Date.now() - Math.max(this.config.RUN_STALL_MS, 10_000));
    const open = await Run.findAll({ attributes: ['id'], where: { status: ['queued', 'running'], createdAt: { [Op.lt]: before } } });
    let n = 0;
    for (const { id } of open) {
      const state = await this.jobs.state(id);
      if (state === null) n += await RunWorker.markLost(id, 'The run queue no longer holds this run (the queue was reset or the run was never queued). Start it again.');
      else if (state === 'completed' || state === 'failed') n += await RunWorker.markLost(id, 'The run\'s job ended without recording an outcome. Start it again.');
    }
    return n;
  }
}
