import { eq } from 'drizzle-orm';
import { auditEvents, studies } from '../db/schema';
import { RESULT_CASES, emptyMessage, refusedMessage, type ResultCase } from '@shared/results/result-cases.testing';
import { createComparison, inventedPairs } from '../test/fixtures';
import { Harness, signedIn, startHarness } from '../test/harness';
import { studyInputHash } from './input-hash';

let h: Harness;
beforeAll(async () => { h = await startHarness(); });
afterAll(() => h.close());

type Session = Awaited<ReturnType<typeof signedIn>>;
const put = (s: Session, studyId: number, version: number, rows: object[]) =>
  s.agent.put(`/api/v1/studies/${studyId}/specimens`).set('X-XSRF-TOKEN', s.xsrf).send({ version, rows });

/** Five clean pairs with one cell replaced: row 3's candidate result (rows.2.candidate); `comma` writes them "4,2". */
const withCandidate = (candidate: unknown, comma = false) => {
  const rows: Record<string, unknown>[] = inventedPairs(5).map((r) =>
    comma ? { ...r, comparative: r.comparative.replace('.', ','), candidate: r.candidate.replace('.', ',') } : r);
  rows[2] = { ...rows[2], candidate };
  return rows;
};

/** The study is untouched: version 1, no rows, no save audited. */
async function expectNothingSaved(s: Session, studyId: number) {
  const got = await s.agent.get(`/api/v1/studies/${studyId}/specimens`).expect(200);
  expect(got.body).toEqual({ version: 1, rows: [], warnings: [] });
  const events = await h.database.db.select().from(auditEvents).where(eq(auditEvents.studyId, studyId));
  expect(events.filter((e) => e.action === 'specimens.saved')).toEqual([]);
}

describe('the shared row rule (shared/results/row-checks.ts): the cells the grid marks, the server refuses in the same words', () => {
  it('refuses each refused cell of the shared table with its words, saves the rest, and refuses to analyse included rows left empty', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = await createComparison(h, tech, `Shared cells ${Date.now()}`);
    // The fixture's analyte cannot be negative (analytes.can_be_negative defaults to false), as the table assumes.
    const rowOf = (c: ResultCase, k: number) => ({ label: `C${k + 1}`, comparative: '4.1', candidate: c.input });
    const res = await put(tech, study.id, 1, RESULT_CASES.map(rowOf)).expect(400);
    const refused = RESULT_CASES.flatMap((c, k) => (c.error ? [{ path: `rows.${k}.candidate`, message: refusedMessage(k + 1, c) }] : []));
    expect(res.body.issues).toEqual(refused);
    await expectNothingSaved(tech, study.id);

    const readable = RESULT_CASES.filter((c) => c.read);
    const saved = await put(tech, study.id, 1, [...readable.map(rowOf), ...inventedPairs(3)]).expect(200);
    expect(saved.body.rows.slice(0, readable.length).map((r: { candidate: number | null; candidateText: string | null }) => ({ value: r.candidate, text: r.candidateText })))
      .toEqual(readable.map((c) => c.read));
    const analysis = await tech.agent.post(`/api/v1/studies/${study.id}/analyses`).set('X-XSRF-TOKEN', tech.xsrf).expect(400);
    const empty = readable.flatMap((c, k) => (c.read!.value === null ? [emptyMessage(k + 1)] : []));
    expect(analysis.body.issues.map((i: { message: string }) => i.message)).toEqual(empty);
  });
});

