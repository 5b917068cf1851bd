/**
 * Sends the outbox through SMTP (nodemailer). A row is claimed (pending → sending, with a lease)
 * before it is sent; a failure is retried for days with jittered exponential back-off; a row whose
 * lease ran out (the server stopped mid-send, or the outcome could not be written) is sent again.
 * Every message carries its dedupe key and a Message-ID derived from it, so a receiver recognises
 * a repeat after an unknown outcome. Nothing here ever rejects: the background loop logs and goes on.
 */
import { createHash } from 'node:crypto';
import nodemailer, { type Transporter } from 'nodemailer';
import { Op } from 'sequelize';
import { Advisory } from '../advisories/advisory.model';
import type { Config } from '../config';
import type { HealthReport } from '../health/health';
import { OutboxMail } from './outbox.model';

export const DEDUPE_HEADER = 'X-Brinkmark-Dedupe-Key';

export interface RetryPolicy {
  /** First wait after a failure; doubles with each attempt. */
  baseDelayMs: number;
  /** Longest wait between two attempts. */
  maxDelayMs: number;
  /** A message still unsent this long after it was queued is marked failed (the administrator can resend it). */
  giveUpAfterMs: number;
  /** How long a claimed row may stay `sending` before another pass takes it back. */
  leaseMs: number;
}

/** 30 s doubling to at most 30 min, for three days: an SMTP relay down for a weekend loses nothing. */
export const DEFAULT_RETRY: RetryPolicy = { baseDelayMs: 30_000, maxDelayMs: 30 * 60_000, giveUpAfterMs: 72 * 3_600_000, leaseMs: 5 * 60_000 };

/** The wait before attempt n+1 after n failures: exponential, capped, with "equal jitter" (half fixed, half random). */
export function retryDelayMs(failures: number, policy: RetryPolicy, random: () => number = Math.random): number {
  const ceiling = Math.min(policy.maxDelayMs, policy.baseDelayMs * 2 ** Math.max(0, failures - 1));
  return Math.round(ceiling / 2 + random() * (ceiling / 2));
}

/** The Message-ID of an outbox row: the same for every attempt, so a repeat is recognisable. */
export function messageIdFor(dedupeKey: string): string {
  return `<${createHash('sha256').update(dedupeKey).digest('hex').slice(0, 32)}@brinkmark.outbox>`;
}

export class MailSender {
  private readonly transport: Transporter;
  private running: Promise<void> | null = null;
  private requested = false;
  private timer: NodeJS.Timeout | null = null;
  private lastSuccessAt: Date | null = null;
  private lastFailure: { at: Date; message: string } | null = null;

  constructor(
    private readonly config: Config,
    private readonly policy: RetryPolicy = DEFAULT_RETRY,
    private readonly now: () => Date = () => new Date(),
  ) {
    this.transport = nodemailer.createTransport({
      host: config.SMTP_HOST, port: config.SMTP_PORT, secure: config.SMTP_SECURE,
      auth: config.SMTP_USER ? { user: config.SMTP_USER, pass: config.SMTP_PASSWORD } : undefined,
      tls: { rejectUnauthorized: config.NODE_ENV === 'production' },
      connectionTimeout: 5000, greetingTimeout: 5000, socketTimeout: 30_000,
    });
  }

  /** Sends everything due; resolves (never rejects) after a pass that began after this call. */
  flush(): Promise<void> {
    this.requested = true;
    this.running ??= (async () => {
      while (this.requested) {
        this.requested = false;
        try {
          await this.reclaimExpired();
          await this.sendDue();
        } catch (err) {
          // the database is away: the rows are untouched or leased, and the next pass picks them up
          console.error(`mail outbox pass stopped: ${(err as Error).message}`);
        }
      }
    })().finally(() => { this.running = null; });
    return this.running;
  }

  kick(): void {
    void this.flush();
  }

  start(everyMs = 5000): void {
    this.timer = setInterval(() => this.kick(), everyMs);
    this.timer.unref();
  }

