import { and, eq } from 'drizzle-orm';
import { CAUTION } from '@shared/text/caution';
import { auditEvents, mailMessages, studies } from '../db/schema';
import { analysedComparison } from '../test/fixtures';
import { Harness, signedIn, startHarness } from '../test/harness';

let h: Harness;
beforeAll(async () => { h = await startHarness({}, { jobs: true }); });
afterAll(() => h.close());

type Session = Awaited<ReturnType<typeof signedIn>>;
const post = (s: Session, path: string, body: object = {}) => s.agent.post(`/api/v1${path}`).set('X-XSRF-TOKEN', s.xsrf).send(body);

/** The directors' "Awaiting your signature" mails of one study (by its unique title), once the outbox has sent them. */
async function awaitingMails(title: string, expected: number) {
  await h.ctx.mail.flush();
  for (let i = 0; i < 40; i++) {
    const rows = (await h.database.db.select().from(mailMessages)).filter((m) => m.to.includes('director@valeharbor.example') && m.subject === `Awaiting your signature: ${title}`);
    if (rows.length >= expected) return rows;
    await new Promise((r) => setTimeout(r, 100));
  }
  return [];
}

const submittedEvents = (studyId: number) =>
  h.database.db.select().from(auditEvents).where(and(eq(auditEvents.studyId, studyId), eq(auditEvents.action, 'study.submitted')));

const NOTE = 'Rows 12 and 31 were run again after a short sample; the first results are in their notes.\nThe new reagent lot starts on Monday.';

describe('the note for the director at submission', () => {
  it('stores the trimmed note, audits it, e-mails it to the directors and serves it with the study', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const me = (await tech.agent.get('/api/v1/session').expect(200)).body;
    const title = `Note at submission ${Date.now()}`;
    const study = await analysedComparison(h, tech, title);
    const submitted = await post(tech, `/studies/${study.id}/submit`, { note: `  ${NOTE}  ` }).expect(200);
    expect(submitted.body.state).toBe('awaiting-signoff');
    expect(submitted.body.submissionNote).toEqual({ text: NOTE, by: { id: me.id, name: me.name }, at: expect.stringMatching(/^\d{4}-\d\d-\d\dT/) });

    const director = await signedIn(h, 'director@valeharbor.example');
    expect((await director.agent.get(`/api/v1/studies/${study.id}`).expect(200)).body.submissionNote).toMatchObject({ text: NOTE, by: { name: me.name } });
    const [stored] = await h.database.db.select().from(studies).where(eq(studies.id, study.id));
    expect([stored.submissionNote, stored.submittedBy]).toEqual([NOTE, me.id]);

    const events = await submittedEvents(study.id);
    expect(events).toHaveLength(1);
    expect(events[0].after).toEqual({ state: 'awaiting-signoff', note: NOTE });
    const history = (await director.agent.get(`/api/v1/studies/${study.id}/history`).expect(200)).body as { headline: string; details: string[] }[];
    expect(history.find((e) => e.headline === 'Submitted for sign-off')?.details).toEqual([`note for the director: ${NOTE}`]);

    const [mail] = await awaitingMails(title, 1);
    expect(mail.text).toContain(`${me.name} submitted the study "${title}" for sign-off.\n\nNote from ${me.name}:\n${NOTE}\n\nReview it here: `);
    // The one decision-support caution of screen and PDF (shared/text/caution.ts) closes the mail (the mail store may wrap long lines).
    expect(mail.text.replace(/\s+/g, ' ').trim().endsWith(` ${CAUTION}`)).toBe(true);
  });

  it('refuses a note over 1,000 characters naming the field, and nothing is submitted, audited or mailed', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const title = `Long note ${Date.now()}`;
    const study = await analysedComparison(h, tech, title);
    const res = await post(tech, `/studies/${study.id}/submit`, { note: 'x'.repeat(1001) }).expect(400);
    expect(res.body.issues).toEqual([{ path: 'note', message: 'Keep the note for the director to 1,000 characters or fewer' }]);
    expect(res.body.error).toBe('Invalid body: note: Keep the note for the director to 1,000 characters or fewer');
    const bell = await post(tech, `/studies/${study.id}/submit`, { note: 'ready\u0007' }).expect(400);
    expect(bell.body.issues).toEqual([{ path: 'note', message: 'note: contains a control character (U+0007); remove it' }]);
    const [stored] = await h.database.db.select().from(studies).where(eq(studies.id, study.id));
    expect([stored.state, stored.submissionNote]).toEqual(['draft', null]);
    expect(await submittedEvents(study.id)).toHaveLength(0);
    // Exactly 1,000 characters are taken.
    await post(tech, `/studies/${study.id}/submit`, { note: 'y'.repeat(1000) }).expect(200);
    expect((await awaitingMails(title, 1))[0].text).toContain(`:\n${'y'.repeat(1000)}\n`);
  });

  it('clears the note when the study is returned; a submission without a note carries none, in the study, the event or the mail', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const title = `Returned note ${Date.now()}`;
    const study = await analysedComparison(h, tech, title);
    await post(tech, `/studies/${study.id}/submit`, { note: NOTE }).expect(200);
    const director = await signedIn(h, 'director@valeharbor.example');
    const returned = await post(director, `/studies/${study.id}/return`, { comment: 'Add the specimens above 20 mmol/L' }).expect(200);
    expect(returned.body).toMatchObject({ state: 'draft', submissionNote: null });

    const again = await post(tech, `/studies/${study.id}/submit`, { note: '   ' }).expect(200);
    expect(again.body.submissionNote).toBeNull();
    expect((await submittedEvents(study.id)).map((e) => e.after)).toEqual([{ state: 'awaiting-signoff', note: NOTE }, { state: 'awaiting-signoff' }]);
    const mails = await awaitingMails(title, 2);
    expect(mails).toHaveLength(2);
    expect(mails.filter((m) => m.text.includes('Note from'))).toHaveLength(1);
  });

  it('keeps the note on the signed study, and an amendment starts without one', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = await analysedComparison(h, tech, `Signed note ${Date.now()}`);
    await post(tech, `/studies/${study.id}/submit`, { note: NOTE }).expect(200);
    const director = await signedIn(h, 'director@valeharbor.example');
    const signed = await post(director, `/studies/${study.id}/sign`, { meaning: 'accepted', comment: 'Fit for use', password: 'parallax-demo' }).expect(200);
    expect(signed.body).toMatchObject({ state: 'signed', submissionNote: { text: NOTE } });
    const amendment = await post(tech, `/studies/${study.id}/amend`, { reason: 'A transcription error in row 3' }).expect(201);
    expect(amendment.body).toMatchObject({ state: 'draft', supersedesId: study.id, submissionNote: null });
  });
});
