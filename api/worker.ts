/**
 * A run worker process (`npm run worker`): takes model runs from the shared queue and computes them
 * in worker threads. Start any number, on any machine that reaches the same MariaDB and Redis.
 */
import { loadConfig } from './config';
import { createSequelize } from './db';
import { RunWorker } from './runs/run-processor';

const config = loadConfig();
const sequelize = createSequelize(config);
await sequelize.authenticate();
const worker = new RunWorker(config);
await worker.ready();
console.log(`Run worker ${worker.name} is taking runs from ${config.RUN_QUEUE} (concurrency ${config.WORKER_CONCURRENCY}).`);

let stopping = false;
async function shutdown(): Promise<void> {
  if (stopping) return;
  stopping = true;
  // a run still being computed after 10 s is left to the stall check, which hands it to another worker
  await Promise.race([worker.close(), new Promise((r) => setTimeout(r, 10_000))]);
  await sequelize.close();
  process.exit(0);
}
process.on('SIGINT', () => void shutdown());
process.on('SIGTERM', () => void shutdown());
