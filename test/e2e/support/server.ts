/** Starts the real server on its own migrated, seeded database for end-to-end tests. */
import { loadConfig } from '../../../api/config';
import { createSequelize, demoSeeder, schemaMigrator } from '../../../api/db';
import { spawnServer, spawnWorker, type RunningServer } from '../../support/server-process';

export type { RunningServer };

export async function startServer(port: number, dbName: string): Promise<RunningServer> {
  const env = { RUN_QUEUE: `e2e-${port}`, DB_NAME: dbName, CLIENT_DIR: '.data/dist/browser', PUBLIC_URL: `http://127.0.0.1:${port}` };
  const sequelize = createSequelize(loadConfig({ ...process.env, ...env }), { withModels: false });
  await sequelize.getQueryInterface().dropAllTables();
  await schemaMigrator(sequelize).up();
  await demoSeeder(sequelize).up();
  await sequelize.close();
  const server = await spawnServer(port, env);
  const worker = await spawnWorker(env);
  // the Stripe fake delivers its webhooks to this server
  await fetch(`${process.env.STRIPE_API_BASE ?? 'http://127.0.0.1:4322'}/_fake/config`, {
    method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ webhookUrl: `${server.base}/api/stripe/webhook` }),
  });
  return { base: server.base, stop: async () => { await Promise.all([server.stop(), worker.stop()]); } };
}
