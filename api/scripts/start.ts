/**
 * npm start: MariaDB and Redis (installed if missing), migrations, demo seed, client build, then the
 * server and the run workers (WORKERS, default 2) as processes of their own.
 */
import { execFileSync, spawn } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '../../seeders/demo-people';
import { loadConfig } from '../config';
import { createSequelize, demoSeeder, schemaMigrator } from '../db';
import { startFakes } from './fakes';
import { ensureDatabase, startMariaDb, stopMariaDb } from './mariadb';
import { DATA, ROOT, profile } from './local-env';
import { startRedis, stopRedis } from './redis';

const demo = profile('demo');
await startMariaDb(demo.server);
await startRedis(demo.redis);
ensureDatabase(demo.server, demo.db);
Object.assign(process.env, demo.env);

const sequelize = createSequelize(loadConfig());
await schemaMigrator(sequelize).up();
await demoSeeder(sequelize).up();
await sequelize.close();

if (!existsSync(join(DATA, 'dist', 'browser', 'index.html')) || process.env.REBUILD_CLIENT === 'true') {
  console.log('Building the client (ng build)…');
  execFileSync(join(ROOT, 'node_modules', '.bin', 'ng'), ['build'], { cwd: ROOT, stdio: 'inherit' });
}

const stopFakes = await startFakes(demo.fakes);
console.log(`SMTP fake on 127.0.0.1:${demo.fakes.smtp} (messages in .data/mail); Stripe fake on 127.0.0.1:${demo.fakes.stripe}`);

const server = spawn(process.execPath, ['--import', 'tsx', join(ROOT, 'api', 'server.ts')], {
  cwd: ROOT, stdio: 'inherit', env: process.env,
});
const workerCount = Math.max(1, Number(process.env.WORKERS ?? 2) || 2);
const workers = Array.from({ length: workerCount }, () => spawn(process.execPath, ['--import', 'tsx', join(ROOT, 'api', 'worker.ts')], {
  cwd: ROOT, stdio: 'inherit', env: process.env,
}));
console.log(`Redis (run queue) on 127.0.0.1:${demo.redis.port} (data in .data/redis); ${workerCount} run worker process(es)`);

console.log('\nDemo sign-ins (password for all: ' + DEMO_PASSWORD + ')');
for (const p of DEMO_PEOPLE) console.log(`  ${p.role.padEnd(9)} ${p.email.padEnd(38)} ${p.name}`);
console.log('');

function stop(): void {
  for (const w of workers) w.kill('SIGTERM');
  server.kill('SIGTERM');
}
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
server.on('exit', async (code) => {
  for (const w of workers) w.kill('SIGTERM');
  await Promise.all(workers.map((w) => (w.exitCode === null && w.signalCode === null ? new Promise((r) => w.once('exit', r)) : null)));
  stopFakes();
  if (process.env.KEEP_DB !== 'true') {
    stopMariaDb(demo.server);
    stopRedis(demo.redis);
  }
  process.exit(code ?? 0);
});
