import passport, { PassportStatic } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { Database } from '../db/client';
import type { Request } from 'express';
import { loadSessionUser, verifySignIn } from './auth.service';
import { accountReadWithSession } from './session';

/** passport-local over e-mail and password; the session keeps only the user id. */
export function configurePassport(db: Database): PassportStatic {
  const p = new passport.Passport() as unknown as PassportStatic;
  p.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password', passReqToCallback: true }, (req, email, password, done) => {
      verifySignIn(db, email, password, req.ip ?? '')
        .then((user) => done(null, user))
        .catch((err) => done(err));
    }),
  );
  p.serializeUser((user, done) => done(null, user.id));
  // The account usually came with the session's own read (one statement); otherwise it is read here.
  p.deserializeUser((req: Request, id: number, done: (err: unknown, user?: Express.User | false) => void) => {
    const known = accountReadWithSession(req, id);
    if (known !== undefined) return done(null, known);
    loadSessionUser(db, id).then((u) => done(null, u), done);
  });
  return p;
}
