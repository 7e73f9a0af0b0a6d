import { eq } from 'drizzle-orm';
import { auditEvents, users } from '../db/schema';
import { anonymous, freshDatabase, Harness, signedIn, startHarness, uniqueEmail, queriesDuring } from '../test/harness';
import { hashPassword } from './passwords';

let h: Harness;
beforeAll(async () => { h = await startHarness(); });
afterAll(() => h.close());

async function makeUser(roles: string[] = ['technologist'], password = 'a-long-test-password') {
  const [lab] = await h.database.db.select().from(users).where(eq(users.email, 'admin@valeharbor.example'));
  const [u] = await h.database.db.insert(users).values({
    laboratoryId: lab.laboratoryId, name: 'Test Person', email: uniqueEmail('auth'), roles, passwordHash: await hashPassword(password),
  }).returning();
  return u;
}
const auditFor = (userId: number) =>
  h.database.db.select().from(auditEvents).where(eq(auditEvents.userId, userId));

describe('sign-in and sessions', () => {
  it('signs in with the right password, answers who I am, and signs out', async () => {
    const s = await signedIn(h, 'tech@valeharbor.example');
    const me = await s.agent.get('/api/v1/session').expect(200);
    expect(me.body).toMatchObject({ email: 'tech@valeharbor.example', roles: ['technologist'], laboratory: { name: 'Vale Harbor Regional Laboratory' } });
    await s.agent.delete('/api/v1/session').set('X-XSRF-TOKEN', s.xsrf).expect(204);
    await s.agent.get('/api/v1/session').expect(401);
  });

  it('regenerates the session id at sign-in', async () => {
    const s = await anonymous(h);
    const before = await s.agent.get('/api/v1/session');
    const res = await s.agent.post('/api/v1/session').set('X-XSRF-TOKEN', s.xsrf).send({ email: 'tech@valeharbor.example', password: 'parallax-demo' });
    const sid = ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('parallax.sid='));
    expect(sid).toBeDefined();
    expect(sid).toMatch(/HttpOnly/);
    expect(sid).toMatch(/SameSite=Lax/);
    expect(JSON.stringify(before.headers['set-cookie'] ?? [])).not.toContain(sid!.split(';')[0]);
  });

  it('refuses a wrong password with words that do not reveal whether the e-mail exists, and audits it', async () => {
    const u = await makeUser();
    const s = await anonymous(h);
    const wrong = await s.agent.post('/api/v1/session').set('X-XSRF-TOKEN', s.xsrf).send({ email: u.email, password: 'not-the-password' }).expect(401);
    const unknown = await s.agent.post('/api/v1/session').set('X-XSRF-TOKEN', s.xsrf).send({ email: 'nobody@valeharbor.example', password: 'x' }).expect(401);
    expect(wrong.body.error).toBe(unknown.body.error);
    expect((await auditFor(u.id)).map((e) => e.action)).toContain('sign-in.wrong-password');
  });

  it('locks the account after five failures, even for the right password, until an admin unlocks it', async () => {
    const u = await makeUser();
    const s = await anonymous(h);
    for (let i = 0; i < 5; i++) {
      await s.agent.post('/api/v1/session').set('X-XSRF-TOKEN', s.xsrf).send({ email: u.email, password: `wrong-${i}` }).expect(401);
    }
    const [locked] = await h.database.db.select().from(users).where(eq(users.id, u.id));
    expect(locked.lockedUntil!.getTime()).toBeGreaterThan(Date.now() + 14 * 60_000);
    await s.agent.post('/api/v1/session').set('X-XSRF-TOKEN', s.xsrf).send({ email: u.email, password: 'a-long-test-password' }).expect(401);
    // In order: five wrong passwords counted 1 to 5, the lock at the fifth, then the right password refused as locked.
    const trail = (await auditFor(u.id)).sort((a, b) => a.id - b.id);
    expect(trail.map((e) => e.action)).toEqual([...Array(5).fill('sign-in.wrong-password'), 'user.locked', 'sign-in.refused']);
    expect(trail.slice(0, 5).map((e) => (e.after as { failures: number }).failures)).toEqual([1, 2, 3, 4, 5]);
    expect(trail[6].after).toMatchObject({ why: 'locked' });

    const admin = await signedIn(h, 'admin@valeharbor.example');
    const listed = await admin.agent.get('/api/v1/users').expect(200);
    expect(listed.body.find((x: { id: number }) => x.id === u.id).lockedUntil).not.toBeNull();
    const unlocked = await admin.agent.post(`/api/v1/users/${u.id}/unlock`).set('X-XSRF-TOKEN', admin.xsrf).expect(200);
    expect(unlocked.body.lockedUntil).toBeNull();
    await s.agent.post('/api/v1/session').set('X-XSRF-TOKEN', s.xsrf).send({ email: u.email, password: 'a-long-test-password' }).expect(200);
  });

  it('refuses a mutating request without the XSRF header, sign-in included', async () => {
    const s = await anonymous(h);
    const res = await s.agent.post('/api/v1/session').send({ email: 'tech@valeharbor.example', password: 'parallax-demo' }).expect(403);
    expect(res.body.issues[0].path).toBe('X-XSRF-TOKEN');
    await s.agent.post('/api/v1/session').set('X-XSRF-TOKEN', 'forged.value').send({ email: 'tech@valeharbor.example', password: 'parallax-demo' }).expect(403);
  });

  it('answers 400 naming the field for a bad body', async () => {
    const s = await anonymous(h);
    const res = await s.agent.post('/api/v1/session').set('X-XSRF-TOKEN', s.xsrf).send({ email: 'not-an-email', password: '' }).expect(400);
    expect(res.body.issues.map((i: { path: string }) => i.path)).toEqual(['email', 'password']);
  });

  it('changes one\'s own password only with the current one, and enforces the rules', async () => {
    const u = await makeUser(['quality'], 'first-password-123');
    const s = await signedIn(h, u.email, 'first-password-123');
    const wrong = await s.agent.put('/api/v1/session/password').set('X-XSRF-TOKEN', s.xsrf).send({ currentPassword: 'nope', newPassword: 'second-password-456' }).expect(400);
    expect(wrong.body.issues[0].path).toBe('currentPassword');
    const short = await s.agent.put('/api/v1/session/password').set('X-XSRF-TOKEN', s.xsrf).send({ currentPassword: 'first-password-123', newPassword: 'short' }).expect(400);
    expect(short.body.issues[0]).toMatchObject({ path: 'newPassword' });
    const elsewhere = await signedIn(h, u.email, 'first-password-123');
    await elsewhere.agent.get('/api/v1/session').expect(200);
    await s.agent.put('/api/v1/session/password').set('X-XSRF-TOKEN', s.xsrf).send({ currentPassword: 'first-password-123', newPassword: 'second-password-456' }).expect(204);
    // The change ends the user's other sessions, not the one that made it.
    await elsewhere.agent.get('/api/v1/session').expect(401);
    await s.agent.get('/api/v1/session').expect(200);
    const changed = (await auditFor(u.id)).find((e) => e.action === 'password.changed')!;
    expect(changed.after).toEqual({ otherSessionsEnded: 1 });
    await signedIn(h, u.email, 'second-password-456');
  });

  it('marks every API answer as not to be cached', async () => {
    const s = await signedIn(h, 'tech@valeharbor.example');
    for (const path of ['/api/v1/session', '/api/v1/studies', '/api/v1/no-such-route']) {
      expect((await s.agent.get(path)).headers['cache-control']).toBe('no-store');
    }
  });

  it('answers 404 with the error shape for an unknown route and never leaks a stack', async () => {
    const res = await (await anonymous(h)).agent.get('/api/v1/no-such-thing').expect(404);
    expect(res.body).toEqual({ error: expect.any(String), issues: [] });
    const bad = await (await anonymous(h)).agent.post('/api/v1/session').set('Content-Type', 'application/json').set('X-XSRF-TOKEN', 'x').send('{');
    expect(JSON.stringify(bad.body)).not.toMatch(/at .*\.ts:\d+/);
  });
});

