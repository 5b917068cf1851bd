/** Starts the real server (api/server.ts) on its own migrated, seeded database for end-to-end tests. */
import { type ChildProcess, spawn } from 'node:child_process';
import { resolve } from 'node:path';
import { loadConfig } from '../../../api/config';
import { createSequelize, demoSeeder, schemaMigrator } from '../../../api/db';

const ROOT = resolve(import.meta.dirname, '..', '..', '..');

export interface RunningServer {
  base: string;
  stop(): Promise<void>;
}

export async function startServer(port: number, dbName: string): Promise<RunningServer> {
  const env = { ...process.env, PORT: String(port), DB_NAME: dbName, CLIENT_DIR: '.data/dist/browser', PUBLIC_URL: `http://127.0.0.1:${port}` };
  const sequelize = createSequelize(loadConfig(env), { withModels: false });
  await sequelize.getQueryInterface().dropAllTables();
  await schemaMigrator(sequelize).up();
  await demoSeeder(sequelize).up();
  await sequelize.close();
  const child: ChildProcess = spawn(process.execPath, ['--import', 'tsx', 'api/server.ts'], { cwd: ROOT, env, stdio: ['ignore', 'ignore', 'inherit'] });
  const base = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + 30_000;
  for (;;) {
    try {
      if ((await fetch(`${base}/api/auth/csrf`)).ok) break;
    } catch { /* not yet listening */ }
    if (Date.now() > deadline) throw new Error('the server did not start');
    await new Promise((r) => setTimeout(r, 100));
  }
  // the Stripe fake delivers its webhooks to this server
  await fetch(`${process.env.STRIPE_API_BASE ?? 'http://127.0.0.1:4322'}/_fake/config`, {
    method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ webhookUrl: `${base}/api/stripe/webhook` }),
  });
  return {
    base,
    stop: async () => {
      const exited = new Promise((r) => child.once('exit', r));
      child.kill('SIGTERM');
      await exited;
    },
  };
}
