/** Environment for the local demo and test servers: ports, data directories, a stable session secret. */
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { mariaDbServer } from './mariadb';
import { redisServer } from './redis';

export const ROOT = resolve(import.meta.dirname, '..', '..');
export const DATA = join(ROOT, '.data');

/** A secret kept in .data/, so sessions stay valid across restarts of the local server. */
export function localSecret(name: string): string {
  mkdirSync(DATA, { recursive: true });
  const file = join(DATA, `${name}.secret`);
  if (!existsSync(file)) writeFileSync(file, randomBytes(32).toString('hex'), { mode: 0o600 });
  return readFileSync(file, 'utf8').trim();
}

export type Profile = 'demo' | 'test';

/** Shifts every local port, so several checkouts on one machine can run their demo and tests side by side. */
const OFFSET = Number(process.env.BRINKMARK_PORT_OFFSET ?? 0);

const PROFILES = {
  demo: { datadir: join(DATA, 'mariadb'), dbPort: 4306 + OFFSET, db: 'brinkmark', appPort: 4300 + OFFSET, smtp: 4325 + OFFSET, stripe: 4312 + OFFSET, mailDir: join(DATA, 'mail'), redisDir: join(DATA, 'redis'), redisPort: 4363 + OFFSET },
  test: { datadir: join(DATA, 'mariadb-test'), dbPort: 4316 + OFFSET, db: 'brinkmark_test', appPort: 4320 + OFFSET, smtp: 4335 + OFFSET, stripe: 4322 + OFFSET, mailDir: join(DATA, 'mail-test'), redisDir: join(DATA, 'redis-test'), redisPort: 4373 + OFFSET },
} as const;

/** First of the ports that specs may take for servers of their own (4390 … 4399 before the offset). */
export const TEST_PORT_BASE = 4390 + OFFSET;

/** The MariaDB and Redis servers and process environment of a profile (demo data or tests). */
export function profile(name: Profile) {
  const p = PROFILES[name];
  const env: Record<string, string> = {
    NODE_ENV: name === 'test' ? 'test' : 'development',
    PORT: String(process.env.PORT ?? p.appPort),
    DB_PORT: String(p.dbPort),
    DB_NAME: p.db,
    DB_USER: 'brinkmark',
    DB_PASSWORD: localSecret(`db-${name}`),
    SESSION_SECRET: localSecret(`session-${name}`),
    PUBLIC_URL: `http://127.0.0.1:${process.env.PORT ?? p.appPort}`,
    SMTP_PORT: String(p.smtp),
    MAIL_FAKE_DIR: p.mailDir,
    STRIPE_API_BASE: `http://127.0.0.1:${p.stripe}`,
    STRIPE_WEBHOOK_SECRET: 'whsec_brinkmark_local',
    TEST_PORT_BASE: String(TEST_PORT_BASE),
    // the demo accounts' cost: sign-ins in specs stay fast, and no hash is upgraded behind the specs' back
    ...(name === 'test' ? { BCRYPT_ROUNDS: '10' } : {}),
    REDIS_URL: `redis://127.0.0.1:${p.redisPort}`,
  };
  const fakes = { smtp: p.smtp, stripe: p.stripe, mailDir: p.mailDir, webhookUrl: `${env.PUBLIC_URL}/api/stripe/webhook`, stripeWebhookSecret: env.STRIPE_WEBHOOK_SECRET! };
  return { server: mariaDbServer(p.datadir, p.dbPort), redis: redisServer(p.redisDir, p.redisPort), env, fakes, db: { name: p.db, user: 'brinkmark', password: env.DB_PASSWORD! } };
}
