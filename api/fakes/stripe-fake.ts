/**
 * A local fake of the parts of the Stripe API Brinkmark uses: customers, prices, Checkout Sessions
 * with a hosted page where a test card is entered, subscriptions (renewal, failed payment,
 * cancellation), invoices, and webhooks signed as Stripe signs them (t=…,v1=HMAC-SHA256).
 * Test cards: 4242 4242 4242 4242 pays; 4000 0000 0000 0002 is declined.
 */
import { createHmac, randomBytes } from 'node:crypto';
import type { Server } from 'node:http';
import express, { type Request, type Response } from 'express';

type Obj = Record<string, unknown> & { id: string };
const id = (prefix: string) => `${prefix}_${randomBytes(12).toString('hex')}`;
const now = () => Math.floor(Date.now() / 1000);
/** Length of one billing period of a price, in seconds. */
const periodSeconds = (price: Obj) => ((price.recurring as { interval: string }).interval === 'year' ? 365 : 30) * 86400;
const esc = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

export interface StripeFakeOptions {
  port: number;
  webhookUrl: string;
  webhookSecret: string;
}

export class StripeFake {
  private readonly store = { customers: new Map<string, Obj>(), prices: new Map<string, Obj>(), sessions: new Map<string, Obj>(), subscriptions: new Map<string, Obj>(), invoices: new Map<string, Obj>() };
  private server: Server | null = null;
  readonly delivered: { type: string; status: number }[] = [];

  constructor(private opts: StripeFakeOptions) {}

  start(): Promise<void> {
    const app = express();
    // the SDK sends arrays as lookup_keys[0]=…; Express 5's default query parser would drop them
    app.set('query parser', 'extended');
    app.use(express.urlencoded({ extended: true }));
    app.use(express.json());
    const api = express.Router();
    api.use((req, res, next) => (req.headers.authorization?.startsWith('Bearer sk_') ? next() : this.error(res, 401, 'Invalid API Key provided.')));
    api.post('/customers', (req, res) => res.json(this.put('customers', { id: id('cus'), object: 'customer', email: req.body.email, name: req.body.name, metadata: req.body.metadata ?? {} })));
    api.get('/prices', (req, res) => {
      const keys = ([] as string[]).concat((req.query.lookup_keys as string[] | string | undefined) ?? []);
      const data = [...this.store.prices.values()].filter((p) => keys.length === 0 || keys.includes(p.lookup_key as string));
      res.json({ object: 'list', data, has_more: false, url: '/v1/prices' });
    });
    api.post('/prices', (req, res) => res.json(this.put('prices', {
      id: id('price'), object: 'price', currency: req.body.currency, unit_amount: Number(req.body.unit_amount), lookup_key: req.body.lookup_key ?? null,
      recurring: { interval: req.body.recurring?.interval ?? 'month' }, product: id('prod'), nickname: req.body.product_data?.name ?? null, active: true,
    })));
    api.post('/checkout/sessions', (req, res) => {
      const price = this.store.prices.get(req.body.line_items?.[0]?.price);
      if (!price) return this.error(res, 400, 'No such price.');
      if (!this.store.customers.has(req.body.customer)) return this.error(res, 400, 'No such customer.');
      const sid = id('cs_test');
      return res.json(this.put('sessions', {
        id: sid, object: 'checkout.session', mode: req.body.mode, customer: req.body.customer, status: 'open', payment_status: 'unpaid',
        success_url: req.body.success_url, cancel_url: req.body.cancel_url, client_reference_id: req.body.client_reference_id ?? null,
        metadata: req.body.metadata ?? {}, price: price.id, subscription: null, expires_at: Number(req.body.expires_at ?? now() + 86400), url: `http://127.0.0.1:${this.opts.port}/checkout/${sid}`,
      }));
    });
    api.get('/checkout/sessions/:id', (req, res) => this.found(res, this.store.sessions.get(req.params.id)));
    api.post('/checkout/sessions/:id/expire', (req, res) => {
      const s = this.store.sessions.get(req.params.id);
      if (!s) return this.error(res, 404, 'No such checkout session.');
      if (s.status !== 'open') return this.error(res, 400, `Only open checkout sessions can be expired; this one is ${String(s.status)}.`);
      s.status = 'expired';
      void this.send('checkout.session.expired', s);
      return res.json(s);
    });
    api.get('/subscriptions/:id', (req, res) => this.found(res, this.store.subscriptions.get(req.params.id)));
    api.post('/subscriptions/:id', (req, res) => {
      const sub = this.store.subscriptions.get(req.params.id);
      if (!sub) return this.error(res, 404, 'No such subscription.');
      if (req.body.cancel_at_period_end !== undefined) sub.cancel_at_period_end = req.body.cancel_at_period_end === 'true';
      res.json(sub);
      void this.send('customer.subscription.updated', sub);
    });
    api.get('/invoices', (req, res) => res.json({ object: 'list', data: [...this.store.invoices.values()].filter((i) => !req.query.customer || i.customer === req.query.customer), has_more: false, url: '/v1/invoices' }));
    app.use('/v1', api);
    app.get('/checkout/:id', (req, res) => this.page(res, req.params.id, null));
    app.post('/checkout/:id/pay', (req, res) => this.pay(req, res));
    app.post('/_fake/config', (req, res) => { this.opts.webhookUrl = String(req.body.webhookUrl ?? this.opts.webhookUrl); res.json({ webhookUrl: this.opts.webhookUrl }); });
    app.post('/_fake/subscriptions/:id/renew', (req, res) => this.renew(req, res));
    app.post('/_fake/subscriptions/:id/expire', (req, res) => {
      const sub = this.store.subscriptions.get(req.params.id);
      if (!sub) return this.error(res, 404, 'No such subscription.');
      sub.status = 'canceled';
      sub.ended_at = now();
      res.json(sub);
      void this.send('customer.subscription.deleted', sub);
    });
    return new Promise((resolve) => { this.server = app.listen(this.opts.port, '127.0.0.1', () => resolve()); });
  }

