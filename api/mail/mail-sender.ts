/**
 * Sends the outbox through SMTP (nodemailer). A row is claimed before it is sent, so it is never
 * sent twice; a failure is retried with back-off and logged on the row, and never undoes the event
 * that queued it.
 */
import nodemailer, { type Transporter } from 'nodemailer';
import { Op } from 'sequelize';
import { Advisory } from '../advisories/advisory.model';
import type { Config } from '../config';
import { OutboxMail } from './outbox.model';

const MAX_ATTEMPTS = 5;

export class MailSender {
  private readonly transport: Transporter;
  private running: Promise<void> | null = null;
  private requested = false;
  private timer: NodeJS.Timeout | null = null;

  constructor(private readonly config: Config) {
    this.transport = nodemailer.createTransport({
      host: config.SMTP_HOST, port: config.SMTP_PORT, secure: config.SMTP_SECURE,
      auth: config.SMTP_USER ? { user: config.SMTP_USER, pass: config.SMTP_PASSWORD } : undefined,
      tls: { rejectUnauthorized: config.NODE_ENV === 'production' },
      connectionTimeout: 5000,
    });
  }

  /** Sends everything due; resolves after a pass that began after this call (a call during a pass asks for one more). */
  flush(): Promise<void> {
    this.requested = true;
    this.running ??= (async () => {
      while (this.requested) {
        this.requested = false;
        await this.sendDue();
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

  private async sendDue(): Promise<void> {
    const due = await OutboxMail.findAll({ where: { status: 'pending', nextAttemptAt: { [Op.lte]: new Date() } }, order: [['id', 'ASC']], limit: 50 });
    for (const mail of due) {
      const [claimed] = await OutboxMail.update({ status: 'sending' }, { where: { id: mail.id, status: 'pending' } });
      if (claimed !== 1) continue;
      try {
        const advisory = mail.advisoryId ? await Advisory.findByPk(mail.advisoryId, { attributes: ['docId', 'pdf'] }) : null;
        const info = await this.transport.sendMail({
          from: this.config.MAIL_FROM, to: mail.toAddress, subject: mail.subject, text: mail.body,
          attachments: advisory ? [{ filename: `${advisory.docId}.pdf`, content: advisory.pdf, contentType: 'application/pdf' }] : [],
        });
        // why: static updates: the instance still holds 'pending' from before the claim, so instance.update would skip that field
        await OutboxMail.update({ status: 'sent', sentAt: new Date(), messageId: info.messageId, attempts: mail.attempts + 1, lastError: null }, { where: { id: mail.id } });
      } catch (err) {
        const attempts = mail.attempts + 1;
        console.error(`mail ${mail.id} to ${mail.toAddress} failed (attempt ${attempts}): ${(err as Error).message}`);
        await OutboxMail.update({
          status: attempts >= MAX_ATTEMPTS ? 'failed' : 'pending', attempts, lastError: (err as Error).message,
          nextAttemptAt: new Date(Date.now() + 2 ** attempts * 1000),
        }, { where: { id: mail.id } });
      }
    }
  }
}
