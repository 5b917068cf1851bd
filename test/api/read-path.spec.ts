// The read path: lists are pages of summaries (no results blobs, no CSV text); details load one run.
import type { Express } from 'express';
import { Dataset } from '../../api/datasets/dataset.model';
import { ENGINE_VERSION } from '../../api/engine/assessment';
import { Run } from '../../api/runs/run.model';
import { Stock } from '../../api/stocks/stock.model';
import { User } from '../../api/users/user.model';
import { signIn, testApp } from './support/test-app';

describe('list routes', () => {
  let app: Express;
  let stockId: number;
  let runIds: number[];
  beforeAll(async () => {
    app = await testApp();
    const stock = (await Stock.findOne({ where: { code: 'blue-lip-crab' } }))!;
    stockId = stock.id;
    const dataset = (await Dataset.findOne({ where: { stockId }, order: [['version', 'DESC']] }))!;
    const assessor = (await User.findOne({ where: { role: 'assessor' } }))!;
    const results = (i: number) => JSON.stringify({
      kind: 'surplus', fit: { logLik: -20 - i, aic: 44.5 + i, reference: { msy: 1234.5 + i }, status: { bOverBmsy: 0.75, fOverFmsy: 1.25 }, big: Array.from({ length: 3000 }, (_, k) => k) },
      fold: { hStar: 1400 + i }, quota: { proposal: { proposed: 810 + i } },
    });
    const rows = await Run.bulkCreate(Array.from({ length: 3 }, (_, i) => ({
      stockId, datasetId: dataset.id, model: 'schaefer', options: {} as Run['options'], status: 'succeeded' as const, stage: null, engineVersion: ENGINE_VERSION,
      results: results(i), error: null, durationMs: 10, createdBy: assessor.id, startedAt: new Date(), finishedAt: new Date(), progress: 1,
    })));
    runIds = rows.map((r) => r.id);
  });

  it('lists runs as summaries without the results blob, with the stored figures', async () => {
    const { agent } = await signIn(app, 'board');
    const res = await agent.get(`/api/stocks/${stockId}/runs`).expect(200);
    const newest = res.body.runs.find((r: { id: number }) => r.id === runIds[2]);
    expect(newest).toBeDefined();
    expect(newest.results).toBeUndefined();
    // the figures are those inside the stored results of that run (written above)
    expect(newest.msy).toBe(1236.5);
    expect(newest.foldHarvest).toBe(1402);
    expect(newest.proposedQuota).toBe(812);
    expect(newest.aic).toBe(46.5);
    expect(newest.datasetVersion).toBeGreaterThan(0);
    expect(JSON.stringify(res.body)).not.toContain('"big"');
  });

  it('pages the runs list and reports the total', async () => {
    const { agent } = await signIn(app, 'assessor');
    const first = await agent.get(`/api/stocks/${stockId}/runs?limit=2`).expect(200);
    const second = await agent.get(`/api/stocks/${stockId}/runs?limit=2&offset=2`).expect(200);
    expect(first.body.runs.length).toBe(2);
    expect(first.body.page).toEqual({ limit: 2, offset: 0, total: await Run.count({ where: { stockId } }) });
    expect(second.body.runs[0].id).toBeLessThan(first.body.runs[1].id);
    const bad = await agent.get(`/api/stocks/${stockId}/runs?limit=100000`).expect(400);
    expect(bad.body.error.fields.limit).toBeDefined();
    await agent.get(`/api/stocks/${stockId}/runs?offset=-1`).expect(400);
  });

  it('loads one run with its full results on the detail route', async () => {
    const { agent } = await signIn(app, 'assessor');
    const res = await agent.get(`/api/runs/${runIds[0]}`).expect(200);
    expect(res.body.results.fit.reference.msy).toBe(1234.5);
  });

  it('lists dataset versions without their CSV text, a page at a time', async () => {
    const { agent } = await signIn(app, 'assessor');
    const res = await agent.get(`/api/stocks/${stockId}/datasets?limit=1`).expect(200);
    expect(res.body.datasets.length).toBe(1);
    expect(res.body.page.total).toBe(await Dataset.count({ where: { stockId } }));
    expect(res.body.datasets[0].csvText).toBeUndefined();
  });

  it('pages the stock list', async () => {
    const { agent } = await signIn(app, 'admin');
    const res = await agent.get('/api/stocks?limit=1').expect(200);
    expect(res.body.stocks.length).toBe(1);
    expect(res.body.page.total).toBe(await Stock.count());
  });
});
