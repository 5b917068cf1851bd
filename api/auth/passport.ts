/** passport-local wiring: users are stored in the session by id and reloaded on every request. */
import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { User } from '../users/user.model';
import type { Role } from '../users/user.schemas';
import { verifyCredentials } from './auth.service';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface User {
      id: number;
      email: string;
      name: string;
      role: Role;
      regionId: number | null;
      boardChair: boolean;
    }
  }
}

function sessionUser(u: User): Express.User {
  return { id: u.id, email: u.email, name: u.name, role: u.role, regionId: u.regionId, boardChair: u.boardChair };
}

/** A passport instance of our own (not the global singleton), so several apps can run in one process. */
export function createPassport(): passport.PassportStatic {
  const p = new passport.Passport() as passport.PassportStatic;
  p.use(new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, (email, password, done) => {
    verifyCredentials(email, password).then((u) => done(null, u ? sessionUser(u) : false), done);
  }));
  p.serializeUser((user, done) => done(null, user.id));
  p.deserializeUser((id: number, done) => {
    User.findByPk(id).then((u) => done(null, u && u.active ? sessionUser(u) : false), done);
  });
  return p;
}
