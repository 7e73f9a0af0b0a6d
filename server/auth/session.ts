import connectPgSimple from 'connect-pg-simple';
import type { Request } from 'express';
import session from 'express-session';
import type { Pool } from 'pg';
import type { Role } from '@shared/schemas';
import type { Config } from '../config';
import type { SignedInUser } from './session-user';

/**
 * The account a session names, read with the session itself (null: no such account), and its laboratory's
 * change counter as it stood at that read (null: the laboratory has none yet; see `laboratoryVersionOf`).
 */
interface AccountRow { id: number; laboratoryId: number; name: string; email: string; roles: Role[]; active: boolean; laboratoryVersion: string | null }

const accountOfSession = new WeakMap<object, AccountRow | null>();
const accountOfRequest = new WeakMap<Request, AccountRow | null>();

/**
 * Sessions live in PostgreSQL (so several API processes can share them). The cookie is httpOnly and
 * SameSite=Lax, Secure when COOKIE_SECURE=1; `rolling` renews it on every request, so it lapses
 * after the idle time-out. The stored expiry is renewed at most once per tenth of the time-out (and at
 * most once a minute) per session, not on every request: a session then lapses between 0.9 and 1 times
 * the time-out after its last request, and reads cost no write. A session and the account it names are
 * read in one statement (`readAccountWithSession`).
 */
export function sessionMiddleware(pool: Pool, config: Config) {
  const Store = connectPgSimple(session);
  const store = new Store({ pool, tableName: 'session', createTableIfMissing: false, pruneSessionInterval: 600 });
  throttleTouches(store, Math.min(60_000, config.sessionIdleMs / 10));
  readAccountWithSession(store, pool);
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

/**
 * Reads a session and the account it names in one round trip: the store's read joins `users`, and the
 * row is handed to that request's deserializer (`accountReadWithSession`) instead of a second query.
 * The account is read in the same statement as the session, so it is as current as a separate read.
 * The same statement reads the account's laboratory's change counter (`laboratory_versions`, moved at the
 * commit of every change of that laboratory by the triggers of migration 0012), so the read cache can
 * answer a repeated read with no further round trip (`laboratoryVersionOf`, server/http/read-cache.ts).
 */
export function readAccountWithSession(store: session.Store, pool: Pool): void {
  const create = store.createSession.bind(store);
  store.get = (sid, done) => {
    pool.query<{ sess: session.SessionData; id: number | null; laboratory_id: number; name: string; email: string; roles: Role[]; active: boolean; laboratory_version: string | null }>(
      `SELECT s.sess, u.id, u.laboratory_id, u.name, u.email, u.roles, u.active, v.version AS laboratory_version
         FROM session s LEFT JOIN users u ON u.id = (CASE WHEN json_typeof(s.sess #> '{passport,user}') = 'number' THEN (s.sess #>> '{passport,user}')::int END)
                        LEFT JOIN laboratory_versions v ON v.laboratory_id = u.laboratory_id
        WHERE s.sid = $1 AND s.expire >= now()`,
      [sid],
    ).then(({ rows: [row] }) => {
      if (!row) return done(null, null);
      const sess = typeof row.sess === 'string' ? JSON.parse(row.sess) : row.sess;
      accountOfSession.set(sess, row.id === null ? null : {
        id: row.id, laboratoryId: row.laboratory_id, name: row.name, email: row.email, roles: row.roles, active: row.active,
        laboratoryVersion: row.laboratory_version === null ? null : String(row.laboratory_version),
      });
      done(null, sess);
    }, (err) => done(err));
  };
  store.createSession = (req, sess) => {
    const account = accountOfSession.get(sess);
    if (account !== undefined) accountOfRequest.set(req as unknown as Request, account);
    return create(req, sess);
  };
}

/**
 * The signed-in user of a request as read with its session: the user, false for an inactive or unknown
 * account, undefined when the session's read did not carry it (then the caller reads the account).
 */
export function accountReadWithSession(req: Request, id: number): SignedInUser | false | undefined {
  const account = accountOfRequest.get(req);
  if (account === undefined) return undefined;
  if (account === null) return false;
  if (account.id !== id) return undefined;
  return account.active ? { id: account.id, laboratoryId: account.laboratoryId, name: account.name, email: account.email, roles: account.roles } : false;
}

/**
 * The change counter of the signed-in user's laboratory as read with this request's session, or undefined
 * when the request has no user, the account did not come with the session's read, or the laboratory has no
 * counter yet. It was read before anything the request's handler reads, which the read cache relies on.
 */
export function laboratoryVersionOf(req: Request): { laboratoryId: number; version: string } | undefined {
  const account = accountOfRequest.get(req);
  const user = req.user;
  if (!account || !user || !account.active || account.laboratoryVersion === null) return undefined;
  if (account.id !== user.id || account.laboratoryId !== user.laboratoryId) return undefined;
  return { laboratoryId: account.laboratoryId, version: account.laboratoryVersion };
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
