import { Router } from 'express';
import { rateLimit } from 'express-rate-limit';
import type { PassportStatic } from 'passport';
import type { Config } from '../config';
import { publicRoute, signedIn } from '../http/auth';
import { validateBody } from '../http/validate';
import { signInSchema } from './auth.schemas';
import * as auth from './auth.controller';

export function authRoutes(config: Config, passport: PassportStatic): Router {
  const signInLimit = rateLimit({
    windowMs: 15 * 60_000,
    limit: config.SIGNIN_LIMIT_PER_15_MIN,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, res) => {
      res.status(429).json({ error: { code: 'TOO_MANY_SIGN_IN_ATTEMPTS', message: 'Too many failed sign-in attempts. Wait 15 minutes and try again.' } });
    },
  });
  const router = Router();
  router.get('/csrf', publicRoute(), auth.csrfToken);
  router.post('/sign-in', publicRoute(), signInLimit, validateBody(signInSchema), auth.signIn(passport));
  router.post('/sign-out', signedIn(), auth.signOut);
  router.get('/me', signedIn(), auth.me);
  return router;
}
