/** npm start: MariaDB (installed if missing), migrations, demo seed, client build, then the server. */
import { execFileSync, spawn } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '../../seeders/demo-people';
import { loadConfig } from '../config';
import { createSequelize, demoSeeder, schemaMigrator } from '../db';
import { startFakes } from './fakes';
import { ensureDatabase, startMariaDb, stopMariaDb } from './mariadb';
import { DATA, ROOT, profile } from './local-env';

const demo = profile('demo');
await startMariaDb(demo.server);
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

console.log('\nDemo sign-ins (password for all: ' + DEMO_PASSWORD + ')');
for (const p of DEMO_PEOPLE) console.log(`  ${p.role.padEnd(9)} ${p.email.padEnd(38)} ${p.name}`);
console.log('');

function stop(): void {
  server.kill('SIGTERM');
}
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
server.on('exit', (code) => {
  stopFakes();
  if (process.env.KEEP_DB !== 'true') stopMariaDb(demo.server);
  process.exit(code ?? 0);
});
