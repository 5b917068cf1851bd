/** Page helpers: act as a person would, wait on what the page shows. */
import type { Page } from 'playwright-core';
import { DEMO_PASSWORD } from '../../../seeders/demo-people';

export async function signInAs(page: Page, base: string, email: string): Promise<void> {
  await page.goto(`${base}/sign-in`);
  await page.fill('[data-testid=email]', email);
  await page.fill('[data-testid=password]', DEMO_PASSWORD);
  await page.click('[data-testid=submit]');
  await page.waitForSelector('h1:has-text("Welcome")');
}

/** Saves a screenshot for people to look at (.data/screenshots/NAME.png). */
export async function snap(page: Page, name: string): Promise<void> {
  await page.screenshot({ path: `.data/screenshots/${name}.png`, fullPage: true });
}
