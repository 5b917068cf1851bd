import type { Express } from 'express';
import { AuditEvent } from '../../api/audit/audit-event.model';
import { Dataset } from '../../api/datasets/dataset.model';
import { Stock } from '../../api/stocks/stock.model';
import { finished, waitForRun } from './support/runs';
import { signIn, testApp, type SignedIn } from './support/test-app';

describe('quota proposals', () => {
  let app: Express;
  let assessor: SignedIn;
  let runId: number;
  let stockId: number;
  let hStar: number;
  beforeAll(async () => {
    app = await testApp();
    assessor = await signIn(app, 'assessor');
    stockId = (await Stock.findOne({ where: { code: 'red-grouse' } }))!.id;
    const datasetId = (await Dataset.findOne({ where: { stockId, version: 1 } }))!.id;
    const start = await assessor.agent.post('/api/runs').set('x-csrf-token', assessor.csrf).send({ datasetId, model: 'schaefer', bootstrap: 150 }).expect(202);
    const done = await waitForRun(assessor, start.body.run.id, finished);
    expect(done.run.status).toBe('succeeded');
    runId = start.body.run.id;
    hStar = (done.results as { quota: { proposal: { hStar: { median: number } } } }).quota.proposal.hStar.median;
  });

  function draft(quota: number) {
    return assessor.agent.post('/api/proposals').set('x-csrf-token', assessor.csrf)
      .send({ runId, quota, rationale: 'Spring counts steady; the ramp rule is not binding this season.' });
  }

  it('drafts a proposal with the margin to the fold stated in birds and as a fraction', async () => {
    const res = await draft(Math.round(0.8 * hStar)).expect(201);
    const p = res.body.proposal;
    expect(p.status).toBe('draft');
    expect(p.figures.unit).toBe('birds');
    expect(p.figures.marginToFold.absolute).toBeCloseTo(hStar - p.quota, 6);
    expect(p.figures.marginToFold.fraction).toBeCloseTo((hStar - p.quota) / hStar, 9);
    expect(p.figures.atQuota.pPassFold).toBeLessThan(0.05);
    expect(p.figures.candidates.length).toBeGreaterThan(2);
  });

  it('recomputes the figures when a draft\'s quota changes', async () => {
    const created = (await draft(Math.round(0.5 * hStar)).expect(201)).body.proposal;
    const res = await assessor.agent.patch(`/api/proposals/${created.id}`).set('x-csrf-token', assessor.csrf).send({ quota: Math.round(1.2 * hStar) }).expect(200);
    expect(res.body.proposal.figures.marginToFold.absolute).toBeLessThan(0);
    expect(res.body.proposal.figures.atQuota.pPassFold).toBeGreaterThan(0.5);
  });

  it('freezes a submitted proposal: edits and a second submit are refused, and a revision is a new draft', async () => {
    const created = (await draft(Math.round(0.7 * hStar)).expect(201)).body.proposal;
    const sub = await assessor.agent.post(`/api/proposals/${created.id}/submit`).set('x-csrf-token', assessor.csrf).expect(200);
    expect(sub.body.proposal.status).toBe('submitted');
    expect(sub.body.proposal.submittedAt).not.toBeNull();
    const edit = await assessor.agent.patch(`/api/proposals/${created.id}`).set('x-csrf-token', assessor.csrf).send({ quota: 1 }).expect(409);
    expect(edit.body.error.code).toBe('PROPOSAL_FROZEN');
    await assessor.agent.post(`/api/proposals/${created.id}/submit`).set('x-csrf-token', assessor.csrf).expect(409);
    const frozen = await assessor.agent.get(`/api/proposals/${created.id}`).expect(200);
    expect(frozen.body.proposal.quota).toBe(created.quota);
    const rev = await assessor.agent.post(`/api/proposals/${created.id}/revise`).set('x-csrf-token', assessor.csrf).expect(201);
    expect(rev.body.proposal.status).toBe('draft');
    expect(rev.body.proposal.revisesId).toBe(created.id);
    const audit = await AuditEvent.findAll({ where: { entityType: 'proposal', entityId: created.id } });
    expect(audit.map((a) => a.action).sort()).toEqual(['proposal.create', 'proposal.submit']);
  });

  it('shows the board submitted proposals only, and refuses board edits', async () => {
    const mine = (await draft(Math.round(0.6 * hStar)).expect(201)).body.proposal;
    await assessor.agent.post(`/api/proposals/${mine.id}/submit`).set('x-csrf-token', assessor.csrf).expect(200);
    const board = await signIn(app, 'board');
    const list = await board.agent.get(`/api/stocks/${stockId}/proposals`).expect(200);
    expect(list.body.proposals.length).toBeGreaterThan(0);
    expect(list.body.proposals.every((p: { status: string }) => p.status === 'submitted')).toBeTrue();
    await board.agent.post('/api/proposals').set('x-csrf-token', board.csrf).send({ runId, quota: 10, rationale: 'x'.repeat(30) }).expect(403);
  });

  it('refuses a proposal from a run without a bootstrap, and a rationale that says nothing', async () => {
    const datasetId = (await Dataset.findOne({ where: { stockId, version: 1 } }))!.id;
    const start = await assessor.agent.post('/api/runs').set('x-csrf-token', assessor.csrf).send({ datasetId, model: 'fox', bootstrap: 0 }).expect(202);
    await waitForRun(assessor, start.body.run.id, finished);
    const res = await assessor.agent.post('/api/proposals').set('x-csrf-token', assessor.csrf)
      .send({ runId: start.body.run.id, quota: 100, rationale: 'A long enough reason for the test.' }).expect(422);
    expect(res.body.error.code).toBe('RUN_NOT_PROPOSABLE');
    const short = await assessor.agent.post('/api/proposals').set('x-csrf-token', assessor.csrf).send({ runId, quota: 100, rationale: 'ok' }).expect(400);
    expect(short.body.error.fields.rationale).toBeDefined();
  });
});
