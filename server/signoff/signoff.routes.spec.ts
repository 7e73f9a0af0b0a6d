import { eq, sql } from 'drizzle-orm';
import { auditEvents, laboratories, mailMessages, signatures, specimens, studies, users } from '../db/schema';
import { analysedComparison, createComparison, inventedPairs, waitForAnalysis } from '../test/fixtures';
import { binary, Harness, signedIn, startHarness } from '../test/harness';

let h: Harness;
beforeAll(async () => { h = await startHarness({}, { jobs: true }); });
afterAll(() => h.close());

const post = (s: Awaited<ReturnType<typeof signedIn>>, path: string, body: object = {}) => s.agent.post(`/api/v1${path}`).set('X-XSRF-TOKEN', s.xsrf).send(body);

async function mailsTo(email: string, subject: RegExp) {
  await h.ctx.mail.flush();
  for (let i = 0; i < 40; i++) {
    const rows = (await h.database.db.select().from(mailMessages)).filter((m) => m.to.includes(email) && subject.test(m.subject));
    if (rows.length) return rows;
    await new Promise((r) => setTimeout(r, 100));
  }
  return [];
}

describe('submission and review', () => {
  it('refuses to submit without current findings, naming the reason', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = await createComparison(h, tech);
    const res = await post(tech, `/studies/${study.id}/submit`).expect(400);
    expect(res.body.error).toMatch(/Run the analysis first/);
    const analysed = await analysedComparison(h, tech);
    const rows = (await tech.agent.get(`/api/v1/studies/${analysed.id}/specimens`)).body;
    await tech.agent.put(`/api/v1/studies/${analysed.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: rows.version, rows: inventedPairs(39) }).expect(200);
    const stale = await post(tech, `/studies/${analysed.id}/submit`).expect(400);
    expect(stale.body.issues[0]).toMatchObject({ path: 'findings', message: expect.stringMatching(/out of date/) });
  });

  it('refuses to submit while included rows repeat a label, naming the labels, and excluding one of each pair resolves it', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = await createComparison(h, tech);
    const rows = inventedPairs(40).map((r, i) => (i === 20 ? { ...r, label: 'S003' } : i === 30 ? { ...r, label: ' s011' } : r));
    const saved = await tech.agent.put(`/api/v1/studies/${study.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: study.version, rows }).expect(200);
    const analyse = async () => waitForAnalysis(tech, (await post(tech, `/studies/${study.id}/analyses`).expect(202)).body.id);
    const analysed = await analyse();
    expect(analysed.results.warnings[0]).toBe('Labels S003, S011 appear more than once among the analysed rows (4 rows): a specimen entered twice counts twice in every estimate; check the labels, or exclude the extra rows with a reason.');
    const refused = await post(tech, `/studies/${study.id}/submit`).expect(400);
    const problem = 'Labels S003, S011 appear more than once among the included rows (4 rows); give each specimen its own label, or exclude the extra rows with a reason';
    expect(refused.body.issues).toEqual([{ path: 'rows', message: problem }]);
    expect(refused.body.error).toBe(`The study cannot be submitted yet: ${problem}`);

    const excluded = rows.map((r, i) => (i === 20 || i === 30 ? { ...r, excluded: true, exclusionReason: 'the same specimen entered twice' } : r));
    await tech.agent.put(`/api/v1/studies/${study.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: saved.body.version, rows: excluded }).expect(200);
    const again = await analyse();
    expect(again.results.warnings.filter((w: string) => w.includes('more than once'))).toEqual([]);
    expect((await post(tech, `/studies/${study.id}/submit`).expect(200)).body.state).toBe('awaiting-signoff');
  });

  it('submits, locks the rows, mails the directors, and the director returns it with a required comment', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const title = `Review ${Date.now()}`;
    const study = await analysedComparison(h, tech, title);
    const submitted = await post(tech, `/studies/${study.id}/submit`).expect(200);
    expect(submitted.body.state).toBe('awaiting-signoff');
    await tech.agent.put(`/api/v1/studies/${study.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: submitted.body.version, rows: [] }).expect(409);
    // This study's mails (by its unique title), not any earlier study's: one to each director.
    const mails = await mailsTo('director@valeharbor.example', new RegExp(`^Awaiting your signature: ${title}$`));
    expect(mails).toHaveLength(1);
    expect(mails[0].text).toContain(`/studies/${study.id}/review`);
    expect(await mailsTo('lead@valeharbor.example', new RegExp(`^Awaiting your signature: ${title}$`))).toHaveLength(1);
    const director = await signedIn(h, 'director@valeharbor.example');
    expect((await director.agent.get('/api/v1/worklist')).body.awaitingSignature.map((s: { id: number }) => s.id)).toContain(study.id);
    await post(director, `/studies/${study.id}/return`, { comment: '' }).expect(400);
    const returned = await post(director, `/studies/${study.id}/return`, { comment: 'Add the specimens above 20 mmol/L' }).expect(200);
    expect(returned.body).toMatchObject({ state: 'draft', returnComment: 'Add the specimens above 20 mmol/L' });
    const returnedMails = await mailsTo('tech@valeharbor.example', new RegExp(`^Returned to you: ${title}$`));
    expect(returnedMails).toHaveLength(1);
    expect(returnedMails[0].text).toContain('Add the specimens above 20 mmol/L');
    expect((await tech.agent.get('/api/v1/worklist')).body.returned.map((s: { id: number }) => s.id)).toContain(study.id);
  });
});

