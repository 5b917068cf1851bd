/** Starts a worker thread on a TypeScript module (Node 20 workers ignore `--import tsx`, so each registers tsx itself). */
import { Worker } from 'node:worker_threads';

export function tsWorker(moduleUrl: URL, workerData: unknown): Worker {
  const boot = `import('tsx/esm/api').then(({ register }) => { register(); return import(${JSON.stringify(moduleUrl.href)}); })`;
  return new Worker(boot, { eval: true, workerData });
}
