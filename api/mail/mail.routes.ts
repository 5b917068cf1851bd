import { readdir, readFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { Router } from 'express';
import { type ParsedMail, simpleParser } from 'mailparser';
import type { Sequelize } from 'sequelize';
import { recordAudit } from '../audit/audit.service';
import type { Config } from '../config';
import { requireRole } from '../http/auth';
import { ConflictError, NotFoundError } from '../http/http-error';
import { idParam } from '../http/validate';
import type { MailSender } from './mail-sender';
import { OutboxMail } from './outbox.model';

const recipients = (m: ParsedMail) => (Array.isArray(m.to) ? m.to.map((a) => a.text).join(', ') : m.to?.text ?? '');

/** Mounted at /api/admin/mail: the outbox (what was queued, sent, failed) and what the local SMTP fake received. */
export function mailRoutes(config: Config, sequelize: Sequelize, sender: MailSender): Router {
  const dir = resolve(config.MAIL_FAKE_DIR);
  const router = Router();
  router.get('/', requireRole('admin'), async (_req, res) => {
    const outbox = await OutboxMail.findAll({ order: [['id', 'DESC']], limit: 200, attributes: { exclude: ['body'] } });
    const files = (await readdir(dir).catch(() => [] as string[])).filter((f) => f.endsWith('.eml')).sort().reverse().slice(0, 200);
    const received = await Promise.all(files.map(async (f) => {
      const m = await simpleParser(await readFile(join(dir, f)));
      return { file: f, to: recipients(m), subject: m.subject ?? '', date: m.date?.toISOString() ?? null, attachments: m.attachments.map((a) => a.filename ?? 'attachment') };
    }));
    res.json({ outbox, received });
  });
  // a message that gave up (or waits for its next try) is queued to go now; it keeps its dedupe key
  router.post('/outbox/:id/resend', requireRole('admin'), async (req, res) => {
    const id = idParam(req.params.id);
    const mail = await sequelize.transaction(async (t) => {
      const m = await OutboxMail.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE, attributes: { exclude: ['body'] } });
      if (!m) throw new NotFoundError('Message');
      if (m.status === 'sent') throw new ConflictError('MAIL_ALREADY_SENT', 'This message was delivered already.');
      if (m.status === 'sending') throw new ConflictError('MAIL_SENDING', 'This message is being sent right now.');
      await OutboxMail.update({ status: 'pending', nextAttemptAt: new Date() }, { where: { id }, transaction: t });
      await recordAudit({ actorId: req.user!.id, action: 'mail.resend', entityType: 'outbox', entityId: id, before: { status: m.status, attempts: m.attempts } }, t);
      return m;
    });
    sender.kick();
    res.status(202).json({ mail: { id: mail.id, status: 'pending' } });
  });
  router.get('/:file', requireRole('admin'), async (req, res) => {
    const name = String(req.params.file);
    if (!/^[\w.-]+\.eml$/.test(name)) throw new NotFoundError('Message');
    const raw = await readFile(join(dir, name)).catch(() => null);
    if (!raw) throw new NotFoundError('Message');
    const m = await simpleParser(raw);
    res.json({ subject: m.subject, from: m.from?.text, to: recipients(m), text: m.text, attachments: m.attachments.map((a) => ({ filename: a.filename, size: a.size })) });
  });
  return router;
}
