/**
 * npm run bench:load: the read path under load. Starts a private database with the demo data and 115
 * stored runs (each with a results blob of about 20 kB), the real server and a bare Express route,
 * then drives each with autocannon at 200 connections on 127.0.0.1 for a bounded time. Goal: every
 * list route at ≥ 25% of the bare route's requests per second, p99 under 1 s, no errors.
 */
import { type ChildProcess, spawn } from 'node:child_process';
import { join } from 'node:path';
import autocannon from 'autocannon';
import { QueryTypes } from 'sequelize';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '../../seeders/demo-people';
import { loadConfig } from '../config';
import { createSequelize, demoSeeder, schemaMigrator } from '../db';
import { ENGINE_VERSION } from '../engine/assessment';
import { Run } from '../runs/run.model';
import { ensureDatabase, startMariaDb, stopMariaDb } from './mariadb';
import { ROOT, TEST_PORT_BASE, profile } from './local-env';

const CONNECTIONS = 200;
const SECONDS = Number(process.env.BENCH_LOAD_SECONDS ?? 10);
const GOAL_SHARE = 0.25;
const GOAL_P99_MS = 1000;
const APP_PORT = TEST_PORT_BASE + 8;
const BARE_PORT = TEST_PORT_BASE + 9;

function filler(n: number): number[] {
  return Array.from({ length: n }, (_, i) => Math.round(Math.sin(i) * 1e6) / 1e3);
}

async function seedRuns(config: ReturnType<typeof loadConfig>): Promise<number> {
  const sequelize = createSequelize(config);
  await schemaMigrator(sequelize).up();
  await demoSeeder(sequelize).up();
  const [stock] = await sequelize.query<{ id: number }>("SELECT id FROM stocks WHERE kind = 'single' ORDER BY id LIMIT 1", { type: QueryTypes.SELECT });
  const [user] = await sequelize.query<{ id: number }>("SELECT id FROM users WHERE role = 'assessor' ORDER BY id LIMIT 1", { type: QueryTypes.SELECT });
  const dataset = await sequelize.query<{ id: number }>('INSERT INTO datasets (stock_id, version, note, kind, csv_text, first_year, last_year, index_names, created_by, created_at) VALUES (?, 1000, ?, ?, ?, 1990, 2024, ?, ?, NOW()) RETURNING id',
    { replacements: [stock!.id, 'load test', 'single', 'year,catch,survey\n', JSON.stringify(['survey']), user!.id], type: QueryTypes.SELECT });
  const results = (i: number) => JSON.stringify({
    kind: 'surplus',
    fit: { logLik: -10 - i, aic: 30 + i, reference: { msy: 1000 + i }, status: { bOverBmsy: 0.8, fOverFmsy: 1.1 }, paths: filler(1200) },
    fold: { hStar: 1500 + i }, quota: { proposal: { proposed: 900 + i } }, bootstrap: filler(800),
  });
  await Run.bulkCreate(Array.from({ length: 115 }, (_, i) => ({
    stockId: stock!.id, datasetId: dataset[0]!.id, model: 'schaefer', options: {} as Run['options'], status: 'succeeded' as const, stage: null, engineVersion: ENGINE_VERSION,
    results: results(i), error: null, durationMs: 1000, createdBy: user!.id, startedAt: new Date(), finishedAt: new Date(), progress: 1,
  })));
  await sequelize.close();
  return stock!.id;
}

function launch(args: string[], env: NodeJS.ProcessEnv): ChildProcess {
  return spawn(process.execPath, ['--import', 'tsx', ...args], { cwd: ROOT, env, stdio: ['ignore', 'ignore', 'inherit'] });
}

async function waitFor(url: string): Promise<void> {
  const deadline = Date.now() + 60_000;
  for (;;) {
    try {
      if ((await fetch(url)).status < 500) return;
    } catch { /* not yet */ }
    if (Date.now() > deadline) throw new Error(`${url} did not answer`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

async function signInCookie(base: string): Promise<string> {
  const token = await fetch(`${base}/api/auth/csrf`);
  const { csrfToken } = await token.json() as { csrfToken: string };
  const csrfCookie = token.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
  const res = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST', headers: { 'content-type': 'application/json', 'x-csrf-token': csrfToken, cookie: csrfCookie },
    body: JSON.stringify({ email: DEMO_PEOPLE.find((p) => p.role === 'assessor')!.email, password: DEMO_PASSWORD }),
  });
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status}`);
  return res.headers.getSetCookie().find((c) => c.startsWith('brinkmark.sid='))!.split(';')[0]!;
}

interface Row { name: string; rps: number; p50: number; p99: number; errors: number; non2xx: number }

async function hammer(name: string, url: string, headers: Record<string, string> = {}): Promise<Row> {
  const r = await autocannon({ url, connections: CONNECTIONS, duration: SECONDS, headers });
  return { name, rps: r.requests.average, p50: r.latency.p50, p99: r.latency.p99, errors: r.errors + r.timeouts, non2xx: r.non2xx };
}

const test = profile('test');
const db = { ...test.db, name: 'brinkmark_bench' };
const env: NodeJS.ProcessEnv = { ...process.env, ...test.env, DB_NAME: db.name, PORT: String(APP_PORT), PUBLIC_URL: `http://127.0.0.1:${APP_PORT}`, CLIENT_DIR: '.data/no-client', NODE_ENV: 'test' };
const children: ChildProcess[] = [];
let failed = false;
try {
  await startMariaDb(test.server);
  ensureDatabase(test.server, db, true);
  const stockId = await seedRuns(loadConfig(env));
  children.push(launch([join('api', 'server.ts')], env), launch([join('api', 'scripts', 'bare-express.ts'), String(BARE_PORT)], env));
  const base = `http://127.0.0.1:${APP_PORT}`;
  await waitFor(`${base}/api/health`);
  await waitFor(`http://127.0.0.1:${BARE_PORT}/bare`);
  const cookie = await signInCookie(base);
  console.log(`autocannon: ${CONNECTIONS} connections, ${SECONDS} s per route, 127.0.0.1 only`);
  const rows = [await hammer('bare Express route', `http://127.0.0.1:${BARE_PORT}/bare`)];
  rows.push(await hammer('GET /api/stocks', `${base}/api/stocks`, { cookie }));
  rows.push(await hammer(`GET /api/stocks/${stockId}/runs (115 runs)`, `${base}/api/stocks/${stockId}/runs`, { cookie }));
  const bare = rows[0]!.rps;
  console.log('\nroute                                 req/s   share   p50 ms   p99 ms  errors  non-2xx');
  for (const r of rows) {
    const share = r.rps / bare;
    const ok = r === rows[0] || (share >= GOAL_SHARE && r.p99 < GOAL_P99_MS && r.errors === 0 && r.non2xx === 0);
    if (!ok) failed = true;
    console.log(`${r.name.padEnd(36)} ${r.rps.toFixed(0).padStart(6)} ${(share * 100).toFixed(0).padStart(6)}% ${String(r.p50).padStart(8)} ${String(r.p99).padStart(8)} ${String(r.errors).padStart(7)} ${String(r.non2xx).padStart(8)}  ${ok ? '' : 'BELOW GOAL'}`);
  }
  console.log(`\ngoal: ≥ ${GOAL_SHARE * 100}% of the bare route, p99 < ${GOAL_P99_MS} ms, no errors: ${failed ? 'NOT MET' : 'met'}`);
} finally {
  for (const c of children) c.kill('SIGTERM');
  await new Promise((r) => setTimeout(r, 500));
  stopMariaDb(test.server);
}
process.exit(failed ? 1 : 0);
