/**
 * Runs model runs off the request thread, one at a time, each in a worker thread. Progress and the
 * outcome are written to the run's row; cancelling terminates the worker.
 */
import type { Worker } from 'node:worker_threads';
import { tsWorker } from '../engine/numerics/ts-worker';
import { parseStockCsv } from '../engine/data/csv';
import { Dataset } from '../datasets/dataset.model';
import { logFailure, whileDatabaseAway } from '../health/retry';
import { Run } from './run.model';

const PROGRESS_EVERY_MS = 250;

export class RunQueue {
  private readonly waiting: number[] = [];
  private current: { id: number; worker: Worker } | null = null;
  private idle: Promise<void> = Promise.resolve();
  private release: (() => void) | null = null;

  constructor(private readonly workerUrl = new URL('./run-worker.ts', import.meta.url)) {}

  /** Marks runs left unfinished by a stopped server as failed; their inputs are kept, so they can be started again. */
  static async recoverInterrupted(): Promise<number> {
    const [n] = await Run.update(
      { status: 'failed', error: 'The server stopped before this run finished. Start it again.', finishedAt: new Date() },
      { where: { status: ['queued', 'running'] } },
    );
    return n;
  }

  enqueue(runId: number): void {
    this.waiting.push(runId);
    if (!this.release) this.idle = new Promise((r) => { this.release = r; });
    this.next().catch(logFailure('starting the next run'));
  }

  /** Cancels a queued or running run; false when it is not in this queue. */
  async cancel(runId: number): Promise<boolean> {
    const i = this.waiting.indexOf(runId);
    if (i >= 0) {
      this.waiting.splice(i, 1);
      await this.finish(runId, { status: 'cancelled', error: null });
      return true;
    }
    if (this.current?.id !== runId) return false;
    const { worker } = this.current;
    this.current = null;
    await worker.terminate();
    await this.finish(runId, { status: 'cancelled', error: null });
    this.next().catch(logFailure('starting the next run'));
    return true;
  }

  /** What /api/health shows for the run queue. */
  health(): { status: 'up'; figures: Record<string, number | null> } {
    return { status: 'up', figures: { waiting: this.waiting.length, running: this.current?.id ?? null } };
  }

  /** Resolves when nothing is queued or running (for orderly shutdown and tests). */
  whenIdle(): Promise<void> {
    return this.idle;
  }

  private async next(): Promise<void> {
    if (this.current) return;
    const id = this.waiting.shift();
    if (id === undefined) {
      this.release?.();
      this.release = null;
      return;
    }
    const label = `run ${id}`;
    const run = await whileDatabaseAway(() => Run.findByPk(id), { label });
    const dataset = run ? await whileDatabaseAway(() => Dataset.findByPk(run.datasetId), { label }) : null;
    const parsed = dataset ? parseStockCsv(dataset.csvText, { lenientNumbers: true }) : null;
    if (!run || !parsed?.ok) {
      await this.finish(id, { status: 'failed', error: 'The run or its dataset could not be read.' });
      return this.next();
    }
    const started = Date.now();
    await whileDatabaseAway(() => run.update({ status: 'running', startedAt: new Date(started), progress: 0, stage: 'Starting' }), { label });
    const worker = tsWorker(this.workerUrl, { series: parsed.series, model: run.model, options: run.options });
    this.current = { id, worker };
    let lastWrite = 0;
    let settled = false;
    const settle = async (outcome: Parameters<RunQueue['finish']>[1]) => {
      if (settled || this.current?.id !== id) return;
      settled = true;
      this.current = null;
      await worker.terminate();
      await this.finish(id, { ...outcome, durationMs: Date.now() - started });
      await this.next();
    };
    const settleLogged = (outcome: Parameters<RunQueue['finish']>[1]) => { settle(outcome).catch(logFailure(`recording the outcome of run ${id}`)); };
    worker.on('message', (msg: { type: 'progress'; fraction: number; stage: string } | { type: 'done'; results: unknown } | { type: 'failed'; message: string }) => {
      if (msg.type === 'progress') {
        if (Date.now() - lastWrite < PROGRESS_EVERY_MS) return;
        lastWrite = Date.now();
        // progress is best effort: a write lost to a database outage is simply skipped
        Run.update({ progress: msg.fraction, stage: msg.stage }, { where: { id, status: 'running' } }).catch(() => undefined);
      } else if (msg.type === 'done') {
        settleLogged({ status: 'succeeded', results: JSON.stringify(msg.results), error: null });
      } else {
        settleLogged({ status: 'failed', error: `The fit failed: ${msg.message}` });
      }
    });
    worker.on('error', (err) => settleLogged({ status: 'failed', error: `The fit failed: ${err.message}` }));
    worker.on('exit', (code) => settleLogged({ status: 'failed', error: `The run's worker stopped unexpectedly (exit code ${code}).` }));
  }

  private async finish(id: number, outcome: { status: 'succeeded' | 'failed' | 'cancelled'; results?: string; error: string | null; durationMs?: number }): Promise<void> {
    const values: Partial<Pick<Run, 'status' | 'results' | 'error' | 'durationMs' | 'progress' | 'stage' | 'finishedAt'>> = {
      status: outcome.status, results: outcome.results ?? null, error: outcome.error,
      durationMs: outcome.durationMs ?? null, stage: null, finishedAt: new Date(),
    };
    if (outcome.status === 'succeeded') values.progress = 1;
    // the outcome is kept in memory and written as soon as the database answers again
    await whileDatabaseAway(() => Run.update(values, { where: { id } }), { label: `run ${id} outcome` });
  }
}
