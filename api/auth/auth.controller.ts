import type { NextFunction, Request, Response } from 'express';
import type { PassportStatic } from 'passport';
import type { Csrf } from '../http/csrf';
import { HttpError, NotSignedInError } from '../http/http-error';
import { User } from '../users/user.model';
import type { OpenSessionView, SessionView } from './auth.schemas';

/** The sign-in handlers of one application (they issue its CSRF tokens). */
export function authController(csrf: Csrf) {
  async function sessionView(req: Request, res: Response, newToken: boolean): Promise<SessionView> {
    const user = await User.findByPk(req.user!.id);
    if (!user) throw new NotSignedInError();
    return { user: user.toView(), csrfToken: csrf.generateToken(req, res, newToken) };
  }

  return {
    /** GET /api/auth/csrf: the token to send in the x-csrf-token header (stores nothing for an anonymous caller). */
    csrfToken(req: Request, res: Response): void {
      res.json({ csrfToken: csrf.generateToken(req, res) });
    },

    /** POST /api/auth/sign-in: checks the password, rotates the session id, returns the user and a new token. */
    signIn(passport: PassportStatic) {
      return (req: Request, res: Response, next: NextFunction): void => {
        passport.authenticate('local', (err: unknown, user: Express.User | false) => {
          if (err) return next(err);
          if (!user) return next(new HttpError(401, 'SIGN_IN_FAILED', 'The e-mail or password is not correct.'));
          // passport ≥ 0.6 regenerates the session inside logIn: a fixated session id is thrown away
          req.logIn(user, (loginErr) => {
            if (loginErr) return next(loginErr);
            sessionView(req, res, true).then((view) => res.json(view), next);
          });
        })(req, res, next);
      };
    },

    /** POST /api/auth/sign-out: ends the session. */
    signOut(req: Request, res: Response, next: NextFunction): void {
      req.logOut((err) => {
        if (err) return next(err);
        req.session.destroy((destroyErr) => {
          if (destroyErr) return next(destroyErr);
          res.clearCookie('brinkmark.sid').status(204).end();
        });
      });
    },

    /** GET /api/auth/session: who is signed in, or `user: null`, with a CSRF token; never an error for a visitor. */
    async session(req: Request, res: Response): Promise<void> {
      const user = req.user ? await User.findByPk(req.user.id) : null;
      if (user) res.json({ user: user.toView(), csrfToken: csrf.generateToken(req, res, false) } satisfies SessionView);
      else res.json({ user: null, csrfToken: csrf.generateToken(req, res) } satisfies OpenSessionView);
    },

    /** GET /api/auth/me: who is signed in. */
    async me(req: Request, res: Response): Promise<void> {
      res.json(await sessionView(req, res, false));
    },
  };
}
