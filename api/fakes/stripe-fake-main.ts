/** Runs the Stripe fake as its own process: node --import tsx api/fakes/stripe-fake-main.ts PORT */
import { StripeFake } from './stripe-fake';

const port = Number(process.argv[2] ?? 4312);
const fake = new StripeFake({
  port,
  webhookUrl: process.env.STRIPE_FAKE_WEBHOOK_URL ?? 'http://127.0.0.1:4300/api/stripe/webhook',
  webhookSecret: process.env.STRIPE_WEBHOOK_SECRET ?? 'whsec_brinkmark_local',
});
await fake.start();
console.log(`Stripe fake listening on 127.0.0.1:${port}`);
