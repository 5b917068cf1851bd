/**
 * Paid licensee subscriptions through Stripe Checkout. Our records change only from webhooks whose
 * signature the SDK has verified; every event id is stored, so a replay changes nothing.
 */
import type { Sequelize, Transaction } from 'sequelize';
import Stripe from 'stripe';
import { recordAudit } from '../audit/audit.service';
import type { Config } from '../config';
import { ConflictError, HttpError, NotFoundError } from '../http/http-error';
import { Region } from '../regions/region.model';
import { User } from '../users/user.model';
import type { MailPreference } from '../users/user.schemas';
import { Invoice, StripeEvent, Subscription, type SubscriptionStatus } from './subscription.models';
import { CURRENCY, PLAN_PRICES, type PlanView, type SubscriptionView } from './subscription.schemas';

/** The Stripe SDK, pointed at STRIPE_API_BASE (the local fake) unless that is empty. */
export function createStripe(config: Config): Stripe {
  if (!config.STRIPE_API_BASE) return new Stripe(config.STRIPE_SECRET_KEY);
  const u = new URL(config.STRIPE_API_BASE);
  return new Stripe(config.STRIPE_SECRET_KEY, { host: u.hostname, port: Number(u.port || 80), protocol: u.protocol.replace(':', '') as 'http' | 'https', maxNetworkRetries: 1, timeout: 10_000 });
}

/** How long a started checkout stays open; an unfinished one then expires and leaves the list. */
export const CHECKOUT_OPEN_MS = 30 * 60_000;

type StripeSub = Stripe.Subscription & { current_period_end?: number };

/** How far a webhook's stamp may be from now, either way (Stripe's default tolerance). */
const WEBHOOK_TOLERANCE_S = 300;

function webhookRefused(code: string, message: string, event: Stripe.Event): HttpError {
  console.error(`stripe webhook ${event.id} (${event.type}) refused: ${message}`);
  return new HttpError(400, code, message);
}

const isText = (v: unknown) => typeof v === 'string' && v.length > 0 && v.length < 256;
const isSeconds = (v: unknown) => typeof v === 'number' && Number.isInteger(v) && v > 0 && v < 4102444800;

/** What is wrong with an event's object for the types we apply, or null (other types are stored and ignored). */
function malformed(event: Stripe.Event): string | null {
  if (!isText(event.id) || !isText(event.type)) return 'no id or type';
  const o = (event.data as unknown as { object?: Record<string, unknown> } | undefined)?.object;
  if (!o || typeof o !== 'object') return 'no data.object';
  switch (event.type) {
    case 'checkout.session.completed':
      return isText(o.id) && isText(o.subscription) ? null : 'a checkout session needs an id and a subscription id';
    case 'customer.subscription.updated':
    case 'customer.subscription.deleted':
      return isText(o.id) && isText(o.status) ? null : 'a subscription needs an id and a status';
    case 'invoice.paid':
    case 'invoice.payment_failed':
      return isText(o.id) && isText(o.subscription) && typeof o.amount_due === 'number' && isText(o.currency) && isSeconds(o.period_start) && isSeconds(o.period_end)
        ? null : 'an invoice needs an id, a subscription, an amount, a currency and its period';
    default:
      return null;
  }
}

function periodEnd(sub: StripeSub): Date | null {
  const t = sub.current_period_end ?? sub.items?.data?.[0]?.current_period_end;
  return t ? new Date(t * 1000) : null;
}

function statusOf(s: string): SubscriptionStatus {
  if (s === 'active' || s === 'trialing') return 'active';
  if (s === 'past_due' || s === 'unpaid' || s === 'incomplete') return 'past_due';
  return 'canceled';
}

export class SubscriptionService {
  private prices: Map<string, string> | null = null;

  constructor(private readonly sequelize: Sequelize, private readonly stripe: Stripe, private readonly config: Config) {}

  async plans(): Promise<PlanView[]> {
    const regions = await Region.findAll({ order: [['name', 'ASC']] });
    return regions.flatMap((r) => (['monthly', 'yearly'] as const).map((plan) => ({ regionId: r.id, regionName: r.name, plan, amount: PLAN_PRICES[plan], currency: CURRENCY })));
  }