describe('the account behind a session', () => {

  it('reads the session and its account in one statement, the account as it is now', async () => {
    const u = await makeUser(['technologist']);
    const s = await signedIn(h, u.email, 'a-long-test-password');
    const sent = await queriesDuring(h, () => s.agent.get('/api/v1/session').expect(200));
    expect(sent.filter((q) => /\bsession\b/.test(q) && /\busers\b/.test(q))).toHaveLength(1);
    expect(sent.filter((q) => /from "users"/i.test(q))).toHaveLength(0);
    // A role given or taken away counts from the next request, not from the next sign-in.
    await h.database.db.update(users).set({ roles: ['technologist', 'director'] }).where(eq(users.id, u.id));
    expect((await s.agent.get('/api/v1/session').expect(200)).body.roles).toEqual(['technologist', 'director']);
  });

  it('ends a deactivated user\'s live session at its next request', async () => {
    const u = await makeUser(['technologist']);
    const s = await signedIn(h, u.email, 'a-long-test-password');
    await s.agent.get('/api/v1/worklist').expect(200);
    await h.database.db.update(users).set({ active: false }).where(eq(users.id, u.id));
    await s.agent.get('/api/v1/worklist').expect(401);
    await s.agent.get('/api/v1/session').expect(401);
    const again = await anonymous(h);
    await again.agent.post('/api/v1/session').set('X-XSRF-TOKEN', again.xsrf).send({ email: u.email, password: 'a-long-test-password' }).expect(401);
  });
});

