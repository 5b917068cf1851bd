// Refusing abuse: webhooks from the future or with unusable objects, broken HTTP edges, production on
// shipped defaults, sign-in limits and proxy trust, and anonymous callers that would grow the session table.
import type { Express } from 'express';
import { QueryTypes } from 'sequelize';
import Stripe from 'stripe';
import request from 'supertest';
import { dummyHash, passwordCost } from '../../api/auth/auth.service';
import { loadConfig, PRODUCTION_REQUIRED } from '../../api/config';
import { StripeEvent } from '../../api/subscriptions/subscription.models';
import { DEMO_PASSWORD } from '../../seeders/demo-people';
import { anonymous, demoEmail, signIn, testApp, testConfig, testDb } from './support/test-app';

const SECRET = testConfig().STRIPE_WEBHOOK_SECRET;
const getRounds = async (hash: string) => (await import('bcrypt')).default.getRounds(hash);

function signed(app: Express, event: object, timestamp?: number) {
  const payload = JSON.stringify(event);
  return request(app).post('/api/stripe/webhook').set('content-type', 'application/json')
    .set('stripe-signature', Stripe.webhooks.generateTestHeaderString({ payload, secret: SECRET, timestamp })).send(payload);
}

describe('webhooks', () => {
  let app: Express;
  beforeAll(async () => { app = await testApp(); });

  it('refuses a validly signed event stamped 10 minutes ahead, and stores nothing', async () => {
    const id = `evt_future_${Date.now()}`;
    const res = await signed(app, { id, type: 'customer.subscription.updated', data: { object: { id: 'sub_x', status: 'active' } } }, Math.floor(Date.now() / 1000) + 600).expect(400);
    expect(res.body.error.code).toBe('WEBHOOK_TIMESTAMP_INVALID');
    expect(await StripeEvent.findByPk(id)).toBeNull();
  });

  it('answers an event with bad fields with 400, not 500', async () => {
    const res = await signed(app, { id: `evt_bad_${Date.now()}`, type: 'invoice.paid', data: { object: { id: 'in_1', amount_due: 'lots' } } }).expect(400);
    expect(res.body.error.code).toBe('WEBHOOK_EVENT_MALFORMED');
  });

  it('answers an event about an unknown subscription with 400 and leaves the event unrecorded', async () => {
    const id = `evt_unknown_${Date.now()}`;
    const res = await signed(app, { id, type: 'customer.subscription.updated', data: { object: { id: 'sub_nobody_has', status: 'active', cancel_at_period_end: false } } }).expect(400);
    expect(res.body.error.code).toBe('WEBHOOK_OBJECT_UNKNOWN');
    expect(await StripeEvent.findByPk(id)).toBeNull();
  });
});

describe('HTTP edges', () => {
  let app: Express;
  beforeAll(async () => { app = await testApp(); });

  it('answers an unsupported charset with 415', async () => {
    const { agent, csrf } = await anonymous(app);
    const res = await agent.post('/api/auth/sign-in').set('x-csrf-token', csrf).set('content-type', 'application/json; charset=klingon').send('{}');
    expect(res.status).toBe(415);
    expect(res.body.error.code).toBe('CHARSET_UNSUPPORTED');
  });

  it('answers an unknown content encoding with 415 and a corrupt gzip body with 400', async () => {
    const { agent, csrf } = await anonymous(app);
    const unknown = await agent.post('/api/auth/sign-in').set('x-csrf-token', csrf).set('content-type', 'application/json').set('content-encoding', 'zstd-ish').send('{}');
    expect(unknown.status).toBe(415);
    const corrupt = await agent.post('/api/auth/sign-in').set('x-csrf-token', csrf).set('content-type', 'application/json').set('content-encoding', 'gzip').send('this is not gzip');
    expect(corrupt.status).toBe(400);
  });

  it('answers a malformed %-escape in the address with 400', async () => {
    const { agent } = await signIn(app, 'assessor');
    const res = await agent.get('/api/runs/%E0%A4%A');
    expect(res.status).toBe(400);
  });

  it('marks private JSON no-store', async () => {
    const { agent } = await signIn(app, 'assessor');
    const res = await agent.get('/api/stocks').expect(200);
    expect(res.headers['cache-control']).toBe('no-store');
  });
});

