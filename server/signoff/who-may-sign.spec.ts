import ExcelJS from 'exceljs';
import { and, asc, desc, eq, gt } from 'drizzle-orm';
import { hashPassword } from '../auth/passwords';
import { auditEvents, laboratories, users } from '../db/schema';
import { analysedComparison } from '../test/fixtures';
import { binary, Harness, signedIn, startHarness, uniqueEmail } from '../test/harness';

let h: Harness;
beforeAll(async () => { h = await startHarness({}, { jobs: true }); });
afterAll(() => h.close());

type Session = Awaited<ReturnType<typeof signedIn>>;
const post = (s: Session, path: string, body: object = {}) => s.agent.post(`/api/v1${path}`).set('X-XSRF-TOKEN', s.xsrf).send(body);
const awaitingIds = async (s: Session): Promise<number[]> => (await s.agent.get('/api/v1/worklist').expect(200)).body.awaitingSignature.map((x: { id: number }) => x.id);
const mayISign = async (s: Session, id: number) => (await s.agent.get(`/api/v1/studies/${id}`).expect(200)).body.mayISign;

/** A submitted comparison whose 40 rows `s` entered. */
async function submittedBy(s: Session, title: string): Promise<number> {
  const study = await analysedComparison(h, s, `${title} ${Date.now()}`);
  await post(s, `/studies/${study.id}/submit`).expect(200);
  return study.id;
}

async function setSelfSign(allow: boolean): Promise<void> {
  const admin = await signedIn(h, 'admin@valeharbor.example');
  const lab = (await admin.agent.get('/api/v1/laboratory')).body;
  await admin.agent.put('/api/v1/laboratory').set('X-XSRF-TOKEN', admin.xsrf).send({ timeZone: lab.timeZone, planApprovalRequired: false, allowSelfSign: allow }).expect(200);
}

/** A second director of Vale Harbor of this test's own, so counting wrong passwords touches no demo user. */
async function newDirector(): Promise<{ session: Session; id: number; password: string }> {
  const [lab] = await h.database.db.select().from(laboratories).where(eq(laboratories.name, 'Vale Harbor Regional Laboratory'));
  const email = uniqueEmail('signer');
  const password = 'director-password-3';
  const [row] = await h.database.db.insert(users).values({ laboratoryId: lab.id, name: 'Dr. Wren Halloway', email, roles: ['director'], passwordHash: await hashPassword(password) })
    .returning({ id: users.id });
  return { session: await signedIn(h, email, password), id: row.id, password };
}

const studyEvents = (studyId: number, action: string) =>
  h.database.db.select().from(auditEvents).where(and(eq(auditEvents.studyId, studyId), eq(auditEvents.action, action))).orderBy(asc(auditEvents.id));