  /** Starts a Stripe Checkout for a region and plan; the subscription stays pending until Stripe confirms. */
  async checkout(user: Express.User, body: { regionId: number; plan: 'monthly' | 'yearly' }): Promise<{ url: string }> {
    const region = await Region.findByPk(body.regionId);
    if (!region) throw new NotFoundError('Region');
    const mine = await Subscription.findAll({ where: { userId: user.id } });
    if (mine.some((s) => s.regionId === region.id && s.grantsAccess())) throw new ConflictError('ALREADY_SUBSCRIBED', `You already have access to ${region.name}.`);
    try {
      const customer = mine[0]?.stripeCustomerId ?? (await this.stripe.customers.create({ email: user.email, name: user.name, metadata: { userId: String(user.id) } })).id;
      const price = await this.priceFor(region, body.plan);
      const session = await this.stripe.checkout.sessions.create({
        mode: 'subscription', customer, line_items: [{ price, quantity: 1 }], client_reference_id: String(user.id),
        metadata: { userId: String(user.id), regionId: String(region.id), plan: body.plan },
        success_url: `${this.config.PUBLIC_URL}/portal?checkout=done`, cancel_url: `${this.config.PUBLIC_URL}/portal?checkout=cancelled`,
        expires_at: Math.floor((Date.now() + CHECKOUT_OPEN_MS) / 1000),
      });
      await this.sequelize.transaction(async (t) => {
        const s = await Subscription.create({ userId: user.id, regionId: region.id, plan: body.plan, stripeCustomerId: customer, stripeCheckoutId: session.id, stripeSubscriptionId: null, status: 'pending', currentPeriodEnd: null }, { transaction: t });
        await recordAudit({ actorId: user.id, action: 'subscription.checkout', entityType: 'subscription', entityId: s.id, after: { regionId: region.id, plan: body.plan } }, t);
      });
      return { url: session.url! };
    } catch (err) {
      if (err instanceof HttpError) throw err;
      throw new HttpError(502, 'PAYMENT_PROVIDER_UNAVAILABLE', `The payment provider did not answer: ${(err as Error).message}`);
    }
  }

  async mine(userId: number): Promise<SubscriptionView[]> {
    const subs = await Subscription.findAll({ where: { userId }, order: [['id', 'DESC']] });
    const regions = new Map((await Region.findAll()).map((r) => [r.id, r.name]));
    const invoices = await Invoice.findAll({ where: { subscriptionId: subs.map((s) => s.id) }, order: [['periodStart', 'DESC']] });
    return subs.filter((s) => s.status !== 'pending' || Date.now() - s.createdAt.getTime() < CHECKOUT_OPEN_MS).map((s) => ({
      id: s.id, regionId: s.regionId, regionName: regions.get(s.regionId) ?? '', plan: s.plan, status: s.status, cancelAtPeriodEnd: s.cancelAtPeriodEnd,
      currentPeriodEnd: s.currentPeriodEnd?.toISOString() ?? null, hasAccess: s.grantsAccess(),
      invoices: invoices.filter((i) => i.subscriptionId === s.id).map((i) => ({ id: i.id, amount: i.amount, currency: i.currency, status: i.status, periodStart: i.periodStart.toISOString(), periodEnd: i.periodEnd.toISOString() })),
    }));
  }

  /** The licensee's choice of advisory mail (audited). */
  async setMailPreference(user: Express.User, mailPreference: MailPreference): Promise<{ mailPreference: MailPreference }> {
    return this.sequelize.transaction(async (t) => {
      const u = (await User.findByPk(user.id, { transaction: t, lock: t.LOCK.UPDATE }))!;
      const before = { mailPreference: u.mailPreference };
      await u.update({ mailPreference }, { transaction: t });
      await recordAudit({ actorId: user.id, action: 'user.mail-preference', entityType: 'user', entityId: user.id, before, after: { mailPreference } }, t);
      return { mailPreference };
    });
  }

