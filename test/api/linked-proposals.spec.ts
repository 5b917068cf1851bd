import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Express } from 'express';
import { Advisory } from '../../api/advisories/advisory.model';
import { Dataset } from '../../api/datasets/dataset.model';
import { Proposal } from '../../api/proposals/proposal.model';
import type { PredatorPreyRunResults } from '../../api/runs/run.schemas';
import { Stock } from '../../api/stocks/stock.model';
import { Subscription } from '../../api/subscriptions/subscription.models';
import { User } from '../../api/users/user.model';
import { received, recipients } from './support/mailbox';
import { finished, waitForRun } from './support/runs';
import { signIn, testApp, type SignedIn } from './support/test-app';

/** Text of a PDF via poppler's pdftotext (an independent reader). */
function pdfText(pdf: Buffer): string {
  const dir = mkdtempSync(join(tmpdir(), 'bm-pdf-'));
  writeFileSync(join(dir, 'a.pdf'), pdf);
  return execFileSync('pdftotext', ['-layout', join(dir, 'a.pdf'), '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
}

describe('a pair of catches for the linked sprat and cod stocks, from run to the Skerry Reach licensee', () => {
  let app: Express;
  let assessor: SignedIn;
  let runId: number;
  let results: PredatorPreyRunResults;
  const other = (email: string) => signIn(app, { email, password: 'corran-firth-demo' });

  beforeAll(async () => {
    app = await testApp();
    assessor = await signIn(app, 'assessor');
    const stock = (await Stock.findOne({ where: { code: 'sprat-ridge-cod' } }))!;
    const datasetId = (await Dataset.findOne({ where: { stockId: stock.id, version: 1 } }))!.id;
    const start = await assessor.agent.post('/api/runs').set('x-csrf-token', assessor.csrf).send({ datasetId, model: 'rosenzweig-macarthur', bootstrap: 20, seed: 4 }).expect(202);
    runId = start.body.run.id;
    const done = await waitForRun(assessor, runId, finished, 280_000);
    expect(done.run.status).withContext(done.run.error ?? '').toBe('succeeded');
    results = done.results as unknown as PredatorPreyRunResults;
  }, 300_000);

  it('refuses a linked proposal without its predator catch and stores nothing', async () => {
    const before = await Proposal.count();
    const res = await assessor.agent.post('/api/proposals').set('x-csrf-token', assessor.csrf)
      .send({ runId, quota: 10_000, rationale: 'Prey catch only, predator catch forgotten.' }).expect(422);
    expect(res.body.error.code).toBe('PREDATOR_CATCH_REQUIRED');
    expect(res.body.error.fields.predatorQuota).toBeDefined();
    expect(await Proposal.count()).toBe(before);
  });

  it('goes from a pair proposal through the board vote to an advisory the Skerry Reach licensee receives and downloads', async () => {
    const last = results.years.length - 1;
    const prey = Math.round(0.8 * results.preyCatch[last]!), predator = Math.round(0.8 * results.predatorCatch[last]!);
    const draft = await assessor.agent.post('/api/proposals').set('x-csrf-token', assessor.csrf)
      .send({ runId, quota: prey, predatorQuota: predator, rationale: 'Both catches cut by a fifth from last year, well inside the catch plane.' }).expect(201);
    const p = draft.body.proposal;
    expect(p.predatorQuota).toBe(predator);
    expect(p.figures.pair.preyCatch).toBe(prey);
    expect(p.figures.pair.pCross).toBeGreaterThanOrEqual(0);
    expect(p.figures.pair.pCross).toBeLessThanOrEqual(1);
    // the single-stock fields read along the ray through the pair, in prey catch
    expect(p.figures.marginToFold.absolute).toBeCloseTo(p.figures.foldHarvest.median - prey, 6);
    await assessor.agent.post(`/api/proposals/${p.id}/submit`).set('x-csrf-token', assessor.csrf).expect(200);

    const skerry = (await User.findOne({ where: { email: 'office@skerry-boats.example' } }))!;
    await Subscription.create({ userId: skerry.id, regionId: skerry.regionId!, plan: 'yearly', stripeCustomerId: 'cus_skerry', stripeCheckoutId: `cs_skerry_${Date.now()}`, stripeSubscriptionId: null, status: 'active', currentPeriodEnd: new Date(Date.now() + 30 * 86_400_000) });
    const chair = await other('maren.holt@corran-firth.example');
    for (const who of [await other('odhran.pike@corran-firth.example'), await other('ana.lusk@corran-firth.example')]) {
      await who.agent.post(`/api/proposals/${p.id}/board/votes`).set('x-csrf-token', who.csrf).send({ choice: 'approve', reason: 'The pair keeps clear of the fold and Hopf curves.' }).expect(201);
    }
    const override = p.figures.foldHarvest.lower5 < prey;
    const dec = await chair.agent.post(`/api/proposals/${p.id}/board/decision`).set('x-csrf-token', chair.csrf)
      .send({ outcome: 'approved', override, reason: 'The board approves the pair of catches as proposed.' }).expect(201);
    const advisory = (await Advisory.findByPk(dec.body.advisoryId))!;
    const text = pdfText(advisory.pdf);
    expect(text).toContain(`Prey ${prey.toLocaleString('en-GB')} and predator ${predator.toLocaleString('en-GB')} t per year`);
    expect(text).toContain('The pair in the catch plane');
    expect(text).toContain('Conversion efficiency e = 0.25');
    expect(text).toContain('scientific advice to a competent authority');

    await app.locals.mail.flush();
    const mails = (await received()).filter((m) => m.subject?.includes(advisory.docId));
    expect(mails.flatMap(recipients)).toContain('office@skerry-boats.example');
    const licensee = await other('office@skerry-boats.example');
    const list = await licensee.agent.get('/api/advisories').expect(200);
    expect(list.body.advisories.map((a: { id: number }) => a.id)).toContain(advisory.id);
    await licensee.agent.get(`/api/advisories/${advisory.id}/pdf`).expect(200);
    const potters = await other('office@inner-firth-potters.example');
    await potters.agent.get(`/api/advisories/${advisory.id}/pdf`).expect(403);
  }, 120_000);
});
