import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import type { Pool } from 'pg';
import type { Config } from '../config';

/**
 * Sessions live in PostgreSQL (so several API processes can share them). The cookie is httpOnly and
 * SameSite=Lax, Secure when COOKIE_SECURE=1; `rolling` renews it on every request, so it lapses
 * after the idle time-out.
 */
export function sessionMiddleware(pool: Pool, config: Config) {
  const Store = connectPgSimple(session);
  return session({
    name: 'parallax.sid',
    secret: config.sessionSecret,
    store: new Store({ pool, tableName: 'session', createTableIfMissing: false, pruneSessionInterval: 600 }),
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: { httpOnly: true, sameSite: 'lax', secure: config.cookieSecure, maxAge: config.sessionIdleMs },
  });
}
