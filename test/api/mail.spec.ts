import { UniqueConstraintError } from 'sequelize';
import { MailSender } from '../../api/mail/mail-sender';
import { OutboxMail } from '../../api/mail/outbox.model';
import { received } from './support/mailbox';
import { signIn, testApp, testConfig } from './support/test-app';

describe('mail outbox', () => {
  it('retries a failed send with the error logged, then sends it exactly once', async () => {
    await testApp();
    const key = `test:${Date.now()}`;
    const subject = `Outbox check ${key}`;
    await OutboxMail.create({ dedupeKey: key, toAddress: 'office@skerry-boats.example', subject, body: 'Body.', advisoryId: null, lastError: null, messageId: null, nextAttemptAt: new Date(), sentAt: null });
    // a relay that is down: nothing listens on port 9 of this machine
    await new MailSender(testConfig({ SMTP_PORT: '9' })).flush();
    const failed = (await OutboxMail.findOne({ where: { dedupeKey: key } }))!;
    expect(failed.status).toBe('pending');
    expect(failed.attempts).toBe(1);
    expect(failed.lastError).toBeTruthy();
    expect(failed.nextAttemptAt.getTime()).toBeGreaterThan(Date.now());
    await failed.update({ nextAttemptAt: new Date() });
    const sender = new MailSender(testConfig());
    await Promise.all([sender.flush(), sender.flush(), new MailSender(testConfig()).flush()]);
    await sender.flush();
    const sent = (await OutboxMail.findOne({ where: { dedupeKey: key } }))!;
    expect(sent.status).toBe('sent');
    expect(sent.attempts).toBe(2);
    expect((await received()).filter((m) => m.subject === subject).length).toBe(1);
  });

  it('refuses to queue the same message twice (dedupe key)', async () => {
    await testApp();
    const row = { dedupeKey: `dup:${Date.now()}`, toAddress: 'x@corran-firth.example', subject: 's', body: 'b', advisoryId: null, lastError: null, messageId: null, nextAttemptAt: new Date(), sentAt: null };
    await OutboxMail.create(row);
    // the unique key on dedupe_key, not any other failure (a missing column or a lost connection)
    const err = await OutboxMail.create({ ...row, subject: 'another subject' }).then(() => null, (e: unknown) => e);
    expect(err).toBeInstanceOf(UniqueConstraintError);
    expect(Object.keys((err as UniqueConstraintError).fields)).toEqual(['dedupe_key']);
    expect(await OutboxMail.count({ where: { dedupeKey: row.dedupeKey } })).toBe(1);
  });

  it('shows the administrator the outbox and what the mail server received, and nobody else', async () => {
    const app = await testApp();
    const admin = await signIn(app, 'admin');
    const res = await admin.agent.get('/api/admin/mail').expect(200);
    expect(Array.isArray(res.body.outbox)).toBeTrue();
    expect(Array.isArray(res.body.received)).toBeTrue();
    const board = await signIn(app, 'board');
    await board.agent.get('/api/admin/mail').expect(403);
    await admin.agent.get('/api/admin/mail/..%2F..%2Fetc%2Fpasswd').expect(404);
  });
});
