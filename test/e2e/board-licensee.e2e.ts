import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import type { Browser, Page } from 'playwright-core';
import request from 'supertest';
import { DEMO_PASSWORD } from '../../seeders/demo-people';
import { launchBrowser } from './support/browser';
import { signInAs, snap } from './support/pages';
import { startServer, type RunningServer } from './support/server';

/** A submitted proposal for the grouse, made through the API as the assessor would. */
async function submitGrouseProposal(base: string): Promise<number> {
  const agent = request.agent(base);
  const token = (await agent.get('/api/auth/csrf')).body.csrfToken;
  const csrf = (await agent.post('/api/auth/sign-in').set('x-csrf-token', token).send({ email: 'priya.ansel@corran-firth.example', password: DEMO_PASSWORD })).body.csrfToken;
  const stocks = (await agent.get('/api/stocks')).body.stocks as { id: number; code: string }[];
  const grouse = stocks.find((s) => s.code === 'red-grouse')!;
  const datasetId = (await agent.get(`/api/stocks/${grouse.id}/datasets`)).body.datasets[0].id;
  const run = (await agent.post('/api/runs').set('x-csrf-token', csrf).send({ datasetId, model: 'schaefer', bootstrap: 200 })).body.run;
  let results: { quota: { proposal: { proposed: number } } } | null = null;
  for (let i = 0; i < 400 && !results; i++) {
    const r = (await agent.get(`/api/runs/${run.id}`)).body;
    if (r.run.status === 'succeeded') results = r.results;
    else await new Promise((res) => setTimeout(res, 100));
  }
  const p = (await agent.post('/api/proposals').set('x-csrf-token', csrf).send({ runId: run.id, quota: Math.floor(results!.quota.proposal.proposed), rationale: 'Spring counts are steady; quota at the 5% fold-risk quantile.' })).body.proposal;
  await agent.post(`/api/proposals/${p.id}/submit`).set('x-csrf-token', csrf).expect(200);
  return p.id;
}

describe('board and licensee, end to end in headless Chromium', () => {
  let server: RunningServer;
  let browser: Browser;
  let proposalId: number;
  const errors: string[] = [];

  async function pageAs(email: string): Promise<Page> {
    const page = await (await browser.newContext({ viewport: { width: 1360, height: 900 }, acceptDownloads: true })).newPage();
    page.on('pageerror', (e) => errors.push(e.message));
    await signInAs(page, server.base, email);
    return page;
  }

  beforeAll(async () => {
    server = await startServer(Number(process.env.TEST_PORT_BASE ?? 4390) + 4, 'brinkmark_scratch');
    browser = await launchBrowser();
    proposalId = await submitGrouseProposal(server.base);
  });

  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  it('a board member votes on the submitted proposal from the board queue', async () => {
    const page = await pageAs('odhran.pike@corran-firth.example');
    await page.click('a:has-text("Board")');
    await page.click(`[data-testid=board-queue] a:has-text("#${proposalId}")`);
    await page.waitForSelector('[data-testid=board-panel]');
    await page.fill('[data-testid=vote-reason]', 'Margin to the fold is adequate for a bird stock.');
    await page.click('[data-testid=cast-vote]');
    await page.waitForSelector('[data-testid=board-panel] li:has-text("Odhran Pike")');
  });

  it('the chair votes, records the approval, and the advisory is published', async () => {
    const page = await pageAs('maren.holt@corran-firth.example');
    await page.goto(`${server.base}/proposals/${proposalId}`);
    await page.waitForSelector('[data-testid=board-panel]');
    await page.fill('[data-testid=comment-input]', 'Agreed with the assessment; note the strong r–K correlation.');
    await page.click('[data-testid=post-comment]');
    await page.waitForSelector('[data-testid=board-panel] .bm-comment:has-text("strong r–K correlation")');
    await page.fill('[data-testid=vote-reason]', 'Approve at the proposed limit.');
    await page.click('[data-testid=cast-vote]');
    await page.waitForSelector('[data-testid=board-panel] li:has-text("Maren Holt")');
    await page.fill('[data-testid=decision-reason]', 'Two votes to approve; limit as proposed.');
    await page.click('[data-testid=record-decision]');
    await page.waitForSelector('[data-testid=decision]:has-text("Approved")');
    await page.waitForSelector('[data-testid=advisory-link]');
    expect(await page.locator('[data-testid=audit-log] td:has-text("proposal.approved")').count()).toBe(1);
    await snap(page, 'board-decision');
  });

  it('a licensee subscribes with the test card and downloads the advisory', async () => {
    const page = await pageAs('keeper@moorfell-estate.example');
    await page.click('a:has-text("Portal")');
    await page.click('[data-testid=subscribe-region]');
    await page.click('mat-option:has-text("Moorfell")');
    await page.click('[data-testid=subscribe-button]');
    await page.waitForSelector('#card');
    await page.fill('#card', '4000 0000 0000 0002');
    await page.click('#pay');
    await page.waitForSelector('text=Your card was declined.');
    await page.fill('#card', '4242 4242 4242 4242');
    await page.click('#pay');
    await page.waitForURL(/\/portal\?checkout=done/);
    await page.waitForSelector('[data-testid=subscription-status]:has-text("active")', { timeout: 20_000 });
    await page.reload();
    await page.waitForSelector('[data-testid=advisory-download]');
    expect(await page.locator('[data-testid=subscriptions]').innerText()).toContain('490.00 EUR');
    const [download] = await Promise.all([page.waitForEvent('download'), page.click('[data-testid=advisory-download]')]);
    const pdf = readFileSync((await download.path())!);
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    const shown = await page.locator('[data-testid=advisory-list]').innerText();
    expect(shown).toContain(createHash('sha256').update(pdf).digest('hex').slice(0, 16));
    await snap(page, 'licensee-portal');
    expect(errors).toEqual([]);
  });
});
