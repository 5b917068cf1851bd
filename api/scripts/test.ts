/**
 * npm test: installs what the tests need (MariaDB, Redis, Chromium, poppler), starts a private test
 * database and an empty test Redis (the run queue), runs the server specs (jasmine + supertest) and the client specs (Karma in headless
 * Chromium), and ends with one line "total: N passed, N failed, N skipped". Exits non-zero on any
 * failure and on any skipped spec (xit, xdescribe, pending, or the rest of a focused run).
 */
import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { ensureDebianPackages } from './debian';
import { startFakes } from './fakes';
import { ensureDatabase, startMariaDb, stopMariaDb } from './mariadb';
import { DATA, ROOT, profile } from './local-env';
import { startRedis, stopRedis } from './redis';

interface Totals { passed: number; failed: number; skipped?: number; error?: boolean }

const only = process.argv.find((a) => a.startsWith('--only='))?.slice('--only='.length);
/** With --only=api, spec files named after `--` narrow the run: `npm run test:api -- test/api/board.spec.ts`. */
const specFiles = only === 'api' ? process.argv.slice(2).filter((a) => a.endsWith('.spec.ts')) : [];
const results: { name: string; totals: Totals; exit: number }[] = [];

function readTotals(file: string): Totals {
  if (!existsSync(file)) return { passed: 0, failed: 0, skipped: 0, error: true };
  return JSON.parse(readFileSync(file, 'utf8')) as Totals;
}

function run(name: string, cmd: string, args: string[], env: NodeJS.ProcessEnv, totalsFile: string): void {
  rmSync(totalsFile, { force: true });
  console.log(`\n=== ${name} ===`);
  const started = Date.now();
  const r = spawnSync(cmd, args, { cwd: ROOT, env, stdio: 'inherit' });
  const totals = readTotals(totalsFile);
  console.log(`${name}: ${totals.passed} passed, ${totals.failed} failed, ${totals.skipped ?? 0} skipped (${((Date.now() - started) / 1000).toFixed(1)} s)`);
  results.push({ name, totals, exit: r.status ?? 1 });
}

ensureDebianPackages([
  { command: 'mariadbd', path: '/usr/sbin/mariadbd', pkg: 'mariadb-server' },
  { command: 'redis-server', path: '/usr/bin/redis-server', pkg: 'redis-server' },
  { command: 'chromium', path: '/usr/bin/chromium', pkg: 'chromium' },
  { command: 'pdftoppm', path: '/usr/bin/pdftoppm', pkg: 'poppler-utils' },
]);

const test = profile('test');
const env: NodeJS.ProcessEnv = { ...process.env, ...test.env, CHROME_BIN: '/usr/bin/chromium', SCRATCH_DB_NAME: 'brinkmark_scratch' };

/** A step that must exit 0 but counts no specs (the type checks). */
function check(name: string, cmd: string, args: string[]): void {
  console.log(`\n=== ${name} ===`);
  const r = spawnSync(cmd, args, { cwd: ROOT, env, stdio: 'inherit' });
  console.log(`${name}: ${r.status === 0 ? 'clean' : 'FAILED'}`);
  results.push({ name, totals: { passed: 0, failed: 0 }, exit: r.status ?? 1 });
}

let stopFakes = () => {};
try {
  stopFakes = await startFakes(test.fakes, { fresh: true });
  if (only !== 'client') await startRedis(test.redis, { fresh: true });
  if (!only) {
    const tsc = join(ROOT, 'node_modules', '.bin', 'tsc');
    check('type check (server and engine)', tsc, ['-p', 'tsconfig.api.json', '--noEmit']);
    check('type check (client)', tsc, ['-p', 'tsconfig.app.json', '--noEmit']);
  }
  if (!only || only === 'api') {
    await startMariaDb(test.server);
    ensureDatabase(test.server, test.db, true);
    ensureDatabase(test.server, { ...test.db, name: 'brinkmark_scratch' }, true);
    run('server specs', process.execPath,
      ['--import', 'tsx', join(ROOT, 'node_modules', 'jasmine', 'bin', 'jasmine.js'), '--config=test/jasmine.json', ...specFiles],
      env, join(DATA, 'jasmine-result.json'));
  }
  if (!only || only === 'e2e') {
    check('client build (for end-to-end)', join(ROOT, 'node_modules', '.bin', 'ng'), ['build']);
    if (only === 'e2e') {
      await startMariaDb(test.server);
      ensureDatabase(test.server, { ...test.db, name: 'brinkmark_scratch' }, true);
    }
    run('end-to-end (Chromium)', process.execPath,
      ['--import', 'tsx', join(ROOT, 'node_modules', 'jasmine', 'bin', 'jasmine.js'), '--config=test/jasmine-e2e.json'],
      { ...env, JASMINE_RESULT_FILE: 'e2e-result.json' }, join(DATA, 'e2e-result.json'));
  }
  if (only !== 'api' && only !== 'e2e') {
    run('client specs', join(ROOT, 'node_modules', '.bin', 'ng'), ['test', '--watch=false'], env, join(DATA, 'karma-result.json'));
  }
} finally {
  stopFakes();
  stopMariaDb(test.server);
  stopRedis(test.redis);
}

const passed = results.reduce((s, r) => s + r.totals.passed, 0);
const failed = results.reduce((s, r) => s + r.totals.failed, 0);
const skipped = results.reduce((s, r) => s + (r.totals.skipped ?? 0), 0);
const broken = results.filter((r) => r.exit !== 0 || r.totals.error).map((r) => r.name);
if (broken.length) console.log(`\nRunners that did not finish cleanly: ${broken.join(', ')}`);
if (skipped) console.log('\nSkipped or focused specs fail the run: remove xit/xdescribe/fit/fdescribe/pending().');
console.log(`\ntotal: ${passed} passed, ${failed} failed, ${skipped} skipped`);
process.exit(failed > 0 || skipped > 0 || broken.length > 0 || passed === 0 ? 1 : 0);
