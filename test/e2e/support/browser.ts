/** Headless Debian Chromium through playwright-core, with the flags this closed network needs. */
import { chromium, type Browser } from 'playwright-core';

export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROME_BIN ?? '/usr/bin/chromium',
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage', '--disable-quic', '--no-first-run',
      '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
}
