import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Express } from 'express';
import { renderAdvisoryPdf } from '../../api/advisories/advisory-pdf';
import { Dataset } from '../../api/datasets/dataset.model';
import type { ReserveDesignFigures } from '../../api/proposals/proposal.schemas';
import { Stock } from '../../api/stocks/stock.model';
import { finished, waitForRun } from './support/runs';
import { signIn, testApp, type SignedIn } from './support/test-app';

/** Text of a PDF via poppler's pdftotext (an independent reader). */
function pdfText(pdf: Buffer): string {
  const path = join(mkdtempSync(join(tmpdir(), 'bm-pdf-')), 'a.pdf');
  writeFileSync(path, pdf);
  return execFileSync('pdftotext', ['-layout', path, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
}

describe('a proposal carrying a reserve design', () => {
  let app: Express;
  let assessor: SignedIn;
  let surplusRun: number;
  let studyRun: number;
  beforeAll(async () => {
    app = await testApp();
    assessor = await signIn(app, 'assessor');
    const stockId = (await Stock.findOne({ where: { code: 'blue-lip-crab' } }))!.id;
    const datasetId = (await Dataset.findOne({ where: { stockId, version: 1 } }))!.id;
    const post = (body: object) => assessor.agent.post('/api/runs').set('x-csrf-token', assessor.csrf).send({ datasetId, ...body }).expect(202);
    surplusRun = (await post({ model: 'schaefer', bootstrap: 100, seed: 4 })).body.run.id;
    studyRun = (await post({
      model: 'reaction-diffusion',
      spatial: { r: 0.4, K: 50, D: 1, fishing: 0.6, habitat: { kind: 'coast', length: 40, cells: 80 }, designs: [{ name: 'Open coast', reserves: [] }, { name: 'Point reserve', reserves: [[15, 25]] }] },
    })).body.run.id;
    expect((await waitForRun(assessor, surplusRun, finished, 120_000)).run.status).toBe('succeeded');
    expect((await waitForRun(assessor, studyRun, finished, 120_000)).run.status).toBe('succeeded');
  });

  const draft = (reserveDesign: object) => assessor.agent.post('/api/proposals').set('x-csrf-token', assessor.csrf)
    .send({ runId: surplusRun, quota: 500, rationale: 'Quota with the Point reserve closed to all gear.', reserveDesign });

  it('freezes the chosen design, its map and figures with the proposal, and keeps them through a quota change', async () => {
    const p = (await draft({ runId: studyRun, index: 1 }).expect(201)).body.proposal;
    const rd = p.figures.reserveDesign;
    expect(rd.name).toBe('Point reserve');
    expect(rd.runId).toBe(studyRun);
    expect(rd.density.length).toBe(80);
    expect(rd.reserve.filter((v: number) => v === 1).length).toBe(20);
    // with F = 0.6 > r = 0.4 outside, 10 km exceeds the critical 2√(D/r)·arctan(√((F − r)/r)) ≈ 2.2 km
    expect(rd.persists).toBeTrue();
    const changed = await assessor.agent.patch(`/api/proposals/${p.id}`).set('x-csrf-token', assessor.csrf).send({ quota: 450 }).expect(200);
    expect(changed.body.proposal.figures.reserveDesign.name).toBe('Point reserve');
  });

  it('refuses a design from a run that is not a reserve study, or a design the run does not have', async () => {
    const wrongRun = await draft({ runId: surplusRun, index: 0 }).expect(422);
    expect(wrongRun.body.error.code).toBe('RUN_NOT_RESERVE_STUDY');
    const noDesign = await draft({ runId: studyRun, index: 4 }).expect(422);
    expect(noDesign.body.error.code).toBe('DESIGN_NOT_FOUND');
  });

  it('prints the design, its legend and its figures in the advisory PDF', async () => {
    const p = (await draft({ runId: studyRun, index: 1 }).expect(201)).body.proposal;
    const rd = p.figures.reserveDesign as ReserveDesignFigures;
    const pdf = await renderAdvisoryPdf({
      docId: 'BM-TEST-0001', stockName: 'Firth blue-lip crab', regionName: 'Inner Firth', unit: 't', publishedAt: new Date(), limit: 500, proposalQuota: 500, override: false, supersedes: null,
      figures: { marginAbs: 100, marginFrac: 0.2, marginLowerAbs: 50, marginLowerFrac: 0.1, hStar: { median: 600, lower5: 550, upper95: 700 }, msy: 600, bOverBmsy: 1, fOverFmsy: 0.8, pPassFold: 0.01, pBelowLimit: 0.02, projectionYears: 10 },
      decision: { reason: 'Approved with the reserve.', votes: { approve: 3, reject: 0, abstain: 0 }, chairName: 'Maren Holt', decidedAt: new Date() },
      fold: { table: [{ h: 0, stable: 1000, unstable: 0, returnRate: 0.4 }, { h: 600, stable: 500, unstable: 500, returnRate: 0 }], hStar: 600, bFold: 500, band: { p5: 550, p95: 700 } },
      catches: [300, 400], projection: { startYear: 2025, median: [900, 880], lower: [800, 790], upper: [1000, 990], limitRef: 200 },
      reserveDesign: rd,
    });
    const text = pdfText(pdf);
    expect(text).toContain('Reserve design: Point reserve');
    expect(text).toContain('t/km');
    expect(text).toContain('The stock persists under this design');
    expect(text).toContain(`${Math.round(rd.yield).toLocaleString('en-GB')} t/yr`);
  });
});