describe('electronic signature', () => {
  it('refuses a wrong password and audits it, then signs with the right one and binds the PDF to the content hash', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const title = `Signed with the right password ${Date.now()}`;
    const study = await analysedComparison(h, tech, title);
    await post(tech, `/studies/${study.id}/submit`).expect(200);
    const director = await signedIn(h, 'director@valeharbor.example');
    await post(tech, `/studies/${study.id}/sign`, { meaning: 'accepted', password: 'parallax-demo' }).expect(403);
    const wrong = await post(director, `/studies/${study.id}/sign`, { meaning: 'accepted', password: 'not-mine' }).expect(400);
    expect(wrong.body.issues[0].path).toBe('password');
    const [me] = await h.database.db.select().from(users).where(eq(users.email, 'director@valeharbor.example'));
    const refusals = await h.database.db.select().from(auditEvents)
      .where(sql`${auditEvents.userId} = ${me.id} AND ${auditEvents.studyId} = ${study.id} AND ${auditEvents.action} = 'signature.refused'`);
    expect(refusals).toHaveLength(1);
    expect(refusals[0].after).toMatchObject({ why: 'wrong password', meaning: 'accepted' });
    const signed = await post(director, `/studies/${study.id}/sign`, { meaning: 'accepted', comment: 'Fit for use', password: 'parallax-demo' }).expect(200);
    expect(signed.body.state).toBe('signed');
    const [sig] = await h.database.db.select().from(signatures).where(eq(signatures.studyId, study.id));
    expect(sig).toMatchObject({ signerName: 'Dr. Imani Okafor', meaning: 'accepted', comment: 'Fit for use' });
    expect(sig.contentHash).toMatch(/^[0-9a-f]{64}$/);
    const first = await director.agent.get(`/api/v1/studies/${study.id}/report.pdf`).buffer(true).parse(binary).expect(200);
    const second = await director.agent.get(`/api/v1/studies/${study.id}/report.pdf`).buffer(true).parse(binary).expect(200);
    expect(Buffer.compare(first.body, second.body)).toBe(0);
    expect(require('node:crypto').createHash('sha256').update(first.body).digest('hex')).toBe(sig.pdfSha256);
    expect(first.body.subarray(0, 5).toString()).toBe('%PDF-');
    const signedMails = await mailsTo('tech@valeharbor.example', new RegExp(`^Signed: ${title}$`));
    expect(signedMails).toHaveLength(1);
    expect(signedMails[0].text).toContain('Comment: Fit for use');
  });

  it('locks the account after five wrong signing passwords', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = await analysedComparison(h, tech);
    await post(tech, `/studies/${study.id}/submit`).expect(200);
    const admin = await signedIn(h, 'admin@valeharbor.example');
    const email = `signer.${Date.now()}@valeharbor.example`;
    const [lab] = await h.database.db.select().from(laboratories).where(eq(laboratories.name, 'Vale Harbor Regional Laboratory'));
    const { hashPassword } = await import('../auth/passwords');
    await h.database.db.insert(users).values({ laboratoryId: lab.id, name: 'Second Director', email, roles: ['director'], passwordHash: await hashPassword('director-password-2') });
    const d2 = await signedIn(h, email, 'director-password-2');
    for (let i = 0; i < 5; i++) await post(d2, `/studies/${study.id}/sign`, { meaning: 'accepted', password: `nope-${i}` }).expect(400);
    await post(d2, `/studies/${study.id}/sign`, { meaning: 'accepted', password: 'director-password-2' }).expect(423);
    expect((await admin.agent.get('/api/v1/users')).body.find((u: { email: string }) => u.email === email).lockedUntil).not.toBeNull();
  });

  it('counts wrong signing passwords from zero again after the right one', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const first = await analysedComparison(h, tech);
    const second = await analysedComparison(h, tech);
    for (const study of [first, second]) await post(tech, `/studies/${study.id}/submit`).expect(200);
    const email = `signer.reset.${Date.now()}@valeharbor.example`;
    const [lab] = await h.database.db.select().from(laboratories).where(eq(laboratories.name, 'Vale Harbor Regional Laboratory'));
    const { hashPassword } = await import('../auth/passwords');
    const [d] = await h.database.db.insert(users).values({ laboratoryId: lab.id, name: 'Resetting Director', email, roles: ['director'], passwordHash: await hashPassword('director-password-3') }).returning();
    const signer = await signedIn(h, email, 'director-password-3');
    const account = async () => (await h.database.db.select().from(users).where(eq(users.id, d.id)))[0];

    // Four wrong, then the right one: signed, and the count is back to 0.
    for (let i = 0; i < 4; i++) await post(signer, `/studies/${first.id}/sign`, { meaning: 'accepted', password: `nope-${i}` }).expect(400);
    expect((await account()).failedSignIns).toBe(4);
    await post(signer, `/studies/${first.id}/sign`, { meaning: 'accepted', password: 'director-password-3' }).expect(200);
    expect(await account()).toMatchObject({ failedSignIns: 0, lockedUntil: null });

    // Four more wrong ones do not lock (without the reset the first of them would be the fifth); the fifth does.
    for (let i = 0; i < 4; i++) await post(signer, `/studies/${second.id}/sign`, { meaning: 'accepted', password: `again-${i}` }).expect(400);
    expect(await account()).toMatchObject({ failedSignIns: 4, lockedUntil: null });
    await post(signer, `/studies/${second.id}/sign`, { meaning: 'accepted', password: 'again-4' }).expect(400);
    expect((await account()).lockedUntil).not.toBeNull();
    await post(signer, `/studies/${second.id}/sign`, { meaning: 'accepted', password: 'director-password-3' }).expect(423);

    const refusals = await h.database.db.select().from(auditEvents)
      .where(sql`${auditEvents.userId} = ${d.id} AND ${auditEvents.action} = 'signature.refused'`).orderBy(auditEvents.id);
    expect(refusals.map((e) => [e.studyId, (e.after as { why: string; failures?: number }).why, (e.after as { failures?: number }).failures ?? null])).toEqual([
      ...[1, 2, 3, 4].map((k) => [first.id, 'wrong password', k]),
      ...[1, 2, 3, 4, 5].map((k) => [second.id, 'wrong password', k]),
      [second.id, 'account locked', null],
    ]);
  });

  it('keeps a director from signing rows they entered unless the laboratory allows it, and audits that', async () => {
    const lead = await signedIn(h, 'lead@valeharbor.example');
    const study = await analysedComparison(h, lead);
    await post(lead, `/studies/${study.id}/submit`).expect(200);
    const refused = await post(lead, `/studies/${study.id}/sign`, { meaning: 'accepted', password: 'parallax-demo' }).expect(403);
    expect(refused.body.error).toMatch(/segregation of duties/);
    const admin = await signedIn(h, 'admin@valeharbor.example');
    const lab = (await admin.agent.get('/api/v1/laboratory')).body;
    await admin.agent.put('/api/v1/laboratory').set('X-XSRF-TOKEN', admin.xsrf).send({ timeZone: lab.timeZone, planApprovalRequired: false, allowSelfSign: true }).expect(200);
    try {
      await post(lead, `/studies/${study.id}/sign`, { meaning: 'not-accepted', password: 'parallax-demo' }).expect(200);
      const events = await h.database.db.select().from(auditEvents).where(eq(auditEvents.studyId, study.id));
      expect(events.map((e) => e.action)).toContain('signature.self-sign-allowed');
    } finally {
      await admin.agent.put('/api/v1/laboratory').set('X-XSRF-TOKEN', admin.xsrf).send({ timeZone: lab.timeZone, planApprovalRequired: false, allowSelfSign: false }).expect(200);
    }
  });
});

