import type { Request, Response } from 'express';
import { Router } from 'express';
import { rateLimit } from 'express-rate-limit';
import type { PassportStatic } from 'passport';
import type { Config } from '../config';
import { publicRoute, signedIn } from '../http/auth';
import type { Csrf } from '../http/csrf';
import { validateBody } from '../http/validate';
import { signInSchema } from './auth.schemas';
import { authController } from './auth.controller';

const WINDOW_MS = 15 * 60_000;

function tooMany(_req: Request, res: Response): void {
  res.status(429).json({ error: { code: 'TOO_MANY_SIGN_IN_ATTEMPTS', message: 'Too many failed sign-in attempts. Wait 15 minutes and try again.' } });
}

export function authRoutes(config: Config, passport: PassportStatic, csrf: Csrf): Router {
  // why: an X-Forwarded-For from an untrusted hop is ignored on purpose (TRUST_PROXY), not a misconfiguration
  const common = { windowMs: WINDOW_MS, skipSuccessfulRequests: true, standardHeaders: 'draft-8' as const, legacyHeaders: false, handler: tooMany, validate: { xForwardedForHeader: false } };
  // failures per client address (the socket's, unless TRUST_PROXY names the proxy in front)
  const perAddress = rateLimit({ ...common, limit: config.SIGNIN_LIMIT_PER_15_MIN });
  // failures per account, whatever the address: rotating addresses does not buy more guesses
  const perAccount = rateLimit({
    ...common, limit: config.SIGNIN_ACCOUNT_LIMIT_PER_15_MIN, identifier: 'sign-in-account',
    keyGenerator: (req) => `account:${String((req.body as { email: string }).email).toLowerCase()}`,
  });
  const auth = authController(csrf);
  const router = Router();
  router.get('/csrf', publicRoute(), auth.csrfToken);
  router.post('/sign-in', publicRoute(), perAddress, validateBody(signInSchema), perAccount, auth.signIn(passport));
  router.post('/sign-out', signedIn(), auth.signOut);
  router.get('/me', signedIn(), auth.me);
  router.get('/session', publicRoute(), auth.session);
  return router;
}
