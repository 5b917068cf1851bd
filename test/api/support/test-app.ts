/** Server test support: one migrated, seeded MariaDB test database and signed-in supertest agents. */
import type { Express } from 'express';
import type { Sequelize } from 'sequelize';
import request from 'supertest';
import { createApp } from '../../../api/app';
import { type Config, loadConfig } from '../../../api/config';
import { createSequelize, demoSeeder, schemaMigrator } from '../../../api/db';
import { RunWorker } from '../../../api/runs/run-processor';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '../../../seeders/demo-people';
import type { Role } from '../../../api/users/user.schemas';

let shared: Promise<{ sequelize: Sequelize; config: Config; worker: RunWorker }> | null = null;

/** The test configuration: the test profile's env, with a high sign-in limit unless overridden. */
export function testConfig(overrides: Record<string, string> = {}): Config {
  return loadConfig({ ...process.env, SIGNIN_LIMIT_PER_15_MIN: '1000', CLIENT_DIR: '.data/no-client', ...overrides });
}

/**
 * The shared connection to the test database, migrated and seeded once per run, with one run worker
 * in this process taking runs from the test Redis (the scale spec starts worker processes of its own).
 */
export function testDb(): Promise<{ sequelize: Sequelize; config: Config; worker: RunWorker }> {
  shared ??= (async () => {
    const config = testConfig();
    const sequelize = createSequelize(config);
    await schemaMigrator(sequelize).up();
    await demoSeeder(sequelize).up();
    const worker = new RunWorker(config, { name: 'spec-worker' });
    await worker.ready();
    return { sequelize, config, worker };
  })();
  return shared;
}

/** A fresh app on the shared test database. */
export async function testApp(overrides: Record<string, string> = {}): Promise<Express> {
  const { sequelize } = await testDb();
  const app = createApp({ config: testConfig(overrides), sequelize });
  app.locals.sessionStore.stopExpiringSessions();
  return app;
}

/** The demo account of a role. */
export function demoEmail(role: Role): string {
  return DEMO_PEOPLE.find((p) => p.role === role)!.email;
}

export interface SignedIn {
  agent: ReturnType<typeof request.agent>;
  csrf: string;
}

/** An agent with a CSRF token and no session user. */
export async function anonymous(app: Express): Promise<SignedIn> {
  const agent = request.agent(app);
  const res = await agent.get('/api/auth/csrf').expect(200);
  return { agent, csrf: res.body.csrfToken as string };
}

/** An agent signed in as the demo person of a role (or a given e-mail), with its CSRF token. */
export async function signIn(app: Express, who: Role | { email: string; password: string }): Promise<SignedIn> {
  const { agent, csrf } = await anonymous(app);
  const creds = typeof who === 'string' ? { email: demoEmail(who), password: DEMO_PASSWORD } : who;
  const res = await agent.post('/api/auth/sign-in').set('x-csrf-token', csrf).send(creds);
  if (res.status !== 200) throw new Error(`sign-in as ${creds.email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return { agent, csrf: res.body.csrfToken as string };
}
