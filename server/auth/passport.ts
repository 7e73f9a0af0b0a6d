import passport, { PassportStatic } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { Database } from '../db/client';
import { loadSessionUser, verifySignIn } from './auth.service';

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
  p.deserializeUser((id: number, done) => {
    loadSessionUser(db, id).then((u) => done(null, u), done);
  });
  return p;
}
