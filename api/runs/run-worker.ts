/** Worker-thread entry for one run: computes, posts progress, then the results (or the error). */
import { parentPort, workerData } from 'node:worker_threads';
import type { StockSeries } from '../engine/data/series';
import { computeRun } from './run-compute';
import type { RunOptions } from './run.schemas';

const { series, model, options } = workerData as { series: StockSeries; model: string; options: RunOptions };
computeRun(series, model, options, (fraction, stage) => parentPort!.postMessage({ type: 'progress', fraction, stage }))
  .then((results) => parentPort!.postMessage({ type: 'done', results }))
  .catch((err: Error) => parentPort!.postMessage({ type: 'failed', message: err.message }));
