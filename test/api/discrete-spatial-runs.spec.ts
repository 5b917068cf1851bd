import type { Express } from 'express';
import { Dataset } from '../../api/datasets/dataset.model';
import { Stock } from '../../api/stocks/stock.model';
import { finished, waitForRun } from './support/runs';
import { signIn, testApp } from './support/test-app';

describe('stock-recruitment and reserve runs', () => {
  let app: Express;
  let eelData: number;
  let crabData: number;
  beforeAll(async () => {
    app = await testApp();
    const eel = (await Stock.findOne({ where: { code: 'skerry-sand-eel' } }))!;
    eelData = (await Dataset.findOne({ where: { stockId: eel.id, version: 1 } }))!.id;
    const crab = (await Stock.findOne({ where: { code: 'blue-lip-crab' } }))!;
    crabData = (await Dataset.findOne({ where: { stockId: crab.id, version: 1 } }))!.id;
  });

  it('fits Ricker to the seeded spawner/recruit series and puts the first doubling at u = 1 − e^(2 − r)', async () => {
    const who = await signIn(app, 'assessor');
    const start = await who.agent.post('/api/runs').set('x-csrf-token', who.csrf).send({ datasetId: eelData, model: 'ricker', bootstrap: 60, seed: 5 }).expect(202);
    const done = await waitForRun(who, start.body.run.id, finished);
    expect(done.run.status).toBe('succeeded');
    const r = done.results as { kind: string; fit: { params: { r: number; K: number } }; harvestCascade: { doublings: number[] }; proposal: { rate: number; band: [number, number] } };
    expect(r.kind).toBe('discrete');
    // seeded truth r = 2.6, K = 5000 (seeders/stock-recruit-series.ts)
    expect(Math.abs(r.fit.params.r - 2.6)).toBeLessThan(0.3);
    expect(Math.abs(r.fit.params.K / 5000 - 1)).toBeLessThan(0.1);
    // first doubling where r + ln(1 − u) = 2 (May 1976, via the escapement map)
    expect(r.harvestCascade.doublings[0]).toBeCloseTo(1 - Math.exp(2 - r.fit.params.r), 8);
    expect(r.proposal.band[0]).toBeLessThanOrEqual(r.proposal.band[1]);
  });

  it('refuses Ricker on a survey-index dataset and Schaefer on spawners and recruits', async () => {
    const who = await signIn(app, 'assessor');
    const a = await who.agent.post('/api/runs').set('x-csrf-token', who.csrf).send({ datasetId: crabData, model: 'ricker' }).expect(422);
    expect(a.body.error.code).toBe('MODEL_DATA_MISMATCH');
    const b = await who.agent.post('/api/runs').set('x-csrf-token', who.csrf).send({ datasetId: eelData, model: 'schaefer' }).expect(422);
    expect(b.body.error.code).toBe('MODEL_DATA_MISMATCH');
  });

  it('compares two coast reserve designs and reports persistence, yield and spillover for each', async () => {
    const who = await signIn(app, 'assessor');
    const spatial = {
      r: 0.5, K: 100, D: 2, fishing: 0.8, habitat: { kind: 'coast', length: 60, cells: 120 },
      designs: [{ name: 'One 10 km', reserves: [[25, 35]] }, { name: 'Too small', reserves: [[29, 31]] }],
    };
    const start = await who.agent.post('/api/runs').set('x-csrf-token', who.csrf).send({ datasetId: crabData, model: 'reaction-diffusion', spatial }).expect(202);
    const done = await waitForRun(who, start.body.run.id, finished, 120_000);
    expect(done.run.status).toBe('succeeded');
    const r = done.results as { kind: string; designs: { name: string; persists: boolean; yield: number; spillover: number; density: number[] }[] };
    expect(r.kind).toBe('spatial');
    const [big, small] = r.designs;
    // critical length with F = 0.8 > r outside: 2√(D/r)·arctan(√((F − r)/r)) = 2.55 km, so 10 km persists;
    // 2 km lies below it (linearised problem matched at the reserve edge)
    expect(big!.persists).toBeTrue();
    expect(big!.yield).toBeGreaterThan(0);
    expect(big!.spillover).toBeGreaterThan(0);
    expect(big!.density.length).toBe(120);
    expect(small!.persists).toBeFalse();
  });

  it('refuses a grid design whose mask has a bad cell, naming the line and cell, and starts nothing', async () => {
    const who = await signIn(app, 'assessor');
    const before = await who.agent.get(`/api/stocks/${(await Dataset.findByPk(crabData))!.stockId}/runs`).expect(200);
    const spatial = { r: 0.5, K: 100, D: 2, fishing: 0.8, habitat: { kind: 'grid', cellKm: 1 }, designs: [{ name: 'Bank', maskCsv: '0,1,1\n1,2,7\n' }] };
    const res = await who.agent.post('/api/runs').set('x-csrf-token', who.csrf).send({ datasetId: crabData, model: 'reaction-diffusion', spatial }).expect(422);
    expect(res.body.error.code).toBe('MASK_INVALID');
    expect(res.body.error.fields['spatial.designs.0.maskCsv'][0]).toContain('line 2, cell 3: "7" is not a cell code.');
    const after = await who.agent.get(`/api/stocks/${(await Dataset.findByPk(crabData))!.stockId}/runs`).expect(200);
    expect(after.body.runs.length).toBe(before.body.runs.length);
    const missing = await who.agent.post('/api/runs').set('x-csrf-token', who.csrf).send({ datasetId: crabData, model: 'reaction-diffusion' }).expect(400);
    expect(Object.keys(missing.body.error.fields)).toContain('spatial');
  });
});
