import express, { Router } from 'express';
import { publicRoute, requireRole } from '../http/auth';
import { idParam, validateBody } from '../http/validate';
import { mailPreferenceSchema } from '../users/user.schemas';
import { checkoutSchema } from './subscription.schemas';
import type { SubscriptionService } from './subscription.service';

/** Mounted at /api/subscriptions. */
export function subscriptionRoutes(subs: SubscriptionService): Router {
  const router = Router();
  router.get('/', requireRole('licensee'), async (req, res) => { res.json({ subscriptions: await subs.mine(req.user!.id) }); });
  router.get('/plans', requireRole('licensee'), async (_req, res) => { res.json({ plans: await subs.plans() }); });
  router.post('/checkout', requireRole('licensee'), validateBody(checkoutSchema), async (req, res) => { res.status(201).json(await subs.checkout(req.user!, req.body)); });
  router.put('/mail-preference', requireRole('licensee'), validateBody(mailPreferenceSchema), async (req, res) => { res.json(await subs.setMailPreference(req.user!, req.body.mailPreference)); });
  router.post('/abandon-pending', requireRole('licensee'), async (req, res) => { res.json(await subs.abandonPending(req.user!)); });
  router.post('/:id/cancel', requireRole('licensee'), async (req, res) => { res.status(202).json(await subs.cancel(req.user!, idParam(req.params.id))); });
  return router;
}

/** Mounted at /api/stripe before the JSON parser and the CSRF check: the raw body is what Stripe signed. */
export function stripeWebhookRoutes(subs: SubscriptionService): Router {
  const router = Router();
  router.post('/webhook', publicRoute(), express.raw({ type: 'application/json', limit: '1mb' }), async (req, res) => {
    res.json(await subs.webhook(req.body as Buffer, req.get('stripe-signature')));
  });
  return router;
}
