import { asc, eq } from 'drizzle-orm';
import { laboratories, specimens, users } from '../db/schema';
import { inventedPairs, waitForAnalysis } from '../test/fixtures';
import { apiPost, apiPut, Harness, signedIn, signedStudy, startHarness, type Session } from '../test/harness';

/**
 * An amendment copies a signed study's rows, and copying is not entering: each copied row stays attributed to
 * the person who entered it, and only the rows the amender changes become theirs. Segregation of duties
 * (who-may-sign.ts) reads that attribution, so a director who amends without entering may sign the amendment,
 * and one who changed a row may not.
 */
let h: Harness;
beforeAll(async () => { h = await startHarness({}, { jobs: true }); });
afterAll(() => h.close());

const userId = async (email: string) => (await h.database.db.select({ id: users.id }).from(users).where(eq(users.email, email)))[0].id;
const enteredBy = async (studyId: number) =>
  (await h.database.db.select({ position: specimens.position, by: specimens.enteredBy }).from(specimens).where(eq(specimens.studyId, studyId)).orderBy(asc(specimens.position)));

/** Analyses the amendment as it is now and submits it. */
async function analyseAndSubmit(s: Session, id: number) {
  const queued = await apiPost(s, `/studies/${id}/analyses`).expect(202);
  expect((await waitForAnalysis(s, queued.body.id)).state).toBe('done');
  await apiPost(s, `/studies/${id}/submit`).expect(200);
}

const mayISign = async (s: Session, id: number) => (await s.agent.get(`/api/v1/studies/${id}`).expect(200)).body.mayISign;

beforeAll(async () => {
  // The rule under test is the one with one-person sign-off off (the demo laboratory's setting).
  const [lab] = await h.database.db.select({ allow: laboratories.allowSelfSign }).from(laboratories).where(eq(laboratories.name, 'Vale Harbor Regional Laboratory'));
  expect(lab?.allow ?? false).toBe(false);
});

describe('an amendment of a signed study', () => {
  it('keeps every copied row attributed to the technologist who entered it, so the director who amended may sign it', async () => {
    const tech = await userId('tech@valeharbor.example');
    const signed = await signedStudy(h, `Amended, rows kept ${Date.now()}`);
    expect(new Set((await enteredBy(signed)).map((r) => r.by))).toEqual(new Set([tech]));
    const lead = await signedIn(h, 'lead@valeharbor.example');
    const amendment = (await apiPost(lead, `/studies/${signed}/amend`, { reason: 'The candidate lot was recorded wrongly' }).expect(201)).body;
    const rows = await enteredBy(amendment.id);
    expect(rows).toHaveLength(40);
    expect(rows.filter((r) => r.by !== tech)).toEqual([]);
    await analyseAndSubmit(lead, amendment.id);
    expect(await mayISign(lead, amendment.id)).toEqual({ allowed: true, why: 'You may sign it. Any director but Tomas Reyes, who entered its rows, may sign it.' });
    await apiPost(lead, `/studies/${amendment.id}/sign`, { meaning: 'accepted', password: 'parallax-demo' }).expect(200);
  });

  it('attributes only the row the amender changes to them; the others stay the technologist\'s, and the amender may no longer sign', async () => {
    const tech = await userId('tech@valeharbor.example');
    const leadId = await userId('lead@valeharbor.example');
    const signed = await signedStudy(h, `Amended, one row changed ${Date.now()}`);
    const lead = await signedIn(h, 'lead@valeharbor.example');
    const amendment = (await apiPost(lead, `/studies/${signed}/amend`, { reason: 'Specimen S005 was transcribed wrongly' }).expect(201)).body;
    const rows = inventedPairs(40).map((r, i) => (i === 4 ? { ...r, candidate: (Number(r.candidate) + 0.3).toFixed(1) } : r));
    await apiPut(lead, `/studies/${amendment.id}/specimens`, { version: amendment.version, rows }).expect(200);
    const after = await enteredBy(amendment.id);
    expect(after.filter((r) => r.by === leadId).map((r) => r.position)).toEqual([5]);
    expect(after.filter((r) => r.by === tech)).toHaveLength(39);
    // The signed study's own rows are untouched.
    expect(new Set((await enteredBy(signed)).map((r) => r.by))).toEqual(new Set([tech]));
    await analyseAndSubmit(lead, amendment.id);
    expect(await mayISign(lead, amendment.id)).toEqual({ allowed: false, why: 'You entered rows of this study; this laboratory requires another director to sign it (segregation of duties).' });
    const director = await signedIn(h, 'director@valeharbor.example');
    expect(await mayISign(director, amendment.id)).toEqual({ allowed: true, why: 'You may sign it. Any director but Priya Nair and Tomas Reyes, who entered its rows, may sign it.' });
  });
});