describe('after signing', () => {
  it('refuses every change through the API and in the database, and an amendment supersedes it once signed', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const director = await signedIn(h, 'director@valeharbor.example');
    const study = await analysedComparison(h, tech);
    await post(tech, `/studies/${study.id}/submit`).expect(200);
    const signed = (await post(director, `/studies/${study.id}/sign`, { meaning: 'accepted', password: 'parallax-demo' }).expect(200)).body;
    await tech.agent.patch(`/api/v1/studies/${study.id}`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: signed.version, title: 'Changed' }).expect(409);
    await tech.agent.put(`/api/v1/studies/${study.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: signed.version, rows: [] }).expect(409);
    await post(tech, `/studies/${study.id}/analyses`).expect(409);
    const db = h.database.db;
    await expect(db.update(specimens).set({ candidate: 99 }).where(eq(specimens.studyId, study.id))).rejects.toThrow();
    await expect(db.delete(specimens).where(eq(specimens.studyId, study.id))).rejects.toThrow();
    await expect(db.update(studies).set({ title: 'Changed' }).where(eq(studies.id, study.id))).rejects.toThrow();
    await expect(db.execute(sql`UPDATE signatures SET comment = 'x' WHERE study_id = ${study.id}`)).rejects.toThrow();

    await post(tech, `/studies/${study.id}/amend`, { reason: '' }).expect(400);
    const amendment = (await post(tech, `/studies/${study.id}/amend`, { reason: 'Candidate lot changed' }).expect(201)).body;
    expect(amendment).toMatchObject({ state: 'draft', supersedesId: study.id, n: 40 });
    await post(tech, `/studies/${study.id}/amend`, { reason: 'again' }).expect(409);
    const queued = await post(tech, `/studies/${amendment.id}/analyses`).expect(202);
    const { waitForAnalysis } = await import('../test/fixtures');
    await waitForAnalysis(tech, queued.body.id);
    await post(tech, `/studies/${amendment.id}/submit`).expect(200);
    await post(director, `/studies/${amendment.id}/sign`, { meaning: 'accepted', password: 'parallax-demo' }).expect(200);
    const old = (await tech.agent.get(`/api/v1/studies/${study.id}`)).body;
    expect(old).toMatchObject({ superseded: true, supersededById: amendment.id, state: 'signed' });
  });
});

describe('plan approval', () => {
  it('holds specimens until the director approves the plan where required, and asks a reason to move approved criteria', async () => {
    const admin = await signedIn(h, 'admin@valeharbor.example');
    const lab = (await admin.agent.get('/api/v1/laboratory')).body;
    await admin.agent.put('/api/v1/laboratory').set('X-XSRF-TOKEN', admin.xsrf).send({ ...lab, name: undefined, planApprovalRequired: true }).expect(200);
    try {
      const tech = await signedIn(h, 'tech@valeharbor.example');
      const director = await signedIn(h, 'director@valeharbor.example');
      const study = await createComparison(h, tech);
      const held = await tech.agent.put(`/api/v1/studies/${study.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: 1, rows: inventedPairs(3) }).expect(409);
      expect(held.body.error).toMatch(/approve the plan/);
      await post(director, `/studies/${study.id}/plan-approval`, { password: 'wrong-one' }).expect(400);
      const approved = (await post(director, `/studies/${study.id}/plan-approval`, { password: 'parallax-demo', comment: 'Plan fits' }).expect(200)).body;
      const saved = await tech.agent.put(`/api/v1/studies/${study.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: approved.version, rows: inventedPairs(3) }).expect(200);
      const noReason = await tech.agent.patch(`/api/v1/studies/${study.id}`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: saved.body.version, settings: { allowableBiasPercent: 6 } }).expect(400);
      expect(noReason.body.issues[0].path).toBe('reason');
      await tech.agent.patch(`/api/v1/studies/${study.id}`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: saved.body.version, settings: { allowableBiasPercent: 6 }, reason: 'Goal revised' }).expect(200);
      const history = (await tech.agent.get(`/api/v1/studies/${study.id}/history`)).body;
      const moved = history.find((e: { action: string }) => e.action === 'study.plan-amended');
      expect(moved.headline).toBe('Plan changed after approval, after data were entered');
      expect(moved.details).toEqual(['allowable bias %: 4 → 6', 'reason: Goal revised']);
      const sigs = (await tech.agent.get(`/api/v1/studies/${study.id}/signatures`)).body;
      expect(sigs[0]).toMatchObject({ meaning: 'plan-approved', signerName: 'Dr. Imani Okafor', comment: 'Plan fits' });
    } finally {
      await admin.agent.put('/api/v1/laboratory').set('X-XSRF-TOKEN', admin.xsrf).send({ timeZone: lab.timeZone, planApprovalRequired: false, allowSelfSign: false }).expect(200);
    }
  });
});
