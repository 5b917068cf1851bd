// Advisory e-mail goes to licensees whose subscription gives access now (paid, period not ended),
// and to nobody whose access has ended, was cancelled, or was never paid.
import bcrypt from 'bcrypt';
import type { Express } from 'express';
import { OutboxMail } from '../../api/mail/outbox.model';
import { Subscription, type SubscriptionStatus } from '../../api/subscriptions/subscription.models';
import { User } from '../../api/users/user.model';
import { submittedProposal } from './support/decided';
import { mailboxMark, received, recipients } from './support/mailbox';
import { signIn, testApp, type SignedIn } from './support/test-app';

const DAY = 86_400_000;

describe('advisory e-mail and subscription access', () => {
  let app: Express;
  let assessor: SignedIn;
  let chair: SignedIn;
  let odhran: SignedIn;
  const made: { users: User[]; subs: Subscription[] } = { users: [], subs: [] };
  const tag = Date.now();

  async function licensee(name: string, status: SubscriptionStatus, periodEndInDays: number | null): Promise<string> {
    const keeper = (await User.findOne({ where: { email: 'keeper@moorfell-estate.example' } }))!;
    const email = `${name}-${tag}@moorfell-estate.example`;
    const user = await User.create({ email, name: `Moorfell ${name}`, role: 'licensee', passwordHash: await bcrypt.hash('not-used-here', 4), organisation: 'Moorfell Estate', regionId: keeper.regionId });
    made.users.push(user);
    made.subs.push(await Subscription.create({
      userId: user.id, regionId: keeper.regionId!, plan: 'monthly', stripeCustomerId: `cus_${name}`, stripeCheckoutId: `cs_${name}_${tag}`, stripeSubscriptionId: null,
      status, currentPeriodEnd: periodEndInDays === null ? null : new Date(Date.now() + periodEndInDays * DAY),
    }));
    return email;
  }

  beforeAll(async () => {
    app = await testApp();
    assessor = await signIn(app, 'assessor');
    chair = await signIn(app, { email: 'maren.holt@corran-firth.example', password: 'corran-firth-demo' });
    odhran = await signIn(app, { email: 'odhran.pike@corran-firth.example', password: 'corran-firth-demo' });
  });

  afterAll(async () => {
    for (const s of made.subs) await s.destroy();
    for (const u of made.users) await u.destroy();
  });

  it('sends the advisory to a paying subscriber and to none whose access has ended, was cancelled or never began', async () => {
    const paying = await licensee('paying', 'active', 20);
    const lapsed = await licensee('lapsed', 'active', -1);
    const pastDue = await licensee('pastdue', 'past_due', -3);
    const cancelled = await licensee('cancelled', 'canceled', -10);
    const unpaid = await licensee('unpaid', 'pending', 30);
    const never = await licensee('never', 'pending', null);

    const mark = await mailboxMark();
    const { proposalId } = await submittedProposal(assessor, 'red-grouse', 0.75);
    for (const who of [odhran, chair]) {
      await who.agent.post(`/api/proposals/${proposalId}/board/votes`).set('x-csrf-token', who.csrf).send({ choice: 'approve', reason: 'Margin checked.' }).expect(201);
    }
    const res = await chair.agent.post(`/api/proposals/${proposalId}/board/decision`).set('x-csrf-token', chair.csrf).send({ outcome: 'approved', reason: 'Approved as proposed.' }).expect(201);
    await app.locals.mail.flush();

    const queued = (await OutboxMail.findAll({ where: { advisoryId: res.body.advisoryId } })).map((m) => m.toAddress);
    expect(queued).toContain(paying);
    const delivered = (await received(mark)).filter((m) => m.subject?.startsWith('Harvest advisory')).flatMap(recipients);
    expect(delivered).toContain(paying);
    for (const shut of [lapsed, pastDue, cancelled, unpaid, never]) {
      expect(queued).withContext(shut).not.toContain(shut);
      expect(delivered).withContext(shut).not.toContain(shut);
    }
  }, 240_000);
});