describe('production configuration', () => {
  it('refuses to start on defaults and names every missing key', () => {
    const env = { NODE_ENV: 'production', SESSION_SECRET: 'x'.repeat(40) };
    let message = '';
    try {
      loadConfig(env);
    } catch (err) {
      message = (err as Error).message;
    }
    for (const key of PRODUCTION_REQUIRED.filter((k) => k !== 'SESSION_SECRET')) expect(message).withContext(key).toContain(`${key}:`);
    expect(message).not.toContain('SESSION_SECRET:');
  });

  it('refuses the shipped webhook secret even when it is set explicitly', () => {
    expect(() => loadConfig({
      NODE_ENV: 'production', SESSION_SECRET: 'x'.repeat(40), STRIPE_WEBHOOK_SECRET: 'whsec_brinkmark_local', STRIPE_SECRET_KEY: 'sk_live_real',
      DB_PASSWORD: 'a-real-password', STRIPE_API_BASE: '', COOKIE_SECURE: 'true',
    })).toThrowError(/STRIPE_WEBHOOK_SECRET: is the shipped development value/);
  });

  it('starts with every key given', () => {
    const c = loadConfig({
      NODE_ENV: 'production', SESSION_SECRET: 'x'.repeat(40), STRIPE_WEBHOOK_SECRET: 'whsec_real', STRIPE_SECRET_KEY: 'sk_live_real',
      DB_PASSWORD: 'a-real-password', STRIPE_API_BASE: '', COOKIE_SECURE: 'true',
    });
    expect(c.COOKIE_SECURE).toBeTrue();
  });
});

describe('sign-in abuse', () => {
  it('compares unknown accounts against a hash of the configured cost', async () => {
    await testApp();
    expect(await getRounds(dummyHash())).toBe(passwordCost());
  });

  it('limits failures per account even when the address changes', async () => {
    const app = await testApp({ SIGNIN_ACCOUNT_LIMIT_PER_15_MIN: '3' });
    for (let i = 0; i < 3; i++) {
      const { agent, csrf } = await anonymous(app);
      await agent.post('/api/auth/sign-in').set('x-csrf-token', csrf).set('x-forwarded-for', `203.0.113.${i}`).send({ email: demoEmail('board'), password: 'wrong-password' }).expect(401);
    }
    const { agent, csrf } = await anonymous(app);
    const res = await agent.post('/api/auth/sign-in').set('x-csrf-token', csrf).set('x-forwarded-for', '198.51.100.9').send({ email: demoEmail('board'), password: DEMO_PASSWORD });
    expect(res.status).toBe(429);
  });

  it('ignores X-Forwarded-For unless a proxy is configured, so rotating it does not reset the address limit', async () => {
    const app = await testApp({ SIGNIN_LIMIT_PER_15_MIN: '2' });
    for (let i = 0; i < 2; i++) {
      const { agent, csrf } = await anonymous(app);
      await agent.post('/api/auth/sign-in').set('x-csrf-token', csrf).set('x-forwarded-for', `192.0.2.${i}`).send({ email: `nobody${i}@corran-firth.example`, password: 'wrong' }).expect(401);
    }
    const { agent, csrf } = await anonymous(app);
    const res = await agent.post('/api/auth/sign-in').set('x-csrf-token', csrf).set('x-forwarded-for', '192.0.2.77').send({ email: 'nobody9@corran-firth.example', password: 'wrong' });
    expect(res.status).toBe(429);
  });
});

describe('anonymous callers', () => {
  it('get a CSRF token without a session row being stored, and can still sign in with it', async () => {
    const app = await testApp();
    const { sequelize } = await testDb();
    const count = async () => Number((await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM sessions', { type: QueryTypes.SELECT }))[0]!.n);
    const before = await count();
    for (let i = 0; i < 25; i++) await request(app).get('/api/auth/csrf').expect(200);
    expect(await count()).toBe(before);
    const { agent, csrf } = await anonymous(app);
    await agent.post('/api/auth/sign-in').set('x-csrf-token', csrf).send({ email: demoEmail('licensee'), password: DEMO_PASSWORD }).expect(200);
    expect(await count()).toBe(before + 1);
  });

  it('cannot sign in with a token whose cookie is missing or another caller\'s', async () => {
    const app = await testApp();
    const a = await anonymous(app);
    const b = await anonymous(app);
    const res = await a.agent.post('/api/auth/sign-in').set('x-csrf-token', b.csrf).send({ email: demoEmail('licensee'), password: DEMO_PASSWORD }).expect(403);
    expect(res.body.error.code).toBe('CSRF_TOKEN_INVALID');
    await request(app).post('/api/auth/sign-in').set('x-csrf-token', a.csrf).send({ email: demoEmail('licensee'), password: DEMO_PASSWORD }).expect(403);
  });
});

describe('health', () => {
  it('reports the database, queue and mail states', async () => {
    const app = await testApp();
    const res = await request(app).get('/api/health').expect(200);
    expect(Object.keys(res.body.checks).sort()).toEqual(['database', 'mail', 'queue']);
    expect(res.body.checks.database.status).toBe('up');
  });
});