describe('idle time-out', () => {
  let short: Harness;
  beforeAll(async () => { short = await startHarness({ SESSION_IDLE_MINUTES: '0.02' }); });
  afterAll(() => short.close());

  it('expires a session after the idle time-out', async () => {
    const s = await signedIn(short, 'tech@valeharbor.example');
    await s.agent.get('/api/v1/session').expect(200);
    await new Promise((r) => setTimeout(r, 1800));
    await s.agent.get('/api/v1/session').expect(401);
  });

});

describe('a session in use', () => {
  // A 3 s time-out, used every second for 6 s: alive only if each use renews the expiry (at most once per
  // tenth of the time-out), not only the sign-in. A second of margin per step keeps a busy machine from failing it.
  let idle: Harness;
  beforeAll(async () => { idle = await startHarness({ SESSION_IDLE_MINUTES: '0.05' }); });
  afterAll(() => idle.close());

  it('stays alive while it is used: the expiry is renewed, not only set at sign-in', async () => {
    const s = await signedIn(idle, 'tech@valeharbor.example');
    for (let i = 0; i < 6; i++) {
      await new Promise((r) => setTimeout(r, 1000));
      await s.agent.get('/api/v1/session').expect(200);
    }
    await new Promise((r) => setTimeout(r, 3500));
    await s.agent.get('/api/v1/session').expect(401);
  });
});

describe('sign-in limits', () => {
  const opened: { h: Harness; drop: () => Promise<void> }[] = [];
  afterAll(async () => { for (const o of opened) { await o.h.close(); await o.drop(); } });
  /** An app on a database of its own: the counts are per address, and every test here comes from 127.0.0.1. */
  async function limitedApp(env: Record<string, string>, url?: string) {
    const db = url ? { url, drop: async () => {} } : await freshDatabase('limits');
    const app = await startHarness(env, { databaseUrl: db.url });
    opened.push({ h: app, drop: db.drop });
    return app;
  }
  const attempt = (s: Awaited<ReturnType<typeof anonymous>>, email: string, password: string) =>
    s.agent.post('/api/v1/session').set('X-XSRF-TOKEN', s.xsrf).send({ email, password });

  it('counts failures per address, never successes, in PostgreSQL shared by every API process, and audits the refusal', async () => {
    const first = await limitedApp({ SIGN_IN_RATE_LIMIT: '3' });
    // A busy laboratory behind one address signs in again and again.
    for (let i = 0; i < 6; i++) await signedIn(first, 'tech@valeharbor.example');
    const s = await anonymous(first);
    for (const who of ['a', 'b', 'c']) await attempt(s, `nobody.${who}@valeharbor.example`, 'wrong-password-x').expect(401);
    const refused = await attempt(s, 'director@valeharbor.example', 'parallax-demo').expect(429);
    expect(refused.body.error).toMatch(/^Too many failed sign-ins from this address; wait 1[45] minutes and try again$/);
    const events = await first.database.db.select().from(auditEvents).where(eq(auditEvents.action, 'sign-in.rate-limited'));
    expect(events.length).toBe(1);
    // A second API process on the same database sees the same counts.
    const second = await limitedApp({ SIGN_IN_RATE_LIMIT: '3' }, (first.database.pool as unknown as { options: { connectionString: string } }).options.connectionString);
    await attempt(await anonymous(second), 'director@valeharbor.example', 'parallax-demo').expect(429);
  });

  it('counts failures per account, so one e-mail is refused while others from the address sign in', async () => {
    const app = await limitedApp({ SIGN_IN_RATE_LIMIT: '1000' });
    const s = await anonymous(app);
    for (let i = 0; i < 10; i++) await attempt(s, 'guessed@valeharbor.example', `wrong-password-${i}`).expect(401);
    const refused = await attempt(s, 'guessed@valeharbor.example', 'wrong-password-x').expect(429);
    expect(refused.body.error).toMatch(/^Too many failed sign-ins for this account; wait/);
    await signedIn(app, 'tech@valeharbor.example');
  });
});
