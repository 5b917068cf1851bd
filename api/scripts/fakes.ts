/** Starts the local SMTP fake (and the Stripe fake) as processes of their own, on loopback. */
import { type ChildProcess, spawn } from 'node:child_process';
import { rmSync } from 'node:fs';
import { createConnection } from 'node:net';
import { join } from 'node:path';
import { ROOT } from './local-env';

export interface FakePorts {
  smtp: number;
  stripe: number;
  mailDir: string;
  /** Where the Stripe fake delivers webhooks. */
  webhookUrl: string;
  stripeWebhookSecret: string;
}

function listening(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const s = createConnection({ host: '127.0.0.1', port }, () => { s.end(); resolve(true); });
    s.on('error', () => resolve(false));
  });
}

async function waitFor(port: number, name: string): Promise<void> {
  const deadline = Date.now() + 20_000;
  while (!(await listening(port))) {
    if (Date.now() > deadline) throw new Error(`${name} did not start on port ${port}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** Starts both fakes (reusing any already listening) and returns a function that stops what it started. */
export async function startFakes(p: FakePorts, { fresh = false } = {}): Promise<() => void> {
  if (fresh) rmSync(p.mailDir, { recursive: true, force: true });
  const children: ChildProcess[] = [];
  const launch = async (port: number, name: string, script: string, args: string[], env: NodeJS.ProcessEnv = {}) => {
    if (await listening(port)) return;
    const child = spawn(process.execPath, ['--import', 'tsx', join(ROOT, script), ...args], { cwd: ROOT, stdio: ['ignore', 'ignore', 'inherit'], env: { ...process.env, ...env } });
    children.push(child);
    await waitFor(port, name);
  };
  await launch(p.smtp, 'SMTP fake', 'api/fakes/smtp-fake-main.ts', [String(p.smtp), p.mailDir]);
  await launch(p.stripe, 'Stripe fake', 'api/fakes/stripe-fake-main.ts', [String(p.stripe)], { STRIPE_FAKE_WEBHOOK_URL: p.webhookUrl, STRIPE_WEBHOOK_SECRET: p.stripeWebhookSecret });
  return () => { for (const c of children) c.kill('SIGTERM'); };
}
