/** Worker-thread entry: runs one chunk of bootstrap replicates and posts progress and results. */
import { parentPort, workerData } from 'node:worker_threads';
import { runBootstrap, type BootstrapRequest } from './bootstrap';

const req = workerData as BootstrapRequest;
const replicates = runBootstrap(req, (done) => parentPort!.postMessage({ type: 'progress', done }));
parentPort!.postMessage({ type: 'done', replicates });
