// The SMTP relay down for hours (far longer than the old five tries over a minute), then back: every
// message is delivered exactly once, including one whose send was interrupted with its outcome unknown.
import { mkdtempSync, readdirSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { SMTPServer } from 'smtp-server';
import { startSmtpFake } from '../../api/fakes/smtp-fake';
import { DEDUPE_HEADER, DEFAULT_RETRY, MailSender, retryDelayMs } from '../../api/mail/mail-sender';
import { OutboxMail } from '../../api/mail/outbox.model';
import { testApp, testConfig } from './support/test-app';

const PORT = Number(process.env.TEST_PORT_BASE ?? 4390) + 6;

function deliveredKeys(dir: string): string[] {
  const header = new RegExp(`^${DEDUPE_HEADER}:\\s*(.+?)\\r?$`, 'im');
  return readdirSync(dir).filter((f) => f.endsWith('.eml')).map((f) => header.exec(readFileSync(join(dir, f), 'utf8'))?.[1] ?? '');
}

describe('mail through a long relay outage', () => {
  it('keeps retrying for hours, then delivers each message exactly once', async () => {
    await testApp();
    const dir = mkdtempSync(join(tmpdir(), 'brinkmark-mail-'));
    const tag = `outage:${Date.now()}`;
    const keys = [1, 2, 3].map((i) => `${tag}:${i}`);
    let clock = Date.now();
    const sender = new MailSender(testConfig({ SMTP_PORT: String(PORT) }), DEFAULT_RETRY, () => new Date(clock));
    for (const key of keys) {
      await OutboxMail.create({ dedupeKey: key, toAddress: 'office@skerry-boats.example', subject: `Advisory ${key}`, body: 'Body.', advisoryId: null, lastError: null, messageId: null, nextAttemptAt: new Date(clock), sentAt: null });
    }
    // three hours with the relay down, a pass every ten minutes
    for (let pass = 0; pass < 18; pass++) {
      await sender.flush();
      clock += 10 * 60_000;
    }
    const waiting = await OutboxMail.findAll({ where: { dedupeKey: keys } });
    expect(waiting.map((m) => m.status)).toEqual(['pending', 'pending', 'pending']);
    expect(Math.min(...waiting.map((m) => m.attempts))).toBeGreaterThan(5);

    // one row was claimed by a server that then stopped: it sits in 'sending' with an expired lease
    await OutboxMail.update({ status: 'sending', nextAttemptAt: new Date(clock - 1000) }, { where: { dedupeKey: keys[0] } });
    let relay: SMTPServer | null = await startSmtpFake(PORT, dir);
    try {
      clock += 40 * 60_000;
      await sender.flush();
      const sent = await OutboxMail.findAll({ where: { dedupeKey: keys } });
      expect(sent.map((m) => m.status)).toEqual(['sent', 'sent', 'sent']);
      // the first message's outcome is lost again after delivery: it is sent a second time, and recognised
      await OutboxMail.update({ status: 'sending', nextAttemptAt: new Date(clock - 1000) }, { where: { dedupeKey: keys[0] } });
      await sender.flush();
      expect((await OutboxMail.findOne({ where: { dedupeKey: keys[0] } }))!.status).toBe('sent');
      const delivered = deliveredKeys(dir).filter((k) => k.startsWith(tag)).sort();
      expect(delivered).toEqual(keys);
    } finally {
      await new Promise<void>((r) => relay!.close(() => r()));
      relay = null;
    }
  });

  it('spaces retries out with jitter, capped, so a retry storm cannot form', () => {
    const policy = DEFAULT_RETRY;
    // equal jitter: between half and all of min(cap, base·2^(n−1)) (common practice for retry back-off)
    expect(retryDelayMs(1, policy, () => 0)).toBe(policy.baseDelayMs / 2);
    expect(retryDelayMs(1, policy, () => 1)).toBe(policy.baseDelayMs);
    expect(retryDelayMs(30, policy, () => 1)).toBe(policy.maxDelayMs);
    expect(retryDelayMs(4, policy, () => 0.5)).toBe(0.75 * policy.baseDelayMs * 8);
  });
});
