import { eq } from 'drizzle-orm';
import { auditEvents, users } from '../db/schema';
import { anonymous, Harness, signedIn, startHarness, uniqueEmail } from '../test/harness';
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
    expect((await auditFor(u.id)).map((e) => e.action)).toEqual(expect.arrayContaining(['user.locked', 'sign-in.refused']));

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
    expect(res.body.issues.map((i: { path: string }) => i.path)).toEqual(expect.arrayContaining(['email', 'password']));
  });

  it('changes one\'s own password only with the current one, and enforces the rules', async () => {
    const u = await makeUser(['quality'], 'first-password-123');
    const s = await signedIn(h, u.email, 'first-password-123');
    const wrong = await s.agent.put('/api/v1/session/password').set('X-XSRF-TOKEN', s.xsrf).send({ currentPassword: 'nope', newPassword: 'second-password-456' }).expect(400);
    expect(wrong.body.issues[0].path).toBe('currentPassword');
    const short = await s.agent.put('/api/v1/session/password').set('X-XSRF-TOKEN', s.xsrf).send({ currentPassword: 'first-password-123', newPassword: 'short' }).expect(400);
    expect(short.body.issues[0]).toMatchObject({ path: 'newPassword' });
    await s.agent.put('/api/v1/session/password').set('X-XSRF-TOKEN', s.xsrf).send({ currentPassword: 'first-password-123', newPassword: 'second-password-456' }).expect(204);
    await signedIn(h, u.email, 'second-password-456');
  });

  it('answers 404 with the error shape for an unknown route and never leaks a stack', async () => {
    const res = await (await anonymous(h)).agent.get('/api/v1/no-such-thing').expect(404);
    expect(res.body).toEqual({ error: expect.any(String), issues: [] });
    const bad = await (await anonymous(h)).agent.post('/api/v1/session').set('Content-Type', 'application/json').set('X-XSRF-TOKEN', 'x').send('{');
    expect(JSON.stringify(bad.body)).not.toMatch(/at .*\.ts:\d+/);
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

describe('rate limit', () => {
  let limited: Harness;
  beforeAll(async () => { limited = await startHarness({ SIGN_IN_RATE_LIMIT: '3' }); });
  afterAll(() => limited.close());

  it('limits sign-in attempts per address and audits the refusal', async () => {
    const s = await anonymous(limited);
    for (let i = 0; i < 3; i++) await s.agent.post('/api/v1/session').set('X-XSRF-TOKEN', s.xsrf).send({ email: 'nobody@valeharbor.example', password: 'x' }).expect(401);
    const res = await s.agent.post('/api/v1/session').set('X-XSRF-TOKEN', s.xsrf).send({ email: 'nobody@valeharbor.example', password: 'x' }).expect(429);
    expect(res.body.error).toMatch(/Too many sign-in attempts/);
    const events = await limited.database.db.select().from(auditEvents).where(eq(auditEvents.action, 'sign-in.rate-limited'));
    expect(events.length).toBeGreaterThan(0);
  });
});