  /**
   * Abandons the licensee's unfinished checkouts (declined card, back from the payment page): each is
   * expired at Stripe and its pending record removed, so it leaves the list.
   */
  async abandonPending(user: Express.User): Promise<{ removed: number }> {
    const pending = await Subscription.findAll({ where: { userId: user.id, status: 'pending' } });
    let removed = 0;
    for (const s of pending) {
      try {
        await this.stripe.checkout.sessions.expire(s.stripeCheckoutId);
      } catch (err) {
        // a session that is no longer open (completed in the meantime) is left to its webhook
        if ((err as { statusCode?: number }).statusCode !== 400) throw new HttpError(502, 'PAYMENT_PROVIDER_UNAVAILABLE', `The payment provider did not answer: ${(err as Error).message}`);
        continue;
      }
      await this.sequelize.transaction(async (t) => {
        const row = await Subscription.findByPk(s.id, { transaction: t, lock: t.LOCK.UPDATE });
        if (row?.status !== 'pending') return;
        await recordAudit({ actorId: user.id, action: 'subscription.checkout.abandon', entityType: 'subscription', entityId: row.id, before: { status: 'pending', regionId: row.regionId } }, t);
        await row.destroy({ transaction: t });
        removed++;
      });
    }
    return { removed };
  }

  /** Asks Stripe to end the subscription at the end of the paid period; our record follows the webhook. */
  async cancel(user: Express.User, id: number): Promise<{ requested: true }> {
    const s = await Subscription.findOne({ where: { id, userId: user.id } });
    if (!s || !s.stripeSubscriptionId) throw new NotFoundError('Subscription');
    if (s.status === 'canceled' || s.cancelAtPeriodEnd) throw new ConflictError('ALREADY_CANCELLED', 'This subscription already ends at the close of its period.');
    await this.stripe.subscriptions.update(s.stripeSubscriptionId, { cancel_at_period_end: true });
    return { requested: true };
  }

  /** Verifies, de-duplicates and applies one webhook event; bad or unknown content is a 400 with a log line, never a 500. */
  async webhook(raw: Buffer, signature: string | undefined): Promise<{ received: true; duplicate: boolean }> {
    let event: Stripe.Event;
    try {
      event = this.stripe.webhooks.constructEvent(raw, signature ?? '', this.config.STRIPE_WEBHOOK_SECRET, WEBHOOK_TOLERANCE_S);
    } catch {
      throw new HttpError(400, 'WEBHOOK_SIGNATURE_INVALID', 'The webhook signature does not verify; the event was ignored.');
    }
    // the SDK refuses stamps too old (a replay); a stamp from the future is refused here
    const stamp = Number(/(?:^|,)t=(\d+)/.exec(signature ?? '')?.[1]);
    if (!Number.isFinite(stamp) || stamp > Date.now() / 1000 + WEBHOOK_TOLERANCE_S) {
      throw webhookRefused('WEBHOOK_TIMESTAMP_INVALID', `The webhook is stamped more than ${WEBHOOK_TOLERANCE_S / 60} minutes ahead; the event was ignored.`, event);
    }
    const problem = malformed(event);
    if (problem) throw webhookRefused('WEBHOOK_EVENT_MALFORMED', `The webhook event is not usable: ${problem}.`, event);
    let fetched: StripeSub | null = null;
    if (event.type === 'checkout.session.completed') {
      const id = String((event.data.object as Stripe.Checkout.Session).subscription);
      fetched = await this.stripe.subscriptions.retrieve(id).then((x) => x as StripeSub, (err: { statusCode?: number; message?: string }) => {
        if (err.statusCode && err.statusCode >= 400 && err.statusCode < 500) throw webhookRefused('WEBHOOK_OBJECT_UNKNOWN', `Stripe does not know subscription ${id}.`, event);
        throw new HttpError(502, 'PAYMENT_PROVIDER_UNAVAILABLE', `The payment provider did not answer: ${err.message ?? 'no answer'}`);
      });
    }
    return this.sequelize.transaction(async (t) => {
      const [, created] = await StripeEvent.findOrCreate({ where: { id: event.id }, defaults: { id: event.id, type: event.type }, transaction: t, lock: t.LOCK.UPDATE });
      if (!created) return { received: true as const, duplicate: true };
      await this.apply(event, fetched, t);
      return { received: true as const, duplicate: false };
    });
  }

