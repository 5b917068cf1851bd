/** Runtime configuration: parsed from process.env once, with defaults; boot fails naming bad keys. */
import { z } from 'zod';

const bool = z.enum(['true', 'false']).transform((v) => v === 'true');

const schema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  PORT: z.coerce.number().int().min(1).max(65535).default(4300),
  HOST: z.string().default('127.0.0.1'),
  DB_HOST: z.string().default('127.0.0.1'),
  DB_PORT: z.coerce.number().int().min(1).max(65535).default(4306),
  DB_NAME: z.string().regex(/^[A-Za-z0-9_]+$/).default('brinkmark'),
  DB_USER: z.string().regex(/^[A-Za-z0-9_]+$/).default('brinkmark'),
  DB_PASSWORD: z.string().min(8).default('brinkmark-local-db'),
  SESSION_SECRET: z.string().min(32).default('brinkmark-development-session-secret-change-me'),
  SESSION_MAX_AGE_HOURS: z.coerce.number().positive().default(12),
  COOKIE_SECURE: bool.default(false),
  /** bcrypt cost of stored passwords and of the comparison for unknown accounts (12 in production). */
  BCRYPT_ROUNDS: z.coerce.number().int().min(10).max(15).default(12),
  SIGNIN_LIMIT_PER_15_MIN: z.coerce.number().int().positive().default(10),
  /** Failed sign-ins allowed per account (whatever the address) in 15 minutes. */
  SIGNIN_ACCOUNT_LIMIT_PER_15_MIN: z.coerce.number().int().positive().default(10),
  /**
   * Which proxies may set X-Forwarded-For: empty (the default) trusts none, so the client address is
   * the socket's; otherwise Express's "trust proxy" value (a hop count, or addresses and subnets).
   */
  TRUST_PROXY: z.string().regex(/^[0-9a-fA-F.:/, ]*$|^(loopback|linklocal|uniquelocal)(, *(loopback|linklocal|uniquelocal))*$/, 'a hop count, or addresses/subnets, or loopback').default(''),
  CLIENT_DIR: z.string().default('.data/dist/browser'),
  LOG_REQUESTS: bool.default(false),
  PUBLIC_URL: z.string().url().default('http://127.0.0.1:4300'),
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(4325),
  SMTP_SECURE: bool.default(false),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().default('Brinkmark advisories <advisories@corran-firth.example>'),
  MAIL_FAKE_DIR: z.string().default('.data/mail'),
  STRIPE_SECRET_KEY: z.string().default('sk_test_brinkmark_local'),
  STRIPE_WEBHOOK_SECRET: z.string().default('whsec_brinkmark_local'),
  /** Where the Stripe SDK sends API calls: empty for Stripe itself, or the local fake. */
  STRIPE_API_BASE: z.string().default('http://127.0.0.1:4312'),
  /** The Redis that carries the run queue (one for every API and worker process). */
  REDIS_URL: z.string().regex(/^rediss?:\/\//, 'must be a redis:// or rediss:// URL').default('redis://127.0.0.1:4363'),
  /** Name of the BullMQ queue of model runs. */
  RUN_QUEUE: z.string().regex(/^[A-Za-z0-9_-]+$/).default('brinkmark-runs'),
  /** Runs one person may have queued or running at once; one more is refused with 429 RUN_LIMIT. */
  RUN_LIMIT_PER_USER: z.coerce.number().int().min(1).max(1000).default(10),
  /** Runs one worker process computes at once (each in its own worker thread). */
  WORKER_CONCURRENCY: z.coerce.number().int().min(1).max(64).default(1),
  /** Worker threads a run's bootstrap uses. */
  BOOTSTRAP_THREADS: z.coerce.number().int().min(1).max(64).default(2),
  /** A job whose worker has not renewed its lock for this long is stalled: retried once, then failed. */
  RUN_STALL_MS: z.coerce.number().int().min(1000).max(600_000).default(30_000),
});

export type Config = z.infer<typeof schema>;

/**
 * Keys a production server must be given explicitly: their defaults are for a laptop (a shipped
 * secret, the loopback Stripe fake, the local database password, cookies sent over plain HTTP).
 */
export const PRODUCTION_REQUIRED = ['SESSION_SECRET', 'STRIPE_WEBHOOK_SECRET', 'STRIPE_SECRET_KEY', 'DB_PASSWORD', 'STRIPE_API_BASE', 'COOKIE_SECURE'] as const;

/** Values that ship in this repository and so are public: never acceptable in production. */
const SHIPPED = new Set(['brinkmark-development-session-secret-change-me', 'whsec_brinkmark_local', 'sk_test_brinkmark_local', 'brinkmark-local-db']);

function productionProblems(env: NodeJS.ProcessEnv, config: Config): string[] {
  const problems: string[] = [];
  for (const key of PRODUCTION_REQUIRED) {
    const value = env[key];
    if (value === undefined) problems.push(`${key}: must be set in production (the default is for local use)`);
    else if (SHIPPED.has(value)) problems.push(`${key}: is the shipped development value`);
  }
  if (/^https?:\/\/(127\.|localhost|\[::1\])/.test(config.STRIPE_API_BASE) && env.STRIPE_API_BASE !== undefined) {
    problems.push('STRIPE_API_BASE: points at a loopback fake (leave it empty for Stripe itself)');
  }
  return problems;
}

/** Parses an environment (process.env by default) into a typed Config or throws listing each bad key. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = schema.safeParse(env);
  if (!parsed.success) {
    const keys = parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ');
    throw new Error(`Invalid configuration: ${keys}`);
  }
  if (parsed.data.NODE_ENV === 'production') {
    const problems = productionProblems(env, parsed.data);
    if (problems.length) throw new Error(`Invalid configuration for production: ${problems.join('; ')}`);
  }
  return parsed.data;
}
