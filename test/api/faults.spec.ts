// MariaDB killed (SIGKILL) under a live server process, during a run and during a board decision: the
// process stays up and answers 503 meanwhile, recovers by itself when MariaDB is back, and leaves no
// half-written decision and no run stuck 'running'.
import { readFileSync } from 'node:fs';
import { createConnection } from 'node:net';
import { join } from 'node:path';
import type { Express } from 'express';
import { Advisory } from '../../api/advisories/advisory.model';
import { Decision } from '../../api/board/board.models';
import { Dataset } from '../../api/datasets/dataset.model';
import { Run } from '../../api/runs/run.model';
import { profile } from '../../api/scripts/local-env';
import { startMariaDb } from '../../api/scripts/mariadb';
import { Stock } from '../../api/stocks/stock.model';
import { spawnServer, spawnWorker, type RunningServer } from '../support/server-process';
import { submittedProposal } from './support/decided';
import { finished, waitForRun } from './support/runs';
import { signIn, testDb, type SignedIn } from './support/test-app';

const PORT = Number(process.env.TEST_PORT_BASE ?? 4390) + 4;
const db = profile('test').server;

function dbListening(): Promise<boolean> {
  return new Promise((resolve) => {
    const s = createConnection({ host: '127.0.0.1', port: db.port }, () => { s.end(); resolve(true); });
    s.on('error', () => resolve(false));
  });
}

async function until(what: string, check: () => Promise<boolean>, timeoutMs = 60_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

async function killDatabase(): Promise<void> {
  process.kill(Number(readFileSync(join(db.datadir, 'mysqld.pid'), 'utf8').trim()), 'SIGKILL');
  await until('MariaDB to be gone', async () => !(await dbListening()));
}

async function restartDatabase(base: string): Promise<void> {
  await startMariaDb(db);
  await until('the server to report the database up', async () => (await fetch(`${base}/api/health`)).status === 200);
}

describe('database outage under a live server', () => {
  let server: RunningServer;
  let worker: Awaited<ReturnType<typeof spawnWorker>>;
  let base: string;
  beforeAll(async () => {
    await testDb();
    server = await spawnServer(PORT, { CLIENT_DIR: '.data/no-client' });
    worker = await spawnWorker();
    base = server.base;
  });
  afterAll(async () => {
    if (!(await dbListening())) await startMariaDb(db);
    await worker.stop();
    await server.stop();
  });

  const at = () => base as unknown as Express;

  it('answers 503 during a run, recovers when MariaDB returns, and the run does not stay running', async () => {
    const assessor = await signIn(at(), 'assessor');
    const stock = (await Stock.findOne({ where: { code: 'blue-lip-crab' } }))!;
    const datasetId = (await Dataset.findOne({ where: { stockId: stock.id, version: 1 } }))!.id;
    const start = await assessor.agent.post('/api/runs').set('x-csrf-token', assessor.csrf).send({ datasetId, model: 'schaefer', bootstrap: 400, seed: 3 }).expect(202);
    const id = start.body.run.id as number;
    await waitForRun(assessor, id, (r) => r.status === 'running' || finished(r));

    await killDatabase();
    const health = await fetch(`${base}/api/health`);
    expect(health.status).toBe(503);
    expect(((await health.json()) as { checks: { database: { status: string } } }).checks.database.status).toBe('down');
    const list = await assessor.agent.get('/api/stocks');
    expect(list.status).toBe(503);
    expect(list.body.error.code).toBe('DATABASE_UNAVAILABLE');

    await restartDatabase(base);
    // the same process answers: it never exited
    await assessor.agent.get('/api/stocks').expect(200);
    const done = await waitForRun(assessor, id, finished, 180_000);
    expect(['succeeded', 'failed']).toContain(done.run.status);
    expect(await Run.count({ where: { id, status: ['running', 'queued'] } })).toBe(0);
  });

  it('answers a decision cut off by the outage with 503 and no half-written rows, and takes it once MariaDB is back', async () => {
    const assessor = await signIn(at(), 'assessor');
    const chair = await signIn(at(), 'board');
    const member = async (email: string): Promise<SignedIn> => signIn(at(), { email, password: (await import('../../seeders/demo-people')).DEMO_PASSWORD });
    const { proposalId } = await submittedProposal(assessor, 'silver-smelt');
    for (const m of [await member('odhran.pike@corran-firth.example'), await member('ana.lusk@corran-firth.example')]) {
      await m.agent.post(`/api/proposals/${proposalId}/board/votes`).set('x-csrf-token', m.csrf).send({ choice: 'approve', reason: 'I approve: figures checked.' }).expect(201);
    }
    const decide = () => chair.agent.post(`/api/proposals/${proposalId}/board/decision`).set('x-csrf-token', chair.csrf).send({ outcome: 'approved', reason: 'The board weighed the margin to the fold.' });

    // the decision and the kill race: either it committed whole, or nothing of it is stored
    const [cut] = await Promise.all([decide(), killDatabase()]);
    expect([201, 503]).toContain(cut.status);
    await restartDatabase(base);
    const decisions = await Decision.count({ where: { proposalId } });
    const advisoriesOf = async () => Advisory.count({ where: { decisionId: (await Decision.findAll({ where: { proposalId }, attributes: ['id'] })).map((d) => d.id) } });
    const advisories = await advisoriesOf();
    expect(decisions).toBe(cut.status === 201 ? 1 : 0);
    expect(advisories).toBe(decisions);

    if (cut.status === 503) await decide().expect(201);
    expect(await Decision.count({ where: { proposalId } })).toBe(1);
    expect(await advisoriesOf()).toBe(1);
  });
});