describe('who may sign', () => {
  it("lists under Awaiting my signature only what a technologist-director may sign, with one-person sign-off off and on", async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const lead = await signedIn(h, 'lead@valeharbor.example');
    const director = await signedIn(h, 'director@valeharbor.example');
    const others = await submittedBy(tech, 'Entered by the technologist');
    const own = await submittedBy(lead, 'Entered by the lead');

    await setSelfSign(false);
    try {
      const leads = await awaitingIds(lead);
      expect(leads).toContain(others);
      expect(leads).not.toContain(own);
      expect(await awaitingIds(director)).toEqual(expect.arrayContaining([others, own]));
      expect(await awaitingIds(tech)).toEqual([]);

      await setSelfSign(true);
      expect(await awaitingIds(lead)).toEqual(expect.arrayContaining([others, own]));
    } finally {
      await setSelfSign(false);
    }
  });

  it('says in the study response whether the reader may sign it, and who may and why', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const lead = await signedIn(h, 'lead@valeharbor.example');
    const director = await signedIn(h, 'director@valeharbor.example');
    const quality = await signedIn(h, 'quality@valeharbor.example');
    const others = await submittedBy(tech, 'Who signs: technologist rows');
    const own = await submittedBy(lead, 'Who signs: lead rows');

    await setSelfSign(false);
    try {
      expect(await mayISign(lead, own)).toEqual({ allowed: false, why: 'You entered rows of this study; this laboratory requires another director to sign it (segregation of duties).' });
      expect(await mayISign(lead, others)).toEqual({ allowed: true, why: 'You may sign it. Any director but Tomas Reyes, who entered its rows, may sign it.' });
      expect(await mayISign(director, own)).toEqual({ allowed: true, why: 'You may sign it. Any director but Priya Nair, who entered its rows, may sign it.' });
      expect(await mayISign(tech, others)).toEqual({ allowed: false, why: 'Any director but Tomas Reyes, who entered its rows, may sign it.' });
      expect(await mayISign(quality, own)).toEqual({ allowed: false, why: 'Any director but Priya Nair, who entered its rows, may sign it.' });

      // Refused before the password: a wrong one is neither counted nor recorded as a refused signature.
      const refused = await post(lead, `/studies/${own}/sign`, { meaning: 'accepted', password: 'not-the-password' }).expect(403);
      expect(refused.body.error).toBe('You entered rows of this study; this laboratory requires another director to sign it (segregation of duties).');
      expect(await studyEvents(own, 'signature.refused')).toEqual([]);
      const [leadRow] = await h.database.db.select().from(users).where(eq(users.email, 'lead@valeharbor.example'));
      expect(leadRow.failedSignIns).toBe(0);

      await setSelfSign(true);
      expect(await mayISign(lead, own)).toEqual({
        allowed: true, why: 'You entered rows of this study; this laboratory allows one-person sign-off, so you may sign it, and the history records that you did.',
      });
      expect(await mayISign(tech, own)).toEqual({ allowed: false, why: 'Any director may sign it: this laboratory allows one-person sign-off.' });
    } finally {
      await setSelfSign(false);
    }
    const draft = await analysedComparison(h, tech, `Who signs: a draft ${Date.now()}`);
    expect(await mayISign(director, draft.id)).toEqual({ allowed: false, why: 'A study is signed only after it is submitted for sign-off.' });
    const signed = (await post(director, `/studies/${others}/sign`, { meaning: 'accepted', password: 'parallax-demo' }).expect(200)).body;
    expect(signed.mayISign.allowed).toBe(false);
    expect(signed.mayISign.why).toMatch(/^This study is signed/);
  });
});

