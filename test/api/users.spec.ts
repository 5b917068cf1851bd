import type { Express } from 'express';
import { AuditEvent } from '../../api/audit/audit-event.model';
import { User } from '../../api/users/user.model';
import { signIn, testApp } from './support/test-app';

// A tag per run, so the specs also pass on a database that earlier runs left behind.
const RUN = Date.now().toString(36);

describe('user administration', () => {
  let app: Express;
  beforeAll(async () => {
    app = await testApp();
  });

  it('creates an account, audits it, and the new person can sign in', async () => {
    const { agent, csrf } = await signIn(app, 'admin');
    const res = await agent.post('/api/users').set('x-csrf-token', csrf)
      .send({ email: `Nell.Brack.${RUN}@corran-firth.example`, name: 'Nell Brack', role: 'assessor', password: 'a-long-first-password' })
      .expect(201);
    expect(res.body.user.email).toBe(`nell.brack.${RUN}@corran-firth.example`);
    const audit = await AuditEvent.findOne({ where: { action: 'user.create', entityId: res.body.user.id } });
    expect(audit).not.toBeNull();
    await signIn(app, { email: `nell.brack.${RUN}@corran-firth.example`, password: 'a-long-first-password' });
  });

  it('refuses a forged field and stores nothing', async () => {
    const { agent, csrf } = await signIn(app, 'admin');
    const before = await User.count();
    const res = await agent.post('/api/users').set('x-csrf-token', csrf)
      .send({ email: `forged.${RUN}@corran-firth.example`, name: 'Forged', role: 'admin', password: 'long-enough-pw', passwordHash: 'x' })
      .expect(400);
    expect(res.body.error.code).toBe('VALIDATION_FAILED');
    expect(await User.count()).toBe(before);
  });

  it('refuses a licensee without a region, naming the field', async () => {
    const { agent, csrf } = await signIn(app, 'admin');
    const res = await agent.post('/api/users').set('x-csrf-token', csrf)
      .send({ email: `no-region.${RUN}@corran-firth.example`, name: 'No Region', role: 'licensee', password: 'long-enough-pw' })
      .expect(400);
    expect(res.body.error.fields.regionId).toBeDefined();
  });

  it('refuses a duplicate e-mail with 409 EMAIL_TAKEN', async () => {
    const { agent, csrf } = await signIn(app, 'admin');
    const res = await agent.post('/api/users').set('x-csrf-token', csrf)
      .send({ email: 'tomas.reyl@corran-firth.example', name: 'Copy', role: 'assessor', password: 'long-enough-pw' })
      .expect(409);
    expect(res.body.error.code).toBe('EMAIL_TAKEN');
  });

  it('changes a role with before and after in the audit trail, and the change applies at once', async () => {
    const admin = await signIn(app, 'admin');
    const created = await admin.agent.post('/api/users').set('x-csrf-token', admin.csrf)
      .send({ email: `role.change.${RUN}@corran-firth.example`, name: 'Role Change', role: 'board', password: 'long-enough-pw' }).expect(201);
    const person = await signIn(app, { email: `role.change.${RUN}@corran-firth.example`, password: 'long-enough-pw' });
    await person.agent.get('/api/users').expect(403);
    await admin.agent.patch(`/api/users/${created.body.user.id}`).set('x-csrf-token', admin.csrf).send({ role: 'admin' }).expect(200);
    await person.agent.get('/api/users').expect(200);
    const audit = await AuditEvent.findOne({ where: { action: 'user.update', entityId: created.body.user.id } });
    expect((audit!.before as { role: string }).role).toBe('board');
    expect((audit!.after as { role: string }).role).toBe('admin');
  });

  it('does not let an administrator remove their own access', async () => {
    const { agent, csrf } = await signIn(app, 'admin');
    const me = await agent.get('/api/auth/me');
    const res = await agent.patch(`/api/users/${me.body.user.id}`).set('x-csrf-token', csrf).send({ active: false }).expect(409);
    expect(res.body.error.code).toBe('SELF_LOCKOUT');
  });

  it('shuts out a deactivated account on its next request', async () => {
    const admin = await signIn(app, 'admin');
    const created = await admin.agent.post('/api/users').set('x-csrf-token', admin.csrf)
      .send({ email: `leaver.${RUN}@corran-firth.example`, name: 'Leaver', role: 'assessor', password: 'long-enough-pw' }).expect(201);
    const person = await signIn(app, { email: `leaver.${RUN}@corran-firth.example`, password: 'long-enough-pw' });
    await admin.agent.patch(`/api/users/${created.body.user.id}`).set('x-csrf-token', admin.csrf).send({ active: false }).expect(200);
    await person.agent.get('/api/stocks').expect(401);
  });

  it('moves the chair to another board member, the previous chair stepping down, and refuses a chair who is not on the board', async () => {
    const { agent, csrf } = await signIn(app, 'admin');
    const holt = (await User.findOne({ where: { email: 'maren.holt@corran-firth.example' } }))!;
    const pike = (await User.findOne({ where: { email: 'odhran.pike@corran-firth.example' } }))!;
    const reyl = (await User.findOne({ where: { email: 'tomas.reyl@corran-firth.example' } }))!;
    try {
      await agent.patch(`/api/users/${pike.id}`).set('x-csrf-token', csrf).send({ boardChair: true }).expect(200);
      expect((await User.findAll({ where: { boardChair: true } })).map((u) => u.id)).toEqual([pike.id]);
      const refused = await agent.patch(`/api/users/${reyl.id}`).set('x-csrf-token', csrf).send({ boardChair: true }).expect(400);
      expect(refused.body.error.fields.boardChair).toBeDefined();
      expect((await User.findByPk(reyl.id))!.boardChair).toBeFalse();
    } finally {
      await agent.patch(`/api/users/${holt.id}`).set('x-csrf-token', csrf).send({ boardChair: true }).expect(200);
    }
    expect((await User.findAll({ where: { boardChair: true } })).map((u) => u.id)).toEqual([holt.id]);
  });

  it("moves a licensee to another region and resets a password without writing it to the audit trail", async () => {
    const { agent, csrf } = await signIn(app, 'admin');
    const created = await agent.post('/api/users').set('x-csrf-token', csrf)
      .send({ email: `moving.${RUN}@corran-firth.example`, name: 'Moving Boats', role: 'licensee', password: 'first-password-1', regionId: 1 }).expect(201);
    const id = created.body.user.id as number;
    expect((await agent.patch(`/api/users/${id}`).set('x-csrf-token', csrf).send({ regionId: 2 }).expect(200)).body.user.regionId).toBe(2);
    expect((await agent.post(`/api/users/${id}/password`).set('x-csrf-token', csrf).send({ password: 'short' }).expect(400)).body.error.fields.password).toBeDefined();
    await agent.post(`/api/users/${id}/password`).set('x-csrf-token', csrf).send({ password: 'second-password-2' }).expect(200);
    await signIn(app, { email: `moving.${RUN}@corran-firth.example`, password: 'second-password-2' });
    const entry = await AuditEvent.findOne({ where: { action: 'user.password.reset', entityId: id } });
    expect(JSON.stringify(entry?.after)).not.toContain('second-password-2');
  });
});
