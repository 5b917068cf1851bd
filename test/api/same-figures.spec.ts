import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import type { Express } from 'express';
import { Dataset } from '../../api/datasets/dataset.model';
import { Stock } from '../../api/stocks/stock.model';
import { finished, waitForRun } from './support/runs';
import { signIn, testApp, type SignedIn } from './support/test-app';

const ROOT = resolve(import.meta.dirname, '..', '..');

interface Projection { catchLevel: number; median: number[]; lower: number[]; upper: number[]; pBelowLimit: number; pPassFold: number; pCrossThreshold: number }

// One seed stream and one replicate set per run: the run's table, a proposal (for a catch in the
// table and one that is not), and the command line given the same data, seed and replicates must
// print the same figures for the same catch, to the last digit.
describe('one set of figures for a catch', () => {
  let app: Express;
  let assessor: SignedIn;
  let runId: number;
  let candidates: Projection[];
  let csvFile: string;
  beforeAll(async () => {
    app = await testApp();
    assessor = await signIn(app, 'assessor');
    const stockId = (await Stock.findOne({ where: { code: 'red-grouse' } }))!.id;
    const dataset = (await Dataset.findOne({ where: { stockId, version: 1 } }))!;
    csvFile = join(mkdtempSync(join(tmpdir(), 'brinkmark-figures-')), 'red-grouse.csv');
    writeFileSync(csvFile, dataset.csvText);
    const start = await assessor.agent.post('/api/runs').set('x-csrf-token', assessor.csrf)
      .send({ datasetId: dataset.id, model: 'schaefer', bootstrap: 120, seed: 7, diagnostics: false }).expect(202);
    const done = await waitForRun(assessor, start.body.run.id, finished, 120_000);
    expect(done.run.status).toBe('succeeded');
    runId = start.body.run.id;
    candidates = (done.results as { quota: { candidates: Projection[] } }).quota.candidates;
  });

  function draft(quota: number) {
    return assessor.agent.post('/api/proposals').set('x-csrf-token', assessor.csrf)
      .send({ runId, quota, rationale: 'Same catch, same figures on every screen and in the advisory.' }).expect(201);
  }

  it('gives a proposal at a catch of the run table the table\'s figures exactly', async () => {
    const row = candidates[1]!;
    const p = (await draft(row.catchLevel)).body.proposal;
    const last = row.median.length - 1;
    expect(p.figures.atQuota.medianEnd).toBe(row.median[last]);
    expect(p.figures.atQuota.lowerEnd).toBe(row.lower[last]);
    expect(p.figures.atQuota.upperEnd).toBe(row.upper[last]);
    expect(p.figures.atQuota.pBelowLimit).toBe(row.pBelowLimit);
    expect(p.figures.atQuota.pCrossThreshold).toBe(row.pCrossThreshold);
  });

  it('computes a catch not in the table from the same replicates: the same figures on a second proposal and on the command line', async () => {
    const level = candidates[1]!.catchLevel + 37;
    const a = (await draft(level)).body.proposal.figures.atQuota;
    const b = (await draft(level)).body.proposal.figures.atQuota;
    expect(b).toEqual(a);
    const cli = spawnSync(process.execPath, ['--import', 'tsx', 'api/engine/cli/cli.ts', 'quota', '--model', 'schaefer', '--input', csvFile,
      '--replicates', '120', '--seed', '7', '--candidates', String(level), '--workers', '2'], { cwd: ROOT, encoding: 'utf8' });
    expect(cli.status).withContext(cli.stderr).toBe(0);
    const row = (JSON.parse(cli.stdout) as { candidates: Projection[] }).candidates.find((c) => c.catchLevel === level)!;
    const last = row.median.length - 1;
    expect(row.median[last]).toBe(a.medianEnd);
    expect(row.lower[last]).toBe(a.lowerEnd);
    expect(row.pBelowLimit).toBe(a.pBelowLimit);
    // and the command line's table row for the run's own catch is the run's row
    const own = spawnSync(process.execPath, ['--import', 'tsx', 'api/engine/cli/cli.ts', 'quota', '--model', 'schaefer', '--input', csvFile,
      '--replicates', '120', '--seed', '7', '--candidates', String(candidates[1]!.catchLevel), '--workers', '2'], { cwd: ROOT, encoding: 'utf8' });
    const ownRow = (JSON.parse(own.stdout) as { candidates: Projection[] }).candidates.find((c) => c.catchLevel === candidates[1]!.catchLevel)!;
    expect(ownRow.median).toEqual(candidates[1]!.median);
  });
});
