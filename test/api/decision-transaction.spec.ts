// A board decision is one transaction: the decision row, its audit entry, the advisory with its PDF
// and the subscribers' e-mails are stored together or not at all, and two decides at once record one.
import type { Express } from 'express';
import { Advisory } from '../../api/advisories/advisory.model';
import { AuditEvent } from '../../api/audit/audit-event.model';
import { Decision } from '../../api/board/board.models';
import { OutboxMail } from '../../api/mail/outbox.model';
import { Subscription } from '../../api/subscriptions/subscription.models';
import { User } from '../../api/users/user.model';
import { submittedProposal } from './support/decided';
import { signIn, testApp, type SignedIn } from './support/test-app';

describe('a board decision as one transaction', () => {
  let app: Express;
  let assessor: SignedIn;
  let chair: SignedIn;
  let odhran: SignedIn;
  let subscription: Subscription;
  const member = (email: string) => signIn(app, { email, password: 'corran-firth-demo' });

  beforeAll(async () => {
    app = await testApp();
    assessor = await signIn(app, 'assessor');
    chair = await member('maren.holt@corran-firth.example');
    odhran = await member('odhran.pike@corran-firth.example');
    // a paying subscriber in the grouse's region, so an approval queues at least one e-mail
    const keeper = (await User.findOne({ where: { email: 'keeper@moorfell-estate.example' } }))!;
    subscription = await Subscription.create({ userId: keeper.id, regionId: keeper.regionId!, plan: 'yearly', stripeCustomerId: 'cus_tx', stripeCheckoutId: `cs_tx_${Date.now()}`, stripeSubscriptionId: null, status: 'active', currentPeriodEnd: new Date(Date.now() + 30 * 86_400_000) });
  });

  afterAll(async () => {
    await subscription.destroy();
  });

  /** A submitted grouse proposal with two approving votes: ready for the chair. */
  async function ready(): Promise<number> {
    const { proposalId } = await submittedProposal(assessor, 'red-grouse', 0.7);
    for (const who of [odhran, chair]) {
      await who.agent.post(`/api/proposals/${proposalId}/board/votes`).set('x-csrf-token', who.csrf).send({ choice: 'approve', reason: 'Margin checked.' }).expect(201);
    }
    return proposalId;
  }

  const approve = (proposalId: number) =>
    chair.agent.post(`/api/proposals/${proposalId}/board/decision`).set('x-csrf-token', chair.csrf).send({ outcome: 'approved', reason: 'Within the lower 5% of the fold harvest.' });

  /** What a decision on the proposal left behind anywhere. */
  async function traces(proposalId: number) {
    const decisions = await Decision.findAll({ where: { proposalId } });
    const audit = await AuditEvent.count({ where: { entityType: 'proposal', entityId: proposalId, action: 'proposal.approved' } });
    return { decisions: decisions.length, audit, advisories: await Advisory.count(), advisoryAudit: await AuditEvent.count({ where: { action: 'advisory.publish' } }), outbox: await OutboxMail.count() };
  }

  for (const [what, fail] of [
    ['the subscribers\' e-mail cannot be queued', () => spyOn(OutboxMail, 'create').and.rejectWith(new Error('outbox insert failed'))],
    ['the advisory with its PDF cannot be stored', () => spyOn(Advisory, 'create').and.rejectWith(new Error('advisory insert failed'))],
  ] as const) {
    it(`stores nothing of an approval when ${what} after the decision row is written, and the chair can decide again`, async () => {
      const proposalId = await ready();
      const before = await traces(proposalId);
      const decisionCreate = spyOn(Decision, 'create').and.callThrough();
      const spy = fail();
      const res = await approve(proposalId);
      expect(res.status).toBe(500);
      expect(decisionCreate).toHaveBeenCalledTimes(1);
      expect(spy).toHaveBeenCalled();
      expect(await traces(proposalId)).toEqual({ ...before, decisions: 0, audit: 0 });
      expect(before.decisions).toBe(0);
      spy.and.callThrough();
      const ok = await approve(proposalId).expect(201);
      const after = await traces(proposalId);
      expect(after.decisions).toBe(1);
      expect(after.audit).toBe(1);
      expect(after.advisories).toBe(before.advisories + 1);
      expect(after.outbox).toBeGreaterThan(before.outbox);
      expect(await OutboxMail.count({ where: { advisoryId: ok.body.advisoryId } })).toBeGreaterThan(0);
    }, 240_000);
  }

  it('records one decision and one advisory when the chair\'s approval arrives twice at once', async () => {
    const proposalId = await ready();
    const advisoriesBefore = await Advisory.count();
    const [a, b] = await Promise.all([approve(proposalId), approve(proposalId)]);
    expect([a.status, b.status].sort()).toEqual([201, 409]);
    expect((a.status === 409 ? a : b).body.error.code).toBe('ALREADY_DECIDED');
    expect(await Decision.count({ where: { proposalId } })).toBe(1);
    expect(await Advisory.count()).toBe(advisoriesBefore + 1);
    expect(await AuditEvent.count({ where: { entityType: 'proposal', entityId: proposalId, action: 'proposal.approved' } })).toBe(1);
  }, 240_000);
});
