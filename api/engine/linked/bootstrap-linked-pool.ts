/** Runs a predator-prey bootstrap across worker threads, with progress and cancellation through an AbortSignal. */
import type { Worker } from 'node:worker_threads';
import { tsWorker } from '../numerics/ts-worker';
import { BootstrapCancelled, type PoolOptions } from '../uncertainty/bootstrap-pool';
import type { LinkedBootstrapRequest, LinkedReplicate } from './bootstrap-linked';

/** Splits the replicates over workers and gathers them in replicate order (the same replicates as one thread). */
export function linkedBootstrapInWorkers(req: LinkedBootstrapRequest, opts: PoolOptions = {}): Promise<LinkedReplicate[]> {
  const n = Math.max(1, Math.min(opts.workers ?? 2, req.replicates));
  const sizes = Array.from({ length: n }, (_, i) => Math.floor(req.replicates / n) + (i < req.replicates % n ? 1 : 0));
  const done = new Array<number>(n).fill(0);
  const results = new Array<LinkedReplicate[]>(n);
  const workers: Worker[] = [];
  return new Promise((resolve, reject) => {
    let finished = 0;
    let settled = false;
    const fail = (err: Error) => {
      if (settled) return;
      settled = true;
      for (const w of workers) void w.terminate();
      reject(err);
    };
    if (opts.signal?.aborted) return fail(new BootstrapCancelled());
    opts.signal?.addEventListener('abort', () => fail(new BootstrapCancelled()), { once: true });
    let offset = req.offset ?? 0;
    sizes.forEach((size, i) => {
      const worker = tsWorker(new URL('./bootstrap-linked-worker.ts', import.meta.url), { ...req, replicates: size, offset });
      offset += size;
      workers.push(worker);
      worker.on('message', (msg: { type: 'progress'; done: number } | { type: 'done'; replicates: LinkedReplicate[] }) => {
        if (msg.type === 'progress') {
          done[i] = msg.done;
          opts.onProgress?.(done.reduce((s, v) => s + v, 0), req.replicates);
          return;
        }
        results[i] = msg.replicates;
        if (++finished === n && !settled) {
          settled = true;
          resolve(results.flat());
        }
      });
      worker.on('error', fail);
      worker.on('exit', (code) => { if (code !== 0) fail(new Error(`bootstrap worker exited with code ${code}`)); });
    });
  });
}
