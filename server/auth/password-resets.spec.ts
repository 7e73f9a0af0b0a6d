import { and, asc, eq, sql } from 'drizzle-orm';
import { PASSWORD_RESET_ANSWER } from '@shared/schemas';
import { sha256Hex } from '../audit/canonical-json';
import { auditEvents, mailMessages, mailOutbox, passwordLinks, users } from '../db/schema';
import { anonymous, freshDatabase, Harness, signedIn, startHarness, uniqueEmail } from '../test/harness';
import { hashPassword } from './passwords';

// The real module object the app's code calls through (an ES namespace import would be a copy).
// eslint-disable-next-line @typescript-eslint/no-require-imports
const nodeCrypto: typeof import('node:crypto') = require('node:crypto');

let h: Harness;
beforeAll(async () => { h = await startHarness({ PASSWORD_RESET_RATE_LIMIT: '1000' }); });
afterAll(() => h.close());

type Session = Awaited<ReturnType<typeof anonymous>>;
const ask = (s: Session, email: string) => s.agent.post('/api/v1/password-resets').set('X-XSRF-TOKEN', s.xsrf).send({ email });

async function makeUser(over: Partial<typeof users.$inferInsert> = {}, password = 'first-long-password') {
  const [admin] = await h.database.db.select().from(users).where(eq(users.email, 'admin@valeharbor.example'));
  const [u] = await h.database.db.insert(users).values({
    laboratoryId: admin.laboratoryId, name: 'Reset Person', email: uniqueEmail('reset'), roles: ['technologist'], passwordHash: await hashPassword(password), ...over,
  }).returning();
  return u;
}

