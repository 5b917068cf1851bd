import { mkdirSync } from 'node:fs';
import { resolve } from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser } from './support/browser';
import { signInAs, snap } from './support/pages';
import { startServer, type RunningServer } from './support/server';

const CRAB_CSV = resolve(import.meta.dirname, '..', '..', 'seeders', 'data', 'blue-lip-crab.csv');

describe('assessor, end to end in headless Chromium', () => {
  let server: RunningServer;
  let browser: Browser;
  let page: Page;
  const errors: string[] = [];

  beforeAll(async () => {
    mkdirSync('.data/screenshots', { recursive: true });
    server = await startServer(Number(process.env.TEST_PORT_BASE ?? 4390) + 3, 'brinkmark_scratch');
    browser = await launchBrowser();
    page = await (await browser.newContext({ viewport: { width: 1360, height: 900 }, acceptDownloads: true })).newPage();
    page.on('pageerror', (e) => errors.push(e.message));
  });

  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  it('signs in as an assessor and opens the crab stock', async () => {
    await signInAs(page, server.base, 'tomas.reyl@corran-firth.example');
    await page.click('a:has-text("Stocks")');
    await page.click('a:has-text("Firth blue-lip crab")');
    await page.waitForSelector('h1:has-text("Firth blue-lip crab")');
    await page.waitForSelector('[data-testid=version-table] tr.mat-mdc-row');
    expect(await page.locator('[data-testid=version-table] tr.mat-mdc-row').count()).toBeGreaterThan(0);
  });

  it('uploads the demo crab CSV, sees it clean, and saves it as a new version', async () => {
    await page.setInputFiles('[data-testid=file-input]', CRAB_CSV);
    await page.waitForSelector('[data-testid=check-status].bm-ok');
    expect(await page.locator('[data-testid=data-table] tr.mat-mdc-row').count()).toBe(12);
    await page.fill('[data-testid=version-note]', 'Landings and trap survey, reloaded for the 2026 assessment');
    await snap(page, 'assessor-upload');
    await page.click('[data-testid=save-dataset]');
    await page.waitForSelector('[data-testid=version-table] td:has-text("reloaded for the 2026 assessment")');
  });

  it('runs a Schaefer fit with a bootstrap, following its progress, and sees the bifurcation diagram', async () => {
    await page.click('div[role=tab]:has-text("Model runs")');
    await page.fill('[data-testid=run-bootstrap]', '300');
    await page.click('[data-testid=start-run]');
    await page.waitForSelector('h1:has-text("Run #")');
    await page.waitForSelector('svg[data-chart=bifurcation] .fold-marker', { timeout: 60_000 });
    const fold = await page.locator('svg[data-chart=bifurcation] .fold-marker').getAttribute('data-h');
    const shown = await page.locator('[data-testid=key-figures]').innerText();
    expect(Number(fold)).toBeGreaterThan(1000);
    expect(shown).toContain(Math.round(Number(fold)).toLocaleString('en-US'));
    expect(await page.locator('svg[data-chart=bifurcation] .stable-branch').count()).toBe(1);
    expect(await page.locator('svg[data-chart=bifurcation] .unstable-branch').count()).toBe(1);
    expect(await page.locator('svg[data-chart=bifurcation] .fold-band').count()).toBe(1);
    await page.locator('svg[data-chart=bifurcation]').hover({ position: { x: 250, y: 200 } });
    await page.waitForSelector('[data-testid=bifurcation-tip]');
    expect(await page.locator('[data-testid=bifurcation-tip]').innerText()).toContain('Return rate');
    await snap(page, 'assessor-run');
  });

  it('drafts a proposal from the run and submits it, after which it is frozen', async () => {
    await page.click('[data-testid=draft-proposal]');
    await page.waitForSelector('[data-testid=quota-input]');
    await page.fill('[data-testid=rationale]', 'Quota at the 5% risk quantile of the fold harvest; the ramp rule does not bind at the current status.');
    await page.click('[data-testid=save-draft]');
    await page.waitForSelector('[data-testid=proposal-status]:has-text("Draft")');
    await page.waitForSelector('[data-testid=proposal-figures]');
    expect(await page.locator('[data-testid=proposal-figures]').innerText()).toContain('Margin to the fold');
    await page.click('[data-testid=submit-proposal]');
    await page.waitForSelector('[data-testid=proposal-status]:has-text("Submitted")');
    expect(await page.locator('[data-testid=quota-input]').isDisabled()).toBeTrue();
    await snap(page, 'assessor-proposal');
    expect(errors).toEqual([]);
  });
});
