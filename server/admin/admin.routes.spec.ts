import { and, asc, eq } from 'drizzle-orm';
import { auditEvents, mailMessages, passwordLinks } from '../db/schema';
import { anonymous, Harness, signedIn, startHarness, uniqueEmail } from '../test/harness';

let h: Harness;
beforeAll(async () => { h = await startHarness(); });
afterAll(() => h.close());

const analyte = (name: string) => ({
  name, unit: 'mmol/L', decimals: 2, decisionLevels: [1, 2.5], allowableBiasAbsolute: 0.1, allowableBiasPercent: null,
  allowableBiasSource: 'Laboratory goal (test)', canBeNegative: false, active: true,
});

async function mailTo(email: string) {
  await h.ctx.mail.flush();
  for (let i = 0; i < 50; i++) {
    const rows = await h.database.db.select().from(mailMessages);
    const hit = rows.find((m) => m.to.includes(email));
    if (hit) return hit;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no mail reached ${email}`);
}

describe('users', () => {
  it('invites a user by e-mail; the one-time link sets a password that signs in, and works once', async () => {
    const admin = await signedIn(h, 'admin@valeharbor.example');
    const email = uniqueEmail('invitee');
    const res = await admin.agent.post('/api/v1/users').set('X-XSRF-TOKEN', admin.xsrf).send({ name: 'New Person', email, roles: ['technologist'] }).expect(201);
    expect(res.body).toMatchObject({ email, hasPassword: false, active: true });
    const mail = await mailTo(email);
    const token = /\/set-password\/([A-Za-z0-9_-]+)/.exec(mail.text)![1];
    const visitor = await anonymous(h);
    const info = await visitor.agent.get(`/api/v1/password-links/${token}`).expect(200);
    expect(info.body.email).toBe(email);
    await visitor.agent.post(`/api/v1/password-links/${token}`).set('X-XSRF-TOKEN', visitor.xsrf).send({ password: 'short' }).expect(400);
    await visitor.agent.post(`/api/v1/password-links/${token}`).set('X-XSRF-TOKEN', visitor.xsrf).send({ password: 'my-own-long-password' }).expect(204);
    await signedIn(h, email, 'my-own-long-password');
    await visitor.agent.post(`/api/v1/password-links/${token}`).set('X-XSRF-TOKEN', visitor.xsrf).send({ password: 'another-long-password' }).expect(404);
    const mailbox = await admin.agent.get('/api/v1/mailbox').expect(200);
    expect(mailbox.body.some((m: { to: string[] }) => m.to.includes(email))).toBe(true);
  });

  it('invites an e-mail that has an account in another laboratory exactly as any other, and only the link reveals it', async () => {
    const admin = await signedIn(h, 'admin@valeharbor.example');
    const fresh = await admin.agent.post('/api/v1/users').set('X-XSRF-TOKEN', admin.xsrf).send({ name: 'Someone New', email: uniqueEmail('fresh'), roles: ['technologist'] }).expect(201);
    const taken = await admin.agent.post('/api/v1/users').set('X-XSRF-TOKEN', admin.xsrf).send({ name: 'Rui Matos', email: 'tech@cedarpoint.example', roles: ['technologist'] }).expect(201);
    expect(Object.keys(taken.body).sort()).toEqual(Object.keys(fresh.body).sort());
    expect(taken.body).toMatchObject({ email: 'tech@cedarpoint.example', hasPassword: false, active: true });
    // The owner of the address follows the link and learns it there; the other laboratory's account is untouched.
    const token = /\/set-password\/([A-Za-z0-9_-]+)/.exec((await mailTo('tech@cedarpoint.example')).text)![1];
    const visitor = await anonymous(h);
    const res = await visitor.agent.post(`/api/v1/password-links/${token}`).set('X-XSRF-TOKEN', visitor.xsrf).send({ password: 'my-own-long-password' }).expect(409);
    expect(res.body.error).toBe('This e-mail address already has a Parallax account in another laboratory; ask the administrator who invited you to use another address');
    const cedar = await signedIn(h, 'tech@cedarpoint.example');
    expect((await cedar.agent.get('/api/v1/session')).body.laboratory.name).toMatch(/Cedar Point/);
  });

  it('refuses an expired link', async () => {
    const admin = await signedIn(h, 'admin@valeharbor.example');
    const email = uniqueEmail('late');
    const res = await admin.agent.post('/api/v1/users').set('X-XSRF-TOKEN', admin.xsrf).send({ name: 'Late Person', email, roles: ['quality'] }).expect(201);
    const token = /\/set-password\/([A-Za-z0-9_-]+)/.exec((await mailTo(email)).text)![1];
    await h.database.db.update(passwordLinks).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(passwordLinks.userId, res.body.id));
    await (await anonymous(h)).agent.get(`/api/v1/password-links/${token}`).expect(404);
  });

  it('refuses a duplicate e-mail naming the field, and changes nothing', async () => {
    const admin = await signedIn(h, 'admin@valeharbor.example');
    const before = (await admin.agent.get('/api/v1/users')).body.length;
    const res = await admin.agent.post('/api/v1/users').set('X-XSRF-TOKEN', admin.xsrf).send({ name: 'Copy', email: 'tech@valeharbor.example', roles: ['technologist'] }).expect(400);
    expect(res.body.issues[0].path).toBe('email');
    expect((await admin.agent.get('/api/v1/users')).body.length).toBe(before);
  });

  it('assigns roles and deactivates with before and after in the audit trail; a deactivated user\'s live session ends and signing in again is refused', async () => {
    const admin = await signedIn(h, 'admin@valeharbor.example');
    const email = uniqueEmail('roles');
    const created = (await admin.agent.post('/api/v1/users').set('X-XSRF-TOKEN', admin.xsrf).send({ name: 'Role Person', email, roles: ['technologist'] })).body;
    const changed = await admin.agent.patch(`/api/v1/users/${created.id}`).set('X-XSRF-TOKEN', admin.xsrf).send({ roles: ['technologist', 'director'] }).expect(200);
    expect(changed.body.roles).toEqual(['technologist', 'director']);
    await admin.agent.patch(`/api/v1/users/${created.id}`).set('X-XSRF-TOKEN', admin.xsrf).send({ roles: ['chief'] }).expect(400);
    // The user sets a password from the invitation and signs in: a live session, and the password works.
    const token = /\/set-password\/([A-Za-z0-9_-]+)/.exec((await mailTo(email)).text)![1];
    const visitor = await anonymous(h);
    await visitor.agent.post(`/api/v1/password-links/${token}`).set('X-XSRF-TOKEN', visitor.xsrf).send({ password: 'role-person-password' }).expect(204);
    const live = await signedIn(h, email, 'role-person-password');
    await live.agent.get('/api/v1/worklist').expect(200);

    await admin.agent.patch(`/api/v1/users/${created.id}`).set('X-XSRF-TOKEN', admin.xsrf).send({ active: false }).expect(200);
    // The live session is refused at its next request, and signing in again with the right password is refused.
    await live.agent.get('/api/v1/worklist').expect(401);
    await live.agent.get('/api/v1/session').expect(401);
    const again = await anonymous(h);
    const refused = await again.agent.post('/api/v1/session').set('X-XSRF-TOKEN', again.xsrf).send({ email, password: 'role-person-password' }).expect(401);
    expect(refused.body.error).toBe('E-mail or password is wrong, or the account is locked or inactive');
    await again.agent.get('/api/v1/session').expect(401);

    // In the order they were written: the role change, the deactivation, the refused sign-in.
    const events = await h.database.db.select().from(auditEvents)
      .where(and(eq(auditEvents.entity, 'user'), eq(auditEvents.entityId, String(created.id)))).orderBy(asc(auditEvents.id));
    const updates = events.filter((e) => e.action === 'user.updated');
    expect(updates).toHaveLength(2);
    expect(updates[0].before).toMatchObject({ roles: ['technologist'], active: true });
    expect(updates[0].after).toMatchObject({ roles: ['technologist', 'director'], active: true });
    expect(updates[1].before).toMatchObject({ active: true });
    expect(updates[1].after).toMatchObject({ active: false });
    const refusal = events.filter((e) => e.action === 'sign-in.refused');
    expect(refusal).toHaveLength(1);
    expect(refusal[0].after).toMatchObject({ why: 'inactive' });
    expect(refusal[0].id).toBeGreaterThan(updates[1].id);
  });
});

describe('catalog', () => {
  it('creates and edits an analyte, requiring the source of its allowable bias', async () => {
    const admin = await signedIn(h, 'admin@valeharbor.example');
    const bad = await admin.agent.post('/api/v1/analytes').set('X-XSRF-TOKEN', admin.xsrf).send({ ...analyte('Lactate'), allowableBiasSource: '' }).expect(400);
    expect(bad.body.issues.map((i: { path: string }) => i.path)).toContain('allowableBiasSource');
    const made = await admin.agent.post('/api/v1/analytes').set('X-XSRF-TOKEN', admin.xsrf).send(analyte(`Lactate ${Date.now()}`)).expect(201);
    const edited = await admin.agent.put(`/api/v1/analytes/${made.body.id}`).set('X-XSRF-TOKEN', admin.xsrf).send({ ...analyte(made.body.name), decisionLevels: [2, 4] }).expect(200);
    expect(edited.body.decisionLevels).toEqual([2, 4]);
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const list = await tech.agent.get('/api/v1/analytes').expect(200);
    expect(list.body.find((a: { id: number }) => a.id === made.body.id).decisionLevels).toEqual([2, 4]);
  });

  it('creates an instrument and refuses a second one of the same name', async () => {
    const admin = await signedIn(h, 'admin@valeharbor.example');
    const body = { name: `Analyzer ${Date.now()}`, model: 'Test model', serial: 'S-1', location: 'Bench 9', active: true };
    await admin.agent.post('/api/v1/instruments').set('X-XSRF-TOKEN', admin.xsrf).send(body).expect(201);
    const dup = await admin.agent.post('/api/v1/instruments').set('X-XSRF-TOKEN', admin.xsrf).send(body).expect(400);
    expect(dup.body.issues[0].path).toBe('name');
  });
});

describe('laboratory isolation', () => {
  it('answers 404 for another laboratory\'s records and never lists them', async () => {
    const vale = await signedIn(h, 'admin@valeharbor.example');
    const cedar = await signedIn(h, 'admin@cedarpoint.example');
    const valeAnalyte = (await vale.agent.get('/api/v1/analytes')).body[0];
    const valeUser = (await vale.agent.get('/api/v1/users')).body[0];
    const valeInstrument = (await vale.agent.get('/api/v1/instruments')).body[0];
    await cedar.agent.put(`/api/v1/analytes/${valeAnalyte.id}`).set('X-XSRF-TOKEN', cedar.xsrf).send(analyte('Stolen')).expect(404);
    await cedar.agent.put(`/api/v1/instruments/${valeInstrument.id}`).set('X-XSRF-TOKEN', cedar.xsrf).send({ name: 'x', model: '', serial: '', location: '', active: true }).expect(404);
    await cedar.agent.patch(`/api/v1/users/${valeUser.id}`).set('X-XSRF-TOKEN', cedar.xsrf).send({ active: false }).expect(404);
    await cedar.agent.post(`/api/v1/users/${valeUser.id}/unlock`).set('X-XSRF-TOKEN', cedar.xsrf).expect(404);
    const cedarUsers = (await cedar.agent.get('/api/v1/users')).body.map((u: { email: string }) => u.email);
    expect(cedarUsers).toContain('admin@cedarpoint.example');
    expect(cedarUsers.filter((e: string) => !e.endsWith('@cedarpoint.example'))).toEqual([]);
    // Each laboratory invites someone; each mailbox holds its own invitation and not the other's (never empty here).
    const cedarEmail = uniqueEmail('iso-cedar').replace('@valeharbor.example', '@cedarpoint.example');
    const valeEmail = uniqueEmail('iso-vale');
    await cedar.agent.post('/api/v1/users').set('X-XSRF-TOKEN', cedar.xsrf).send({ name: 'Cedar Invitee', email: cedarEmail, roles: ['technologist'] }).expect(201);
    await vale.agent.post('/api/v1/users').set('X-XSRF-TOKEN', vale.xsrf).send({ name: 'Vale Invitee', email: valeEmail, roles: ['technologist'] }).expect(201);
    await mailTo(cedarEmail);
    await mailTo(valeEmail);
    const recipients = async (s: typeof vale) => ((await s.agent.get('/api/v1/mailbox').expect(200)).body as { to: string[] }[]).map((m) => m.to);
    const cedarMail = await recipients(cedar);
    expect(cedarMail).toContainEqual([cedarEmail]);
    expect(cedarMail.filter((to) => !to.some((t) => t.endsWith('@cedarpoint.example')))).toEqual([]);
    const valeMail = await recipients(vale);
    expect(valeMail).toContainEqual([valeEmail]);
    expect(valeMail).not.toContainEqual([cedarEmail]);
  });
});