describe('a refused e-signature', () => {
  it('records a wrong password once, as a refused signature of that study, in its history, the laboratory history and its export', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const id = await submittedBy(tech, 'Refused signature');
    const signer = await newDirector();
    const [before] = await h.database.db.select({ id: auditEvents.id }).from(auditEvents).orderBy(desc(auditEvents.id)).limit(1);

    const wrong = await post(signer.session, `/studies/${id}/sign`, { meaning: 'accepted', password: 'not-mine' }).expect(400);
    expect(wrong.body.issues).toEqual([{ path: 'password', message: 'The password is wrong' }]);

    const refused = await studyEvents(id, 'signature.refused');
    expect(refused).toHaveLength(1);
    expect(refused[0]).toMatchObject({ entity: 'study', entityId: String(id), studyId: id, userId: signer.id, userName: 'Dr. Wren Halloway' });
    expect(refused[0].after).toMatchObject({ why: 'wrong password', failures: 1, meaning: 'accepted' });
    // The one event is all: no lab-wide "wrong password" on the user besides it.
    const mine = await h.database.db.select().from(auditEvents).where(and(eq(auditEvents.userId, signer.id), gt(auditEvents.id, before.id)));
    expect(mine.map((e) => e.action).filter((a) => a !== 'sign-in')).toEqual(['signature.refused']);

    const history = (await tech.agent.get(`/api/v1/studies/${id}/history`).expect(200)).body as { action: string; headline: string; details: string[] }[];
    expect(history.filter((e) => e.action === 'signature.refused')).toEqual([
      expect.objectContaining({ headline: 'Signature refused: wrong password', details: ['meaning chosen: accepted for patient testing', 'wrong passwords in a row: 1'] }),
    ]);
    const quality = await signedIn(h, 'quality@valeharbor.example');
    const lab = (await quality.agent.get(`/api/v1/audit?studyId=${id}&action=signature.`).expect(200)).body;
    expect(lab.items.map((e: { headline: string; userName: string }) => [e.headline, e.userName])).toEqual([['Signature refused: wrong password', 'Dr. Wren Halloway']]);

    const bytes = (await quality.agent.get(`/api/v1/studies/${id}/export.xlsx`).buffer(true).parse(binary).expect(200)).body;
    const book = new ExcelJS.Workbook();
    await book.xlsx.load(bytes);
    const [header, ...lines] = book.getWorksheet('Audit history')!.getSheetValues().filter(Boolean) as unknown[][];
    const rows = lines.map((r) => ['Who', 'What', 'Details'].map((name) => r[header.indexOf(name)]));
    expect(rows.filter((r) => r[1] === 'Signature refused: wrong password')).toEqual([
      ['Dr. Wren Halloway', 'Signature refused: wrong password', 'meaning chosen: accepted for patient testing\nwrong passwords in a row: 1'],
    ]);

    // The right password afterwards signs, and the count starts again.
    await post(signer.session, `/studies/${id}/sign`, { meaning: 'accepted', password: signer.password }).expect(200);
    const [after] = await h.database.db.select().from(users).where(eq(users.id, signer.id));
    expect(after.failedSignIns).toBe(0);
  });

  it('still locks the account at the fifth wrong signing password, and records each refusal on the study', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const id = await submittedBy(tech, 'Locked signer');
    const signer = await newDirector();
    for (let i = 0; i < 5; i++) await post(signer.session, `/studies/${id}/sign`, { meaning: 'not-accepted', password: `nope-${i}` }).expect(400);
    await post(signer.session, `/studies/${id}/sign`, { meaning: 'not-accepted', password: signer.password }).expect(423);

    const [row] = await h.database.db.select().from(users).where(eq(users.id, signer.id));
    expect(row.failedSignIns).toBe(5);
    expect(row.lockedUntil!.getTime()).toBeGreaterThan(Date.now());
    const refused = await studyEvents(id, 'signature.refused');
    expect(refused.map((e) => e.after)).toEqual([
      ...[1, 2, 3, 4, 5].map((failures) => expect.objectContaining({ why: 'wrong password', failures })),
      expect.objectContaining({ why: 'account locked' }),
    ]);
    const locked = await h.database.db.select().from(auditEvents).where(and(eq(auditEvents.userId, signer.id), eq(auditEvents.action, 'user.locked')));
    expect(locked).toHaveLength(1);
    expect((await tech.agent.get(`/api/v1/studies/${id}/history`)).body.filter((e: { action: string }) => e.action === 'signature.refused').map((e: { headline: string }) => e.headline))
      .toEqual([...Array(5).fill('Signature refused: wrong password'), 'Signature refused: account locked']);
  });

  it('records a wrong password at plan approval on the study, and nothing for a study of another laboratory', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const draft = await analysedComparison(h, tech, `Plan refused ${Date.now()}`);
    const signer = await newDirector();
    await post(signer.session, `/studies/${draft.id}/plan-approval`, { password: 'not-mine' }).expect(400);
    const history = (await tech.agent.get(`/api/v1/studies/${draft.id}/history`)).body as { action: string; headline: string }[];
    expect(history.filter((e) => e.action === 'signature.refused').map((e) => e.headline)).toEqual(['Plan approval refused: wrong password']);

    const elsewhere = await signedIn(h, 'director@cedarpoint.example');
    const beforeCount = (await studyEvents(draft.id, 'signature.refused')).length;
    await post(elsewhere, `/studies/${draft.id}/sign`, { meaning: 'accepted', password: 'wrong' }).expect(404);
    await post(elsewhere, `/studies/${draft.id}/plan-approval`, { password: 'wrong' }).expect(404);
    expect(await studyEvents(draft.id, 'signature.refused')).toHaveLength(beforeCount);
    await post(signer.session, `/studies/${draft.id}/plan-approval`, { password: signer.password }).expect(200);
  });
});
