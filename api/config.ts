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
  SIGNIN_LIMIT_PER_15_MIN: z.coerce.number().int().positive().default(10),
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
});

export type Config = z.infer<typeof schema>;

/** Parses an environment (process.env by default) into a typed Config or throws listing each bad key. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = schema.safeParse(env);
  if (!parsed.success) {
    const keys = parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ');
    throw new Error(`Invalid configuration: ${keys}`);
  }
  if (parsed.data.NODE_ENV === 'production' && parsed.data.SESSION_SECRET.includes('development')) {
    throw new Error('Invalid configuration: SESSION_SECRET must be set in production');
  }
  return parsed.data;
}