/** The newest message the local mail store received for an address, and the token of its link. */
async function mailTo(email: string, after = 0) {
  await h.ctx.mail.flush();
  for (let i = 0; i < 50; i++) {
    const hit = (await h.database.db.select().from(mailMessages).orderBy(asc(mailMessages.id))).filter((m) => m.id > after && m.to.includes(email)).at(-1);
    if (hit) return { ...hit, token: /\/set-password\/([A-Za-z0-9_-]+)/.exec(hit.text)![1] };
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no mail reached ${email}`);
}
const newestMailId = async () => (await h.database.db.select({ id: sql<number>`coalesce(max(${mailMessages.id}), 0)` }).from(mailMessages))[0].id;
const queuedFor = async (email: string) => (await h.database.db.select().from(mailOutbox)).filter((m) => m.to.includes(email));
const eventsOf = (action: string) => h.database.db.select().from(auditEvents).where(eq(auditEvents.action, action)).orderBy(asc(auditEvents.id));

describe('forgot password', () => {
  it('answers the same 202 and words for a known and an unknown e-mail, and audits both with the e-mail', async () => {
    const u = await makeUser();
    const unknown = uniqueEmail('nobody');
    const s = await anonymous(h);
    const known = await ask(s, u.email);
    const other = await ask(s, unknown);
    expect(known.status).toBe(202);
    expect(other.status).toBe(202);
    expect(known.body).toEqual({ message: PASSWORD_RESET_ANSWER });
    expect(other.body).toEqual(known.body);
    expect(Object.keys(other.headers).sort()).toEqual(Object.keys(known.headers).sort());

    const requested = await eventsOf('password-reset.requested');
    const forKnown = requested.find((e) => (e.after as { email: string }).email === u.email)!;
    const forUnknown = requested.find((e) => (e.after as { email: string }).email === unknown)!;
    expect(forKnown).toMatchObject({ laboratoryId: u.laboratoryId, userId: null, entity: 'user', entityId: String(u.id), after: { email: u.email, address: expect.any(String), outcome: 'link sent' } });
    expect(forUnknown).toMatchObject({ laboratoryId: null, userId: null, entity: 'user', entityId: null, after: { email: unknown, outcome: 'unknown e-mail' } });
    expect(await queuedFor(u.email)).toHaveLength(1);
    expect(await queuedFor(unknown)).toHaveLength(0);
  });

  it('e-mails a link that works once, for one hour: it sets the password, ends every session and clears the lock', async () => {
    const u = await makeUser({ failedSignIns: 5, lockedUntil: new Date(Date.now() + 10 * 60_000) });
    // A session opened before the lock, still alive.
    await h.database.db.update(users).set({ failedSignIns: 0, lockedUntil: null }).where(eq(users.id, u.id));
    const before = await signedIn(h, u.email, 'first-long-password');
    await h.database.db.update(users).set({ failedSignIns: 5, lockedUntil: new Date(Date.now() + 10 * 60_000) }).where(eq(users.id, u.id));

    const s = await anonymous(h);
    const since = await newestMailId();
    await ask(s, u.email).expect(202);
    const mail = await mailTo(u.email, since);
    expect(mail.subject).toBe('A link to choose a new Parallax password (Vale Harbor Regional Laboratory)');
    expect(mail.text).toContain('it works once and expires in 1 hour');
    expect(mail.text).toContain(`http://parallax.test/set-password/${mail.token}`);

    const info = await s.agent.get(`/api/v1/password-links/${mail.token}`).expect(200);
    expect(info.body).toMatchObject({ email: u.email, name: 'Reset Person', purpose: 'reset' });
    const lasts = Date.parse(info.body.expiresAt) - Date.now();
    expect(lasts).toBeGreaterThan(59 * 60_000);
    expect(lasts).toBeLessThanOrEqual(60 * 60_000);

    await s.agent.post(`/api/v1/password-links/${mail.token}`).set('X-XSRF-TOKEN', s.xsrf).send({ password: 'second-long-password' }).expect(204);
    await before.agent.get('/api/v1/session').expect(401);
    const [after] = await h.database.db.select().from(users).where(eq(users.id, u.id));
    expect(after).toMatchObject({ failedSignIns: 0, lockedUntil: null });
    await signedIn(h, u.email, 'second-long-password');
    const again = await s.agent.post(`/api/v1/password-links/${mail.token}`).set('X-XSRF-TOKEN', s.xsrf).send({ password: 'third-long-password' }).expect(404);
    expect(again.body.error).toMatch(/^This link is not valid or has expired/);

    const reset = (await eventsOf('password.reset')).filter((e) => e.entityId === String(u.id));
    expect(reset).toHaveLength(1);
    expect(reset[0]).toMatchObject({ userId: u.id, laboratoryId: u.laboratoryId, after: { sessionsEnded: 1, failedSignInsCleared: 5, wasLocked: true } });
  });

  it('makes the older unused link useless when a new one is asked for', async () => {
    const u = await makeUser();
    const s = await anonymous(h);
    let since = await newestMailId();
    await ask(s, u.email).expect(202);
    const first = await mailTo(u.email, since);
    since = first.id;
    await ask(s, u.email).expect(202);
    const second = await mailTo(u.email, since);
    expect(second.token).not.toBe(first.token);
    await s.agent.get(`/api/v1/password-links/${first.token}`).expect(404);
    await s.agent.post(`/api/v1/password-links/${first.token}`).set('X-XSRF-TOKEN', s.xsrf).send({ password: 'second-long-password' }).expect(404);
    await s.agent.post(`/api/v1/password-links/${second.token}`).set('X-XSRF-TOKEN', s.xsrf).send({ password: 'second-long-password' }).expect(204);
    await signedIn(h, u.email, 'second-long-password');
  });

  it('sends nothing for a deactivated account, answers as for any other, and audits why', async () => {
    const u = await makeUser({ active: false });
    const s = await anonymous(h);
    const res = await ask(s, u.email).expect(202);
    expect(res.body).toEqual({ message: PASSWORD_RESET_ANSWER });
    expect(await queuedFor(u.email)).toHaveLength(0);
    const [event] = (await eventsOf('password-reset.requested')).filter((e) => e.entityId === String(u.id));
    expect(event.after).toMatchObject({ email: u.email, outcome: 'inactive account' });
  });

  it('refuses a malformed e-mail naming the field, and needs the XSRF header but no session', async () => {
    const s = await anonymous(h);
    const bad = await ask(s, 'not-an-email').expect(400);
    expect(bad.body.issues).toEqual([{ path: 'email', message: 'Enter a valid e-mail address' }]);
    await s.agent.post('/api/v1/password-resets').send({ email: 'tech@valeharbor.example' }).expect(403);
    const res = await ask(s, uniqueEmail('nobody')).expect(202);
    expect(JSON.stringify(res.headers['set-cookie'] ?? [])).not.toContain('parallax.sid');
  });
});

