/** Weekly digests for licensees who chose them: one e-mail listing the advisories of their regions since the last. */
import { Op, type Sequelize } from 'sequelize';
import { Advisory } from '../advisories/advisory.model';
import { subscribedRegions } from '../advisories/advisory.service';
import { User } from '../users/user.model';
import { OutboxMail } from './outbox.model';

export const DIGEST_EVERY_MS = 7 * 86_400_000;

/** Queues the digests that are due at `now`; returns how many e-mails were queued. */
export async function queueDigests(sequelize: Sequelize, publicUrl: string, now = new Date()): Promise<number> {
  const users = await User.findAll({ where: { role: 'licensee', active: true, mailPreference: 'digest' } });
  let queued = 0;
  for (const u of users) {
    if (u.digestSentAt && now.getTime() - u.digestSentAt.getTime() < DIGEST_EVERY_MS) continue;
    const since = u.digestSentAt ?? new Date(now.getTime() - DIGEST_EVERY_MS);
    const regions = await subscribedRegions(u.id);
    const advisories = regions.length ? await Advisory.findAll({
      where: { regionId: regions, publishedAt: { [Op.gt]: since, [Op.lte]: now } },
      attributes: ['id', 'docId', 'title', 'summary', 'supersedesId', 'publishedAt'], order: [['publishedAt', 'ASC'], ['id', 'ASC']],
    }) : [];
    await sequelize.transaction(async (t) => {
      if (advisories.length) {
        const lines = advisories.map((a) => `- ${a.docId}${a.supersedesId ? ' (correction)' : ''}, ${a.publishedAt.toISOString().slice(0, 10)}: ${a.title}\n  ${a.summary}`);
        await OutboxMail.create({
          dedupeKey: `digest:user:${u.id}:${now.toISOString().slice(0, 10)}`, toAddress: u.email, advisoryId: null,
          subject: `Brinkmark digest: ${advisories.length} advisor${advisories.length === 1 ? 'y' : 'ies'} since ${since.toISOString().slice(0, 10)}`,
          body: `${lines.join('\n\n')}\n\nThe PDFs are in your portal: ${publicUrl}/portal\n\nYou chose a weekly digest; change this in your portal.\n\nThese figures are scientific advice to a competent authority, subject to local regulation and licensed practice.`,
          lastError: null, messageId: null, nextAttemptAt: now, sentAt: null,
        }, { transaction: t });
        queued++;
      }
      await u.update({ digestSentAt: now }, { transaction: t });
    });
  }
  return queued;
}
