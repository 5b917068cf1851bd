import type { Express } from 'express';
import request from 'supertest';
import { DEMO_PASSWORD } from '../../seeders/demo-people';
import { anonymous, demoEmail, signIn, testApp } from './support/test-app';

function sessionCookie(res: request.Response): string {
  const cookies = ([] as string[]).concat(res.headers['set-cookie'] ?? []);
  const c = cookies.find((x) => x.startsWith('brinkmark.sid='));
  if (!c) throw new Error('no session cookie set');
  return c;
}

describe('sign-in', () => {
  let app: Express;
  beforeAll(async () => {
    app = await testApp();
  });

  it('signs in the demo assessor and answers who-am-I with that user', async () => {
    const { agent } = await signIn(app, 'assessor');
    const me = await agent.get('/api/auth/me').expect(200);
    expect(me.body.user.email).toBe(demoEmail('assessor'));
    expect(me.body.user.role).toBe('assessor');
    expect(me.body.user.passwordHash).toBeUndefined();
  });

  it('answers "is anyone signed in?" for a visitor without an error, with a token that signs in', async () => {
    const agent = request.agent(app);
    const open = await agent.get('/api/auth/session').expect(200);
    expect(open.body.user).toBeNull();
    expect(typeof open.body.csrfToken).toBe('string');
    const res = await agent.post('/api/auth/sign-in').set('x-csrf-token', open.body.csrfToken).send({ email: demoEmail('board'), password: DEMO_PASSWORD }).expect(200);
    const after = await agent.get('/api/auth/session').set('x-csrf-token', res.body.csrfToken).expect(200);
    expect(after.body.user.email).toBe(demoEmail('board'));
  });

  it('rejects a wrong password with the same generic message as an unknown e-mail', async () => {
    const { agent, csrf } = await anonymous(app);
    const wrong = await agent.post('/api/auth/sign-in').set('x-csrf-token', csrf)
      .send({ email: demoEmail('board'), password: 'not-the-password' }).expect(401);
    const unknown = await agent.post('/api/auth/sign-in').set('x-csrf-token', csrf)
      .send({ email: 'nobody@corran-firth.example', password: 'not-the-password' }).expect(401);
    expect(wrong.body.error.code).toBe('SIGN_IN_FAILED');
    expect(unknown.body.error).toEqual(wrong.body.error);
    await agent.get('/api/auth/me').expect(401);
  });

  it('reports every invalid sign-in field at once', async () => {
    const { agent, csrf } = await anonymous(app);
    const res = await agent.post('/api/auth/sign-in').set('x-csrf-token', csrf).send({ email: 'not-an-email', password: '' }).expect(400);
    expect(res.body.error.code).toBe('VALIDATION_FAILED');
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['email', 'password']);
  });

  it('rejects a state-changing request without the CSRF token, and with a forged one', async () => {
    const { agent } = await anonymous(app);
    const missing = await agent.post('/api/auth/sign-in').send({ email: demoEmail('admin'), password: DEMO_PASSWORD }).expect(403);
    expect(missing.body.error.code).toBe('CSRF_TOKEN_INVALID');
    const forged = await agent.post('/api/auth/sign-in').set('x-csrf-token', 'f'.repeat(64))
      .send({ email: demoEmail('admin'), password: DEMO_PASSWORD }).expect(403);
    expect(forged.body.error.code).toBe('CSRF_TOKEN_INVALID');
  });

  it('rejects a signed-in write that carries another session\'s CSRF token', async () => {
    const admin = await signIn(app, 'admin');
    const other = await signIn(app, 'assessor');
    const res = await admin.agent.post('/api/users').set('x-csrf-token', other.csrf)
      .send({ email: 'x@corran-firth.example', name: 'X Y', role: 'assessor', password: 'long-enough-pw' }).expect(403);
    expect(res.body.error.code).toBe('CSRF_TOKEN_INVALID');
  });

  it('rotates the session id at sign-in, so the pre-sign-in id is worthless', async () => {
    const { agent, csrf } = await anonymous(app);
    const first = await agent.post('/api/auth/sign-in').set('x-csrf-token', csrf).send({ email: demoEmail('licensee'), password: DEMO_PASSWORD }).expect(200);
    const oldCookie = sessionCookie(first).split(';')[0]!;
    // signing in again on the same session (as a fixated id would) gives a new id
    const again = await agent.post('/api/auth/sign-in').set('x-csrf-token', first.body.csrfToken).send({ email: demoEmail('licensee'), password: DEMO_PASSWORD }).expect(200);
    const newCookie = sessionCookie(again).split(';')[0]!;
    expect(newCookie).not.toBe(oldCookie);
    await request(app).get('/api/auth/me').set('Cookie', oldCookie).expect(401);
    await request(app).get('/api/auth/me').set('Cookie', newCookie).expect(200);
  });

  it('sets the session cookie and the anonymous CSRF cookie HttpOnly and SameSite=Strict', async () => {
    const { agent, csrf } = await anonymous(app);
    const res = await agent.post('/api/auth/sign-in').set('x-csrf-token', csrf).send({ email: demoEmail('board'), password: DEMO_PASSWORD }).expect(200);
    const anon = await request(app).get('/api/auth/csrf').expect(200);
    for (const cookie of [sessionCookie(res), ([] as string[]).concat(anon.headers['set-cookie'] ?? []).find((c) => c.startsWith('brinkmark.csrf='))!]) {
      expect(cookie).toMatch(/HttpOnly/i);
      expect(cookie).toMatch(/SameSite=Strict/i);
    }
  });

  it('signs out: the session no longer answers', async () => {
    const { agent, csrf } = await signIn(app, 'board');
    await agent.post('/api/auth/sign-out').set('x-csrf-token', csrf).expect(204);
    await agent.get('/api/auth/me').expect(401);
  });

  it('limits failed sign-in attempts per address', async () => {
    const limited = await testApp({ SIGNIN_LIMIT_PER_15_MIN: '3' });
    const { agent, csrf } = await anonymous(limited);
    for (let i = 0; i < 3; i++) {
      await agent.post('/api/auth/sign-in').set('x-csrf-token', csrf).send({ email: demoEmail('admin'), password: 'wrong-password' }).expect(401);
    }
    const res = await agent.post('/api/auth/sign-in').set('x-csrf-token', csrf).send({ email: demoEmail('admin'), password: DEMO_PASSWORD });
    expect(res.status).toBe(429);
    expect(res.body.error.code).toBe('TOO_MANY_SIGN_IN_ATTEMPTS');
  });

  it('answers malformed JSON with a clear error envelope', async () => {
    const { agent, csrf } = await anonymous(app);
    const res = await agent.post('/api/auth/sign-in').set('x-csrf-token', csrf).set('content-type', 'application/json').send('{"email":');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('BODY_MALFORMED');
  });
});
