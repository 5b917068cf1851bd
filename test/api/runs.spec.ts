import type { PredatorPreyRunResults } from '../../api/runs/run.schemas';
import type { Express } from 'express';
import { Dataset } from '../../api/datasets/dataset.model';
import { RunWorker } from '../../api/runs/run-processor';
import { Stock } from '../../api/stocks/stock.model';
import { finished, waitForRun } from './support/runs';
import { signIn, testApp, testDb } from './support/test-app';
import { createApp } from '../../api/app';
import { testConfig } from './support/test-app';

describe('model runs', () => {
  let app: Express;
  let crabData: number;
  let codData: number;
  beforeAll(async () => {
    app = await testApp();
    const crab = (await Stock.findOne({ where: { code: 'blue-lip-crab' } }))!;
    const cod = (await Stock.findOne({ where: { code: 'sprat-ridge-cod' } }))!;
    crabData = (await Dataset.findOne({ where: { stockId: crab.id, version: 1 } }))!.id;
    codData = (await Dataset.findOne({ where: { stockId: cod.id, version: 1 } }))!.id;
  });

  it('runs a Schaefer fit with a bootstrap off the request thread and stores inputs, engine version, results and timing', async () => {
    const who = await signIn(app, 'assessor');
    const start = await who.agent.post('/api/runs').set('x-csrf-token', who.csrf)
      .send({ datasetId: crabData, model: 'schaefer', bootstrap: 120, seed: 3 }).expect(202);
    expect(['queued', 'running']).toContain(start.body.run.status);
    const done = await waitForRun(who, start.body.run.id, finished);
    expect(done.run.status).toBe('succeeded');
    expect(done.run.progress).toBe(1);
    expect(done.run.engineVersion).toMatch(/^\d+\.\d+\.\d+$/);
    expect(done.run.durationMs).toBeGreaterThan(0);
    expect(done.run.options).toEqual(jasmine.objectContaining({ bootstrap: 120, seed: 3, risk: 0.05 }));
    const results = done.results as { kind: string; fold: { hStar: number }; fit: { reference: { msy: number } }; quota: { proposal: { proposed: number } } };
    expect(results.kind).toBe('surplus');
    expect(results.fold.hStar).toBeCloseTo(results.fit.reference.msy, 4);
    expect(results.quota.proposal.proposed).toBeLessThan(results.fold.hStar);
    const list = await who.agent.get(`/api/stocks/${(await Dataset.findByPk(crabData))!.stockId}/runs`).expect(200);
    const row = list.body.runs.find((r: { id: number }) => r.id === start.body.run.id);
    expect(row.foldHarvest).toBeCloseTo(results.fold.hStar, 6);
    expect(row.aic).toBeDefined();
  });

  it('reports progress while running and can be cancelled, leaving the run marked cancelled', async () => {
    const who = await signIn(app, 'assessor');
    const start = await who.agent.post('/api/runs').set('x-csrf-token', who.csrf)
      .send({ datasetId: crabData, model: 'schaefer', bootstrap: 5000 }).expect(202);
    const running = await waitForRun(who, start.body.run.id, (r) => r.status === 'running' && r.progress > 0.1);
    expect(running.run.progress).toBeLessThan(1);
    const cancel = await who.agent.post(`/api/runs/${start.body.run.id}/cancel`).set('x-csrf-token', who.csrf).expect(200);
    expect(cancel.body.run.status).toBe('cancelled');
    const again = await who.agent.post(`/api/runs/${start.body.run.id}/cancel`).set('x-csrf-token', who.csrf).expect(409);
    expect(again.body.error.code).toBe('RUN_FINISHED');
  });

  it('fits the linked sprat and cod stocks with Rosenzweig-MacArthur and continues both harvests', async () => {
    const who = await signIn(app, 'assessor');
    const start = await who.agent.post('/api/runs').set('x-csrf-token', who.csrf).send({ datasetId: codData, model: 'rosenzweig-macarthur', bootstrap: 4 }).expect(202);
    const done = await waitForRun(who, start.body.run.id, finished, 170_000);
    expect(done.run.status).toBe('succeeded');
    const r = done.results as unknown as PredatorPreyRunResults;
    expect(r.kind).toBe('predator-prey');
    expect(r.preyNullcline.length).toBe(60);
    expect(r.bifurcations.predatorCatch.events.length).toBeGreaterThan(0);
    expect(r.fit.indices.map((i) => i.observed.length)).toEqual([36, 36]);
    expect(r.fit.fixed.map((f) => f.name)).toEqual(['Conversion efficiency e', 'Saturation a·h·K']);
    expect(r.comparison!.map((c) => c.model).sort()).toEqual(['lotka-volterra', 'rosenzweig-macarthur']);
    expect(r.bootstrap!.replicates).toBe(4);
    expect(r.catchPlane!.curves.find((c) => c.kind === 'hopf')!.points.length).toBeGreaterThan(0);
    expect(r.current!.projection.prey.median.length).toBe(11);
  }, 180_000);

  it('refuses a model that does not fit the data, and bad options, with every field named', async () => {
    const who = await signIn(app, 'assessor');
    const mismatch = await who.agent.post('/api/runs').set('x-csrf-token', who.csrf).send({ datasetId: codData, model: 'schaefer' }).expect(422);
    expect(mismatch.body.error.code).toBe('MODEL_DATA_MISMATCH');
    const bad = await who.agent.post('/api/runs').set('x-csrf-token', who.csrf)
      .send({ datasetId: crabData, model: 'gompertz', risk: 0.7, bootstrap: -1 }).expect(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['bootstrap', 'model', 'risk']);
  });

  it('stores data-poor options with the run, fits a penalised likelihood and keeps the diagnostics with the results', async () => {
    const who = await signIn(app, 'assessor');
    const start = await who.agent.post('/api/runs').set('x-csrf-token', who.csrf).send({
      datasetId: crabData, model: 'schaefer', bootstrap: 0, peel: 2, jitter: 2,
      fixed: { d0: 0.9 }, priors: { r: { kind: 'lognormal', median: 0.4, sdLog: 0.3 } },
    }).expect(202);
    const done = await waitForRun(who, start.body.run.id, finished);
    expect(done.run.status).toBe('succeeded');
    expect(done.run.options).toEqual(jasmine.objectContaining({ fixed: { d0: 0.9 }, priors: { r: { kind: 'lognormal', median: 0.4, sdLog: 0.3 } }, peel: 2 }));
    const r = done.results as { fit: { params: { d0: number }; penalised: boolean; constraints: string }; diagnostics: { retrospective: { peels: unknown[] }; profiles: { name: string }[]; jitter: { starts: number } } };
    expect(r.fit.params.d0).toBe(0.9);
    expect(r.fit.penalised).toBeTrue();
    expect(r.fit.constraints).toContain('B0/K fixed at 0.9');
    expect(r.diagnostics.retrospective.peels.length).toBe(3);
    // K and r free, B0/K held: profiles of r, K, MSY and h*
    expect(r.diagnostics.profiles.map((p) => p.name)).toEqual(['r', 'K', 'MSY', 'h*']);
    expect(r.diagnostics.jitter.starts).toBe(2);
  });

  it('refuses a catchability for a survey the dataset does not have, and an impossible beta prior, storing nothing', async () => {
    const who = await signIn(app, 'assessor');
    const { Run } = await import('../../api/runs/run.model');
    const before = await Run.count();
    const q = await who.agent.post('/api/runs').set('x-csrf-token', who.csrf).send({ datasetId: crabData, model: 'schaefer', fixed: { q: { acoustic: 0.1 } } }).expect(422);
    expect(q.body.error.code).toBe('UNKNOWN_SURVEY');
    expect(q.body.error.message).toContain('trap_survey');
    const beta = await who.agent.post('/api/runs').set('x-csrf-token', who.csrf)
      .send({ datasetId: crabData, model: 'schaefer', priors: { d0: { kind: 'beta', mean: 0.9, sd: 0.4 } } }).expect(400);
    expect(Object.keys(beta.body.error.fields)).toContain('priors.d0.sd');
    const linked = await who.agent.post('/api/runs').set('x-csrf-token', who.csrf).send({ datasetId: codData, model: 'lotka-volterra', fixed: { r: 0.5 } }).expect(422);
    expect(linked.body.error.code).toBe('OPTION_NOT_FOR_MODEL');
    expect(await Run.count()).toBe(before);
  });

  it('reports a failed fit as failed, with the engine\'s reason', async () => {
    const { sequelize } = await testDb();
    const config = testConfig({ RUN_QUEUE: 'brinkmark-runs-failing' });
    const worker = new RunWorker(config, { name: 'failing-worker', threadUrl: new URL('../fixtures/failing-run-worker.ts', import.meta.url) });
    await worker.ready();
    try {
      const failing = createApp({ config, sequelize });
      failing.locals.sessionStore.stopExpiringSessions();
      const who = await signIn(failing, 'assessor');
      const start = await who.agent.post('/api/runs').set('x-csrf-token', who.csrf).send({ datasetId: crabData, model: 'schaefer' }).expect(202);
      const done = await waitForRun(who, start.body.run.id, finished);
      expect(done.run.status).toBe('failed');
      expect(done.run.error).toContain('the optimiser found no finite likelihood');
      expect(done.results).toBeNull();
      await failing.locals.runJobs.close();
    } finally {
      await worker.close(true);
    }
  });

  it('marks unfinished runs that the queue no longer holds as failed, so nothing stays running', async () => {
    const { Run } = await import('../../api/runs/run.model');
    const { worker } = await testDb();
    const stray = await Run.create({ stockId: (await Dataset.findByPk(crabData))!.stockId, datasetId: crabData, model: 'schaefer', options: {} as never, status: 'running', stage: null, engineVersion: '0.1.0', results: null, error: null, durationMs: null, createdBy: 1, startedAt: new Date(), finishedAt: null });
    await Run.sequelize!.query('UPDATE runs SET created_at = ? WHERE id = ?', { replacements: [new Date(Date.now() - 3_600_000), stray.id] });
    expect(await worker.sweep()).toBeGreaterThanOrEqual(1);
    await stray.reload();
    expect(stray.status).toBe('failed');
    expect(stray.error).toContain('queue no longer holds this run');
    expect(stray.finishedAt).not.toBeNull();
  });
});