  private async apply(event: Stripe.Event, fetched: StripeSub | null, t: Transaction): Promise<void> {
    const audit = (s: Subscription, before: unknown) => recordAudit({ actorId: null, action: `stripe.${event.type}`, entityType: 'subscription', entityId: s.id, before, after: { status: s.status, currentPeriodEnd: s.currentPeriodEnd, cancelAtPeriodEnd: s.cancelAtPeriodEnd, event: event.id } }, t);
    if (event.type === 'checkout.session.completed') {
      const session = event.data.object as Stripe.Checkout.Session;
      const s = await Subscription.findOne({ where: { stripeCheckoutId: session.id }, transaction: t, lock: t.LOCK.UPDATE });
      if (!s || !fetched) throw webhookRefused('WEBHOOK_OBJECT_UNKNOWN', `No checkout ${session.id} is on record.`, event);
      const before = { status: s.status };
      await s.update({ stripeSubscriptionId: fetched.id, status: statusOf(fetched.status), currentPeriodEnd: periodEnd(fetched), cancelAtPeriodEnd: fetched.cancel_at_period_end }, { transaction: t });
      await audit(s, before);
      // earlier unfinished checkouts for the same region (a declined card, say) are done with
      const stale = await Subscription.findAll({ where: { userId: s.userId, regionId: s.regionId, status: 'pending' }, transaction: t });
      for (const p of stale) {
        await recordAudit({ actorId: null, action: 'subscription.checkout.superseded', entityType: 'subscription', entityId: p.id, before: { status: 'pending' }, after: { by: s.id } }, t);
        await p.destroy({ transaction: t });
      }
    } else if (event.type === 'checkout.session.expired') {
      const session = event.data.object as Stripe.Checkout.Session;
      const s = await Subscription.findOne({ where: { stripeCheckoutId: session.id, status: 'pending' }, transaction: t, lock: t.LOCK.UPDATE });
      if (!s) return;
      await recordAudit({ actorId: null, action: 'stripe.checkout.session.expired', entityType: 'subscription', entityId: s.id, before: { status: 'pending' }, after: { event: event.id } }, t);
      await s.destroy({ transaction: t });
    } else if (event.type === 'customer.subscription.updated' || event.type === 'customer.subscription.deleted') {
      const sub = event.data.object as StripeSub;
      const s = await Subscription.findOne({ where: { stripeSubscriptionId: sub.id }, transaction: t, lock: t.LOCK.UPDATE });
      if (!s) throw webhookRefused('WEBHOOK_OBJECT_UNKNOWN', `No subscription ${sub.id} is on record.`, event);
      const before = { status: s.status, cancelAtPeriodEnd: s.cancelAtPeriodEnd };
      const deleted = event.type === 'customer.subscription.deleted';
      const status = deleted ? 'canceled' : statusOf(sub.status);
      await s.update({
        status, cancelAtPeriodEnd: status === 'past_due' || sub.cancel_at_period_end,
        currentPeriodEnd: deleted ? new Date(((sub as { ended_at?: number }).ended_at ?? Date.now() / 1000) * 1000) : periodEnd(sub),
      }, { transaction: t });
      await audit(s, before);
    } else if (event.type === 'invoice.paid' || event.type === 'invoice.payment_failed') {
      const inv = event.data.object as Stripe.Invoice & { subscription?: string; period_start: number; period_end: number };
      const s = await Subscription.findOne({ where: { stripeSubscriptionId: String(inv.subscription) }, transaction: t, lock: t.LOCK.UPDATE });
      if (!s) throw webhookRefused('WEBHOOK_OBJECT_UNKNOWN', `No subscription ${String(inv.subscription)} is on record for invoice ${inv.id}.`, event);
      await Invoice.upsert({ id: inv.id!, subscriptionId: s.id, amount: inv.amount_due, currency: inv.currency, status: inv.status ?? 'open', periodStart: new Date(inv.period_start * 1000), periodEnd: new Date(inv.period_end * 1000) }, { transaction: t });
      if (event.type === 'invoice.payment_failed') {
        const before = { status: s.status };
        await s.update({ status: 'past_due', cancelAtPeriodEnd: true }, { transaction: t });
        await audit(s, before);
      }
    }
  }

  private async priceFor(region: Region, plan: 'monthly' | 'yearly'): Promise<string> {
    const key = `bm-${region.code}-${plan}`;
    if (this.prices?.has(key)) return this.prices.get(key)!;
    this.prices ??= new Map();
    const found = await this.stripe.prices.list({ lookup_keys: [key] });
    const price = found.data[0] ?? await this.stripe.prices.create({
      currency: CURRENCY, unit_amount: PLAN_PRICES[plan], recurring: { interval: plan === 'monthly' ? 'month' : 'year' }, lookup_key: key,
      product_data: { name: `Brinkmark advisories, ${region.name} (${plan})` },
    });
    this.prices.set(key, price.id);
    return price.id;
  }
}
