import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Express } from 'express';
import Stripe from 'stripe';
import request from 'supertest';
import { AuditEvent } from '../../api/audit/audit-event.model';
import { Region } from '../../api/regions/region.model';
import { StripeEvent, Subscription } from '../../api/subscriptions/subscription.models';
import { DEMO_PASSWORD } from '../../seeders/demo-people';
import { signIn, testApp, testConfig } from './support/test-app';

const FAKE = process.env.STRIPE_API_BASE ?? 'http://127.0.0.1:4322';
const SECRET = testConfig().STRIPE_WEBHOOK_SECRET;

async function until<T>(f: () => Promise<T>, ok: (v: T) => boolean, what: string): Promise<T> {
  const deadline = Date.now() + 20_000;
  for (;;) {
    const v = await f();
    if (ok(v)) return v;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

describe('licensee subscriptions through the Stripe fake', () => {
  let app: Express;
  let server: Server;
  let base: string;
  let agent: ReturnType<typeof request.agent>;
  let csrf: string;
  let moorfell: Region;
  let innerFirth: Region;
  let skerry: Region;
  let shoals: Region;

  beforeAll(async () => {
    app = await testApp();
    server = app.listen(0, '127.0.0.1');
    await new Promise((r) => server.once('listening', r));
    base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    await fetch(`${FAKE}/_fake/config`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ webhookUrl: `${base}/api/stripe/webhook` }) });
    moorfell = (await Region.findOne({ where: { code: 'moorfell' } }))!;
    innerFirth = (await Region.findOne({ where: { code: 'inner-firth' } }))!;
    skerry = (await Region.findOne({ where: { code: 'skerry-reach' } }))!;
    shoals = (await Region.findOne({ where: { code: 'outer-shoals' } }))!;
    // a licensee of this spec's own, so other specs' subscriptions do not interfere
    const admin = await signIn(app, 'admin');
    const email = `estate.${Date.now().toString(36)}@moorfell-estate.example`;
    await admin.agent.post('/api/users').set('x-csrf-token', admin.csrf).send({ email, name: 'Upper Moorfell Shoot', role: 'licensee', password: DEMO_PASSWORD, regionId: moorfell.id }).expect(201);
    agent = request.agent(base);
    const token = await agent.get('/api/auth/csrf');
    const login = await agent.post('/api/auth/sign-in').set('x-csrf-token', token.body.csrfToken).send({ email, password: DEMO_PASSWORD }).expect(200);
    csrf = login.body.csrfToken;
  });

  afterAll(() => new Promise<void>((r) => server.close(() => r())));

  const mine = async () => (await agent.get('/api/subscriptions').expect(200)).body.subscriptions as { id: number; regionId: number; status: string; hasAccess: boolean; cancelAtPeriodEnd: boolean; invoices: unknown[] }[];
  const forRegion = async (regionId: number) => (await mine()).find((s) => s.regionId === regionId);

  async function checkout(regionId: number, plan: 'monthly' | 'yearly', card: string) {
    const res = await agent.post('/api/subscriptions/checkout').set('x-csrf-token', csrf).send({ regionId, plan }).expect(201);
    const page = await fetch(res.body.url);
    expect(await page.text()).toContain('Pay and subscribe');
    return fetch(`${res.body.url}/pay`, { method: 'POST', headers: { 'content-type': 'application/x-www-form-urlencoded' }, body: `card=${encodeURIComponent(card)}&exp=12%2F30&cvc=123`, redirect: 'manual' });
  }

  it('checkout with the test card → signed webhook → active, with its invoice', async () => {
    const pay = await checkout(moorfell.id, 'monthly', '4242 4242 4242 4242');
    expect(pay.status).toBe(303);
    expect(pay.headers.get('location')).toContain('/portal?checkout=done');
    const sub = await until(() => forRegion(moorfell.id), (s) => s?.status === 'active' && s.invoices.length > 0, 'the subscription to become active');
    expect(sub!.hasAccess).toBeTrue();
    const invoice = (sub as unknown as { invoices: { amount: number; periodStart: string; periodEnd: string }[] }).invoices[0]!;
    expect(invoice.amount).toBe(4900);
    expect((Date.parse(invoice.periodEnd) - Date.parse(invoice.periodStart)) / 86_400_000).toBe(30);
    const again = await agent.post('/api/subscriptions/checkout').set('x-csrf-token', csrf).send({ regionId: moorfell.id, plan: 'yearly' }).expect(409);
    expect(again.body.error.code).toBe('ALREADY_SUBSCRIBED');
  });

  it('rejects a webhook with a forged signature and stores nothing', async () => {
    const before = await StripeEvent.count();
    const payload = JSON.stringify({ id: 'evt_forged', object: 'event', type: 'customer.subscription.deleted', data: { object: { id: 'sub_x' } } });
    const res = await request(app).post('/api/stripe/webhook').set('content-type', 'application/json').set('stripe-signature', `t=${Math.floor(Date.now() / 1000)},v1=${'0'.repeat(64)}`).send(payload).expect(400);
    expect(res.body.error.code).toBe('WEBHOOK_SIGNATURE_INVALID');
    expect(await StripeEvent.count()).toBe(before);
  });

  async function activeIn(region: Region) {
    const pay = await checkout(region.id, 'monthly', '4242 4242 4242 4242');
    expect(pay.status).toBe(303);
    await until(() => forRegion(region.id), (s) => s?.status === 'active', `active in ${region.code}`);
    return (await Subscription.findOne({ where: { regionId: region.id, status: 'active' }, order: [['id', 'DESC']] }))!;
  }

  it('applies a signed event once and ignores its replay', async () => {
    const row = await Subscription.create({ userId: 1, regionId: innerFirth.id, plan: 'monthly', stripeCustomerId: 'cus_replay', stripeCheckoutId: `cs_replay_${Date.now()}`, stripeSubscriptionId: `sub_replay_${Date.now()}`, status: 'active', currentPeriodEnd: new Date(Date.now() + 86_400_000) });
    const event = { id: `evt_replay_${Date.now()}`, object: 'event', type: 'customer.subscription.updated', created: 1, data: { object: { id: row.stripeSubscriptionId, object: 'subscription', status: 'active', cancel_at_period_end: false, current_period_end: Math.floor(Date.now() / 1000) + 40 * 86400 } } };
    const payload = JSON.stringify(event);
    const send = () => request(app).post('/api/stripe/webhook').set('content-type', 'application/json')
      .set('stripe-signature', Stripe.webhooks.generateTestHeaderString({ payload, secret: SECRET })).send(payload).expect(200);
    expect((await send()).body.duplicate).toBeFalse();
    const audits = await AuditEvent.count();
    const end = (await row.reload()).currentPeriodEnd!.getTime();
    expect((await send()).body.duplicate).toBeTrue();
    expect(await AuditEvent.count()).toBe(audits);
    expect((await row.reload()).currentPeriodEnd!.getTime()).toBe(end);
  });

  it('a declined card leaves the subscription pending and gives no access', async () => {
    const pay = await checkout(innerFirth.id, 'yearly', '4000 0000 0000 0002');
    expect(pay.status).toBe(200);
    expect(await pay.text()).toContain('Your card was declined.');
    const row = await Subscription.findOne({ where: { regionId: innerFirth.id }, order: [['id', 'DESC']] });
    expect(row!.status).toBe('pending');
    expect(row!.grantsAccess()).toBeFalse();
  });

  it('a declined checkout that is abandoned expires at Stripe and leaves the list; a later payment for the region clears any other', async () => {
    // a region of this spec's own, so the other specs' subscriptions do not interfere
    const bay = await Region.create({ code: `bay-${Date.now().toString(36)}`, name: 'Test Bay', description: null });
    const declined = await checkout(bay.id, 'monthly', '4000 0000 0000 0002');
    expect(await declined.text()).toContain('Your card was declined.');
    expect((await mine()).filter((x) => x.regionId === bay.id).map((x) => x.status)).toEqual(['pending']);
    const pendingRow = (await Subscription.findOne({ where: { regionId: bay.id, status: 'pending' }, order: [['id', 'DESC']] }))!;
    expect((await agent.post('/api/subscriptions/abandon-pending').set('x-csrf-token', csrf).expect(200)).body.removed).toBeGreaterThanOrEqual(1);
    expect(await Subscription.findByPk(pendingRow.id)).toBeNull();
    expect((await mine()).filter((x) => x.regionId === bay.id)).toEqual([]);
    const session = await (await fetch(`${FAKE}/v1/checkout/sessions/${pendingRow.stripeCheckoutId}`, { headers: { authorization: 'Bearer sk_test_brinkmark' } })).json() as { status: string };
    expect(session.status).toBe('expired');
    // a declined try left behind, then a card that pays: only the paid subscription remains
    await checkout(bay.id, 'monthly', '4000 0000 0000 0002');
    await checkout(bay.id, 'monthly', '4242 4242 4242 4242');
    const rows = await until(() => mine(), (l) => { const r = l.filter((x) => x.regionId === bay.id); return r.length === 1 && r[0]!.status === 'active'; }, 'the declined checkout to leave');
    expect(rows.filter((x) => x.regionId === bay.id).map((x) => x.status)).toEqual(['active']);
  });

  it('an expired checkout session (Stripe\'s webhook) removes its pending record', async () => {
    const res = await agent.post('/api/subscriptions/checkout').set('x-csrf-token', csrf).send({ regionId: innerFirth.id, plan: 'monthly' }).expect(201);
    const row = (await Subscription.findOne({ where: { regionId: innerFirth.id, status: 'pending' }, order: [['id', 'DESC']] }))!;
    const sid = String(res.body.url).split('/').pop()!;
    expect(row.stripeCheckoutId).toBe(sid);
    await fetch(`${FAKE}/v1/checkout/sessions/${sid}/expire`, { method: 'POST', headers: { authorization: 'Bearer sk_test_brinkmark' } });
    await until(() => Subscription.findByPk(row.id), (r) => r === null, 'the expired checkout to be removed');
  });

  it('a failed renewal keeps access to the end of the paid period, then cancellation ends it', async () => {
    const row = await activeIn(skerry);
    await fetch(`${FAKE}/_fake/subscriptions/${row.stripeSubscriptionId}/renew`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ outcome: 'failed' }) });
    const pastDue = await until(() => forRegion(skerry.id), (s) => s?.status === 'past_due', 'past_due');
    expect(pastDue!.cancelAtPeriodEnd).toBeTrue();
    expect(pastDue!.hasAccess).toBeTrue();
    await fetch(`${FAKE}/_fake/subscriptions/${row.stripeSubscriptionId}/expire`, { method: 'POST' });
    const ended = await until(() => forRegion(skerry.id), (s) => s?.status === 'canceled', 'canceled');
    expect(ended!.hasAccess).toBeFalse();
  });

  it('cancelling asks Stripe, and the record changes only when the webhook says so', async () => {
    const active = await activeIn(shoals);
    expect(active.cancelAtPeriodEnd).toBeFalse();
    const res = await agent.post(`/api/subscriptions/${active.id}/cancel`).set('x-csrf-token', csrf).expect(202);
    expect(res.body.requested).toBeTrue();
    const cancelling = await until(() => forRegion(shoals.id), (s) => s?.cancelAtPeriodEnd === true, 'cancel at period end');
    expect(cancelling!.status).toBe('active');
    expect(cancelling!.hasAccess).toBeTrue();
  });
});