  stop(): void {
    if (this.timer) clearInterval(this.timer);
  }

  /** Outbox counts and the relay's last outcome, for /api/health. */
  async health(): Promise<HealthReport> {
    const counts = Object.fromEntries(await Promise.all((['pending', 'sending', 'failed'] as const).map(async (s) => [s, await OutboxMail.count({ where: { status: s } })])));
    const relayFailing = this.lastFailure !== null && (this.lastSuccessAt === null || this.lastFailure.at > this.lastSuccessAt);
    return {
      status: relayFailing || counts.failed > 0 ? 'degraded' : 'up',
      detail: relayFailing ? `The mail relay refused the last message: ${this.lastFailure!.message}. Messages wait and are retried.`
        : counts.failed > 0 ? `${counts.failed} message(s) gave up; an administrator can resend them.` : undefined,
      figures: { ...counts, lastSuccessAt: this.lastSuccessAt?.toISOString() ?? null, lastFailureAt: this.lastFailure?.at.toISOString() ?? null },
    };
  }

  /** Rows left `sending` past their lease: the outcome is unknown, so they go back to the queue. */
  private async reclaimExpired(): Promise<void> {
    const [n] = await OutboxMail.update({ status: 'pending', lastError: 'The send was interrupted before its outcome was recorded; sending again.' }, {
      where: { status: 'sending', nextAttemptAt: { [Op.lte]: this.now() } },
    });
    if (n) console.error(`mail outbox: ${n} interrupted send(s) reclaimed`);
  }

  private async sendDue(): Promise<void> {
    const due = await OutboxMail.findAll({ where: { status: 'pending', nextAttemptAt: { [Op.lte]: this.now() } }, order: [['id', 'ASC']], limit: 50, attributes: { exclude: ['body'] } });
    for (const mail of due) {
      const lease = new Date(this.now().getTime() + this.policy.leaseMs);
      const [claimed] = await OutboxMail.update({ status: 'sending', nextAttemptAt: lease }, { where: { id: mail.id, status: 'pending' } });
      if (claimed !== 1) continue;
      await this.sendOne(mail.id);
    }
  }

  private async sendOne(id: number): Promise<void> {
    const mail = (await OutboxMail.findByPk(id))!;
    let messageId: string;
    try {
      const advisory = mail.advisoryId ? await Advisory.findByPk(mail.advisoryId, { attributes: ['docId', 'pdf'] }) : null;
      const info = await this.transport.sendMail({
        from: this.config.MAIL_FROM, to: mail.toAddress, subject: mail.subject, text: mail.body,
        messageId: messageIdFor(mail.dedupeKey), headers: { [DEDUPE_HEADER]: mail.dedupeKey },
        attachments: advisory ? [{ filename: `${advisory.docId}.pdf`, content: advisory.pdf, contentType: 'application/pdf' }] : [],
      });
      messageId = info.messageId;
    } catch (err) {
      await this.failed(mail, err as Error);
      return;
    }
    this.lastSuccessAt = this.now();
    // why: static update by id: the instance still holds 'pending' from before the claim
    await OutboxMail.update({ status: 'sent', sentAt: this.now(), messageId, attempts: mail.attempts + 1, lastError: null }, { where: { id: mail.id } });
  }

  private async failed(mail: OutboxMail, err: Error): Promise<void> {
    const attempts = mail.attempts + 1;
    this.lastFailure = { at: this.now(), message: err.message };
    const givingUp = this.now().getTime() - mail.createdAt.getTime() >= this.policy.giveUpAfterMs;
    console.error(`mail ${mail.id} to ${mail.toAddress} failed (attempt ${attempts}${givingUp ? ', giving up' : ''}): ${err.message}`);
    await OutboxMail.update({
      status: givingUp ? 'failed' : 'pending', attempts, lastError: err.message,
      nextAttemptAt: new Date(this.now().getTime() + retryDelayMs(attempts, this.policy)),
    }, { where: { id: mail.id } });
  }
}