describe('the same work either way', () => {
  // An app that queues mail but never delivers it while the test watches node's crypto.
  let quiet: Harness;
  beforeAll(async () => { quiet = await startHarness({ PASSWORD_RESET_RATE_LIMIT: '1000', SMTP_URL: '' }); });
  afterAll(() => quiet.close());

  it('does the same hashing for an unknown e-mail as for a known one: a 32-byte token made and hashed with SHA-256', async () => {
    const u = await makeUser();
    await h.ctx.mail.flush(); // no delivery of the other tests' mail may run meanwhile (it makes random bytes too)
    const s = await anonymous(quiet);
    /** The random bytes and hashes the app asks node's crypto for while the request runs. */
    async function cryptoDuring(email: string) {
      const random = jest.spyOn(nodeCrypto, 'randomBytes');
      const hash = jest.spyOn(nodeCrypto, 'createHash');
      try {
        await ask(s, email).expect(202);
        return { random: random.mock.calls.map((c) => c[0]), hash: hash.mock.calls.map((c) => c[0]), tokens: random.mock.results.map((r) => (r.value as Buffer).toString('base64url')) };
      } finally {
        random.mockRestore();
        hash.mockRestore();
      }
    }
    await ask(s, uniqueEmail('warm-up')).expect(202); // the audit key is read (and its id hashed) once per process
    const known = await cryptoDuring(u.email);
    const unknown = await cryptoDuring(uniqueEmail('nobody'));
    expect(known.random).toEqual([32]);
    expect(known.hash.filter((algorithm) => algorithm === 'sha256')).toEqual(['sha256']); // (the answer's ETag adds a sha1 either way)
    expect(unknown.random).toEqual(known.random);
    expect(unknown.hash).toEqual(known.hash);
    // The known path stored the hash of the very token it made, and e-mailed that token.
    const [link] = await h.database.db.select().from(passwordLinks).where(eq(passwordLinks.userId, u.id));
    expect(link.tokenHash).toBe(sha256Hex(known.tokens[0]));
    expect((await queuedFor(u.email))[0].text).toContain(`/set-password/${known.tokens[0]}`);
  });
});

describe('an administrator sends a password link', () => {
  it('sends a one-hour reset link naming the administrator, audited with the administrator as actor', async () => {
    const u = await makeUser();
    const admin = await signedIn(h, 'admin@valeharbor.example');
    const since = await newestMailId();
    await admin.agent.post(`/api/v1/users/${u.id}/password-link`).set('X-XSRF-TOKEN', admin.xsrf).expect(204);
    const mail = await mailTo(u.email, since);
    expect(mail.text).toContain('an administrator of Vale Harbor Regional Laboratory, sent you a link to choose a new password');
    const visitor = await anonymous(h);
    expect((await visitor.agent.get(`/api/v1/password-links/${mail.token}`).expect(200)).body.purpose).toBe('reset');
    await visitor.agent.post(`/api/v1/password-links/${mail.token}`).set('X-XSRF-TOKEN', visitor.xsrf).send({ password: 'admin-sent-password' }).expect(204);
    await signedIn(h, u.email, 'admin-sent-password');
    const [adminRow] = await h.database.db.select().from(users).where(eq(users.email, 'admin@valeharbor.example'));
    const sent = (await eventsOf('password-reset.sent')).filter((e) => e.entityId === String(u.id));
    expect(sent).toHaveLength(1);
    expect(sent[0]).toMatchObject({ userId: adminRow.id, laboratoryId: u.laboratoryId, after: { email: u.email } });
  });

  it('is for administrators only, answers 404 for another laboratory\'s user, and refuses an inactive or never-set-up account in words', async () => {
    const u = await makeUser();
    const tech = await signedIn(h, 'tech@valeharbor.example');
    await tech.agent.post(`/api/v1/users/${u.id}/password-link`).set('X-XSRF-TOKEN', tech.xsrf).expect(403);
    const cedar = await signedIn(h, 'admin@cedarpoint.example');
    const other = await cedar.agent.post(`/api/v1/users/${u.id}/password-link`).set('X-XSRF-TOKEN', cedar.xsrf).expect(404);
    expect(other.body.error).toBe('User was not found');
    expect(await queuedFor(u.email)).toHaveLength(0);

    const admin = await signedIn(h, 'admin@valeharbor.example');
    const inactive = await makeUser({ active: false, name: 'Gone Person' });
    const refused = await admin.agent.post(`/api/v1/users/${inactive.id}/password-link`).set('X-XSRF-TOKEN', admin.xsrf).expect(400);
    expect(refused.body.error).toBe('Gone Person is deactivated; reactivate the account before sending a password link');
    const invited = await makeUser({ passwordHash: null, name: 'New Person' });
    const early = await admin.agent.post(`/api/v1/users/${invited.id}/password-link`).set('X-XSRF-TOKEN', admin.xsrf).expect(400);
    expect(early.body.error).toBe('New Person has not chosen a password yet; send the invitation again instead');
    expect(await queuedFor(inactive.email)).toHaveLength(0);
    expect(await queuedFor(invited.email)).toHaveLength(0);
    const events = await h.database.db.select().from(auditEvents)
      .where(and(eq(auditEvents.action, 'password-reset.sent'), sql`${auditEvents.entityId} IN (${String(u.id)}, ${String(inactive.id)}, ${String(invited.id)})`));
    expect(events).toEqual([]);
  });
});

