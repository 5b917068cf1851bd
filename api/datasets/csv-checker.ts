/**
 * Checks uploads off the request thread: one long-lived worker thread takes the files in turn, so a
 * hostile file costs that thread, never the server's event loop. A check that runs past its time is
 * stopped (the worker is replaced) and answered with a specific error.
 */
import type { Worker } from 'node:worker_threads';
import { tsWorker } from '../engine/numerics/ts-worker';
import { HttpError } from '../http/http-error';
import type { CsvCheck } from './dataset.schemas';

const TIME_LIMIT_MS = 10_000;

interface Pending { resolve(c: CsvCheck): void; reject(e: Error): void; timer: NodeJS.Timeout }

export class CsvChecker {
  private worker: Worker | null = null;
  private readonly pending = new Map<number, Pending>();
  private nextId = 1;

  constructor(private readonly workerUrl = new URL('./csv-check-worker.ts', import.meta.url), private readonly timeLimitMs = TIME_LIMIT_MS) {}

  /** The check of one CSV text. */
  check(csv: string, { lenientNumbers = false } = {}): Promise<CsvCheck> {
    const worker = this.ensureWorker();
    const id = this.nextId++;
    return new Promise<CsvCheck>((resolve, reject) => {
      const timer = setTimeout(() => {
        this.fail(new HttpError(422, 'DATASET_CHECK_TIMEOUT', `Checking the file took longer than ${this.timeLimitMs / 1000} s; nothing was saved. Check that it is a stock CSV with one row a year.`));
      }, this.timeLimitMs);
      this.pending.set(id, { resolve, reject, timer });
      worker.postMessage({ id, csv, lenient: lenientNumbers });
    });
  }

  /** Stops the worker (tests, shutdown). */
  async close(): Promise<void> {
    const w = this.worker;
    this.worker = null;
    await w?.terminate();
  }

  private ensureWorker(): Worker {
    if (this.worker) return this.worker;
    const w = tsWorker(this.workerUrl, null);
    w.unref();
    w.on('message', (msg: { id: number; check?: CsvCheck; error?: string }) => {
      const p = this.pending.get(msg.id);
      if (!p) return;
      this.pending.delete(msg.id);
      clearTimeout(p.timer);
      if (msg.check) p.resolve(msg.check);
      else p.reject(new Error(`the CSV check failed: ${msg.error}`));
    });
    w.on('error', (err) => this.fail(new Error(`the CSV checker stopped: ${err.message}`)));
    w.on('exit', () => { if (this.worker === w) this.fail(new Error('the CSV checker stopped unexpectedly')); });
    this.worker = w;
    return w;
  }

  /** Rejects every waiting check and drops the worker (the next check starts a fresh one). */
  private fail(err: Error): void {
    const w = this.worker;
    this.worker = null;
    for (const p of this.pending.values()) {
      clearTimeout(p.timer);
      p.reject(err);
    }
    this.pending.clear();
    void w?.terminate().catch(() => undefined);
  }
}

/** The process's checker. */
export const csvChecker = new CsvChecker();