  stop(): Promise<void> {
    return new Promise((resolve) => (this.server ? this.server.close(() => resolve()) : resolve()));
  }

  private put(kind: keyof StripeFake['store'], o: Obj): Obj {
    this.store[kind].set(o.id, { created: now(), livemode: false, ...o });
    return this.store[kind].get(o.id)!;
  }

  private found(res: Response, o: Obj | undefined): void {
    if (o) res.json(o); else this.error(res, 404, 'No such object.');
  }

  private error(res: Response, status: number, message: string): void {
    res.status(status).json({ error: { type: 'invalid_request_error', message } });
  }

  private page(res: Response, sid: string, failure: string | null): void {
    const s = this.store.sessions.get(sid);
    if (!s) { res.status(404).send('No such checkout session.'); return; }
    const price = this.store.prices.get(s.price as string)!;
    const amount = `${((price.unit_amount as number) / 100).toFixed(2)} ${String(price.currency).toUpperCase()} per ${(price.recurring as { interval: string }).interval}`;
    res.type('html').send(`<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Checkout (local test)</title>
<style>body{font-family:sans-serif;background:#f4f6f8;margin:0}main{max-width:420px;margin:48px auto;background:#fff;padding:28px;border-radius:10px;box-shadow:0 2px 10px #0002}
label{display:block;margin:12px 0 4px;font-size:14px}input{width:100%;padding:10px;font-size:16px;box-sizing:border-box;border:1px solid #bbb;border-radius:6px}
button{margin-top:18px;width:100%;padding:12px;font-size:16px;background:#333;color:#fff;border:0;border-radius:6px}.err{color:#b00020;margin-top:12px}.note{color:#666;font-size:12px;margin-top:14px}</style></head>
<body><main><h1 style="font-size:20px">${esc(String(price.nickname ?? 'Subscription'))}</h1><p>${esc(amount)}</p>
<form method="post" action="/checkout/${esc(sid)}/pay"><label for="card">Card number</label><input id="card" name="card" autocomplete="off" required>
<label for="exp">Expiry (MM/YY)</label><input id="exp" name="exp" value="12/30"><label for="cvc">CVC</label><input id="cvc" name="cvc" value="123">
<button type="submit" id="pay">Pay and subscribe</button>${failure ? `<p class="err" role="alert">${esc(failure)}</p>` : ''}</form>
<p class="note">Local test checkout. 4242 4242 4242 4242 pays; 4000 0000 0000 0002 is declined. <a href="${esc(String(s.cancel_url))}">Cancel</a></p></main></body></html>`);
  }