describe('values are never changed silently', () => {
  it('refuses "1,234" when the study detects the decimal mark, naming both readings, and saves nothing', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = await createComparison(h, tech);
    const res = await put(tech, study.id, 1, withCandidate('1,234')).expect(400);
    expect(res.body.issues).toEqual([{
      path: 'rows.2.candidate',
      message: 'row 3: candidate result "1,234" is unclear: it may be 1.234 (a decimal comma) or 1234 (a comma separating thousands); '
        + "write 1.234 or 1234, or choose the decimal mark in the study's Setup",
    }]);
    expect(res.body.error).toBe(res.body.issues[0].message);
    await expectNothingSaved(tech, study.id);
  });

  it("reads \"1,234\" as 1.234 in a study whose decimal mark is a comma, and as 1234 where it is a point", async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const comma = await createComparison(h, tech, `Comma ${Date.now()}`, { decimalMark: 'comma' });
    const saved = await put(tech, comma.id, 1, [...withCandidate('1,234', true), { label: 'S6', comparative: '1.234,5', candidate: '5,20' }]).expect(200);
    expect(saved.body.rows[2]).toMatchObject({ candidate: 1.234, candidateText: '1.234' });
    expect(saved.body.rows[5]).toMatchObject({ comparative: 1234.5, comparativeText: '1234.5', candidate: 5.2, candidateText: '5.20' });

    const point = await createComparison(h, tech, `Point ${Date.now()}`, { decimalMark: 'point' });
    const read = await put(tech, point.id, 1, withCandidate('1,234')).expect(200);
    expect(read.body.rows[2]).toMatchObject({ candidate: 1234, candidateText: '1234' });
    const bad = await put(tech, point.id, 2, withCandidate('12,34')).expect(400);
    expect(bad.body.issues[0].path).toBe('rows.2.candidate');
    expect(bad.body.issues[0].message).toMatch(/^row 3: candidate result "12,34" is not a number as this study reads results: the decimal mark is a point/);
  });

  it.each([
    ['1e309', 'is too large to be kept'],
    ['1e-400', 'is too close to zero to be kept exactly'],
    ['12345678901234567890', 'has 20 significant digits, more than a number keeps exactly (at most 15 always are), so round it'],
    ['1.00000000000000000001', 'has 21 significant digits'],
  ])('refuses %s with a 400 naming the row and field, and saves nothing', async (value, words) => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = await createComparison(h, tech);
    const res = await put(tech, study.id, 1, withCandidate(value)).expect(400);
    expect(res.body.issues).toHaveLength(1);
    expect(res.body.issues[0].path).toBe('rows.2.candidate');
    expect(res.body.issues[0].message).toContain(`row 3: candidate result "${value}" ${words}`);
    await expectNothingSaved(tech, study.id);
  });

  it('refuses a JSON number too close to zero to keep (5e-324), and keeps one that is an exact double of 17 digits', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = await createComparison(h, tech);
    const rows: Record<string, unknown>[] = inventedPairs(3);
    rows[0] = { ...rows[0], comparative: 5e-324 };
    rows[1] = { ...rows[1], candidate: 0.1 + 0.2 };
    const res = await put(tech, study.id, 1, rows).expect(400);
    expect(res.body.issues).toEqual([
      { path: 'rows.0.comparative', message: expect.stringMatching(/^row 1: comparative result "5e-324" is too close to zero/) },
    ]);
    await expectNothingSaved(tech, study.id);
  });

  it('changing the decimal mark leaves the analysis input hash (and so the findings) as they were', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = await createComparison(h, tech);
    await put(tech, study.id, 1, inventedPairs(5)).expect(200);
    const row = async () => (await h.database.db.select().from(studies).where(eq(studies.id, study.id)))[0];
    const before = await studyInputHash(h.database.db, await row());
    const patched = await tech.agent.patch(`/api/v1/studies/${study.id}`).set('X-XSRF-TOKEN', tech.xsrf)
      .send({ version: 2, settings: { decimalMark: 'comma' } }).expect(200);
    expect(patched.body.settings.decimalMark).toBe('comma');
    expect(await studyInputHash(h.database.db, await row())).toBe(before);
  });

  it('refuses an unknown decimal mark, naming the setting', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = await createComparison(h, tech);
    const res = await tech.agent.patch(`/api/v1/studies/${study.id}`).set('X-XSRF-TOKEN', tech.xsrf)
      .send({ version: 1, settings: { decimalMark: 'dot' } }).expect(400);
    expect(res.body.issues[0]).toEqual({ path: 'settings.decimalMark', message: 'Choose how a decimal mark is read: detect, point or comma' });
  });
});
