/** Worker-thread entry: one chunk of predator-prey bootstrap replicates, posting progress and results. */
import { parentPort, workerData } from 'node:worker_threads';
import { runLinkedBootstrap, type LinkedBootstrapRequest } from './bootstrap-linked';

const req = workerData as LinkedBootstrapRequest;
const replicates = runLinkedBootstrap(req, (done) => parentPort!.postMessage({ type: 'progress', done }));
parentPort!.postMessage({ type: 'done', replicates });