  private pay(req: Request, res: Response): void {
    const s = this.store.sessions.get(String(req.params.id));
    if (!s || s.status !== 'open') { res.status(404).send('This checkout session is not open.'); return; }
    const card = String(req.body.card ?? '').replace(/\s+/g, '');
    if (card === '4000000000000002') return this.page(res, s.id, 'Your card was declined.');
    if (card !== '4242424242424242') return this.page(res, s.id, 'Your card number is not a test card of this checkout.');
    const price = this.store.prices.get(s.price as string)!;
    const start = now();
    const end = start + periodSeconds(price);
    const sub = this.put('subscriptions', {
      id: id('sub'), object: 'subscription', customer: s.customer, status: 'active', cancel_at_period_end: false,
      current_period_start: start, current_period_end: end, metadata: s.metadata, items: { object: 'list', data: [{ id: id('si'), price, current_period_start: start, current_period_end: end }] },
    });
    Object.assign(s, { status: 'complete', payment_status: 'paid', subscription: sub.id });
    const invoice = this.invoice(sub, price, start, end, 'paid');
    res.redirect(303, String(s.success_url).replace('{CHECKOUT_SESSION_ID}', s.id));
    void (async () => {
      await this.send('checkout.session.completed', s);
      await this.send('invoice.paid', invoice);
    })();
  }

  private renew(req: Request, res: Response): void {
    const sub = this.store.subscriptions.get(String(req.params.id));
    if (!sub) return this.error(res, 404, 'No such subscription.');
    const price = (sub.items as { data: { price: Obj }[] }).data[0]!.price;
    const start = sub.current_period_end as number;
    const end = start + periodSeconds(price);
    if (req.body.outcome === 'failed') {
      sub.status = 'past_due';
      const inv = this.invoice(sub, price, start, end, 'open');
      res.json(sub);
      void (async () => { await this.send('invoice.payment_failed', inv); await this.send('customer.subscription.updated', sub); })();
      return;
    }
    Object.assign(sub, { current_period_start: start, current_period_end: end, status: 'active' });
    const inv = this.invoice(sub, price, start, end, 'paid');
    res.json(sub);
    void (async () => { await this.send('invoice.paid', inv); await this.send('customer.subscription.updated', sub); })();
  }

  private invoice(sub: Obj, price: Obj, start: number, end: number, status: string): Obj {
    return this.put('invoices', {
      id: id('in'), object: 'invoice', customer: sub.customer, subscription: sub.id, status, currency: price.currency,
      amount_due: price.unit_amount, amount_paid: status === 'paid' ? price.unit_amount : 0, period_start: start, period_end: end,
      lines: { object: 'list', data: [{ period: { start, end }, amount: price.unit_amount }] },
    });
  }

  /** Delivers one event, signed with the webhook secret (Stripe's scheme), retrying a failed delivery. */
  async send(type: string, object: Obj): Promise<void> {
    const event = { id: id('evt'), object: 'event', type, created: now(), livemode: false, api_version: '2025-01-01', data: { object: structuredClone(object) } };
    const payload = JSON.stringify(event);
    for (let attempt = 0; attempt < 3; attempt++) {
      const t = now();
      const v1 = createHmac('sha256', this.opts.webhookSecret).update(`${t}.${payload}`).digest('hex');
      try {
        const r = await fetch(this.opts.webhookUrl, { method: 'POST', headers: { 'content-type': 'application/json', 'stripe-signature': `t=${t},v1=${v1}` }, body: payload });
        this.delivered.push({ type, status: r.status });
        if (r.ok) return;
      } catch { this.delivered.push({ type, status: 0 }); }
      await new Promise((r) => setTimeout(r, 300 * (attempt + 1)));
    }
  }
}