describe('password link limits', () => {
  const opened: { h: Harness; drop: () => Promise<void> }[] = [];
  afterAll(async () => { for (const o of opened) { await o.h.close(); await o.drop(); } });
  /** An app on a database of its own: the counts are per address, and every test here comes from 127.0.0.1. */
  async function limitedApp(perAddress: string) {
    const db = await freshDatabase('resets');
    const app = await startHarness({ PASSWORD_RESET_RATE_LIMIT: perAddress }, { databaseUrl: db.url });
    opened.push({ h: app, drop: db.drop });
    return app;
  }

  it('allows three requests an hour per e-mail, known or not, then answers 429 naming the limit, and audits it', async () => {
    const app = await limitedApp('1000');
    const s = await anonymous(app);
    const known = 'tech@valeharbor.example';
    const unknown = 'nobody.here@valeharbor.example';
    for (let i = 0; i < 3; i++) {
      await ask(s, known).expect(202);
      await ask(s, unknown).expect(202);
    }
    const refused = await ask(s, known).expect(429);
    const refusedUnknown = await ask(s, unknown).expect(429);
    expect(refused.body.error).toMatch(/^Too many requests for a password link for this e-mail address \(at most 3 an hour\); wait (59|60) minutes and try again$/);
    expect(refusedUnknown.body.error).toBe(refused.body.error);
    // Another e-mail from the same address is still served.
    await ask(s, 'quality@valeharbor.example').expect(202);
    const limited = await app.database.db.select().from(auditEvents).where(eq(auditEvents.action, 'password-reset.rate-limited'));
    expect(limited.map((e) => (e.after as { email: string }).email).sort()).toEqual([unknown, known].sort());
    expect(limited[0]).toMatchObject({ laboratoryId: null, after: { which: 'for this e-mail address (at most 3 an hour)' } });
    // Refused requests made no link: three for the known account, no more.
    const [tech] = await app.database.db.select().from(users).where(eq(users.email, known));
    expect(await app.database.db.select().from(passwordLinks).where(eq(passwordLinks.userId, tech.id))).toHaveLength(3);
  });

  it('counts every request from one address, whatever the e-mail, up to the configured limit', async () => {
    const app = await limitedApp('4');
    const s = await anonymous(app);
    for (let i = 0; i < 4; i++) await ask(s, `someone.${i}@valeharbor.example`).expect(202);
    const refused = await ask(s, 'director@valeharbor.example').expect(429);
    expect(refused.body.error).toMatch(/^Too many requests for a password link from this address \(at most 4 an hour\); wait (59|60) minutes and try again$/);
    expect((await app.database.db.select().from(mailOutbox)).filter((m) => m.subject.includes('password'))).toEqual([]);
  });
});
