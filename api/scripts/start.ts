/**
 * npm start: MariaDB and Redis (installed if missing), migrations, demo seed, client build, then the
 * server and the run workers (WORKERS, default 2) as processes of their own.
 */
import { execFileSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '../../seeders/demo-people';
import { loadConfig } from '../config';
import { createSequelize, demoSeeder, schemaMigrator } from '../db';
import { startFakes } from './fakes';
import { Supervisor } from './supervisor';
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

const workerCount = Math.max(1, Number(process.env.WORKERS ?? 2) || 2);
// the server and each run worker are restarted if they die; /api/health reports what they depend on
const supervisor = new Supervisor(ROOT, process.env);
supervisor.supervise({ name: 'server', args: ['--import', 'tsx', join(ROOT, 'api', 'server.ts')] });
for (let i = 1; i <= workerCount; i++) supervisor.supervise({ name: `run worker ${i}`, args: ['--import', 'tsx', join(ROOT, 'api', 'worker.ts')] });
console.log(`Redis (run queue) on 127.0.0.1:${demo.redis.port} (data in .data/redis); ${workerCount} run worker process(es)`);

console.log('\nDemo sign-ins (password for all: ' + DEMO_PASSWORD + ')');
for (const p of DEMO_PEOPLE) console.log(`  ${p.role.padEnd(9)} ${p.email.padEnd(38)} ${p.name}`);
console.log('');

async function stop(): Promise<void> {
  await supervisor.stop();
  stopFakes();
  if (process.env.KEEP_DB !== 'true') {
    stopMariaDb(demo.server);
    stopRedis(demo.redis);
  }
  process.exit(0);
}
process.on('SIGINT', () => void stop());
process.on('SIGTERM', () => void stop());
