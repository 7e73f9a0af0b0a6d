import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import type { Pool } from 'pg';
import type { Config } from '../config';

/**
 * Sessions live in PostgreSQL (so several API processes can share them). The cookie is httpOnly and
 * SameSite=Lax, Secure when COOKIE_SECURE=1; `rolling` renews it on every request, so it lapses
 * after the idle time-out. The stored expiry is renewed at most once per tenth of the time-out (and at
 * most once a minute) per session, not on every request: a session then lapses between 0.9 and 1 times
 * the time-out after its last request, and reads cost no write.
 */
export function sessionMiddleware(pool: Pool, config: Config) {
  const Store = connectPgSimple(session);
  const store = new Store({ pool, tableName: 'session', createTableIfMissing: false, pruneSessionInterval: 600 });
  throttleTouches(store, Math.min(60_000, config.sessionIdleMs / 10));
  return session({
    name: 'parallax.sid',
    secret: config.sessionSecret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: { httpOnly: true, sameSite: 'lax', secure: config.cookieSecure, maxAge: config.sessionIdleMs },
  });
}

/** Lets a store's touch (the UPDATE of a session's expiry) through at most once per `everyMs` per session. */
export function throttleTouches(store: session.Store, everyMs: number): void {
  const touch = store.touch?.bind(store);
  if (!touch) return;
  const last = new Map<string, number>();
  store.touch = (sid, sess, done) => {
    const now = Date.now();
    const before = last.get(sid);
    if (before !== undefined && now - before < everyMs) return done?.();
    if (last.size >= 50_000) for (const [k, t] of last) if (now - t >= everyMs) last.delete(k);
    last.set(sid, now);
    touch(sid, sess, done);
  };
}
