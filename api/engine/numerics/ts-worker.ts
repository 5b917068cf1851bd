/** Starts a worker thread on a TypeScript module (Node 20 workers ignore `--import tsx`, so each registers tsx itself). */
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';

export function tsWorker(moduleUrl: URL, workerData: unknown): Worker {
  // inside the compiled command line (npm run build:cli) the worker is a bundled .mjs beside it: no tsx needed
  const compiled = new URL(moduleUrl.href.replace(/\.ts$/, '.mjs'));
  if (compiled.href !== moduleUrl.href && existsSync(fileURLToPath(compiled))) return new Worker(compiled, { workerData });
  const boot = `import('tsx/esm/api').then(({ register }) => { register(); return import(${JSON.stringify(moduleUrl.href)}); })`;
  return new Worker(boot, { eval: true, workerData });
}
