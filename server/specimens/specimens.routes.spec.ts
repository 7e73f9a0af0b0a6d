import { asc, eq } from 'drizzle-orm';
import { auditEvents } from '../db/schema';
import { createComparison, inventedPairs } from '../test/fixtures';
import { Harness, signedIn, startHarness } from '../test/harness';

let h: Harness;
beforeAll(async () => { h = await startHarness(); });
afterAll(() => h.close());

describe('specimen rows', () => {
  it('saves a pasted block in one request, keeping the reported precision and reading decimal commas', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = await createComparison(h, tech);
    const rows = [...inventedPairs(38), { label: 'S039', comparative: '5,20', candidate: '5,4' }, { label: 'S040', comparative: 12, candidate: '12.3' }];
    const res = await tech.agent.put(`/api/v1/studies/${study.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: 1, rows }).expect(200);
    expect(res.body.version).toBe(2);
    expect(res.body.rows).toHaveLength(40);
    expect(res.body.rows[38]).toMatchObject({ position: 39, comparative: 5.2, comparativeText: '5.20', candidate: 5.4 });
    const got = await tech.agent.get(`/api/v1/studies/${study.id}/specimens`).expect(200);
    expect(got.body.rows[39]).toMatchObject({ comparative: 12, candidateText: '12.3' });
  });

  it('refuses bad rows naming the row and field, and saves nothing', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = await createComparison(h, tech);
    const rows = inventedPairs(5);
    rows[1].candidate = '5,x';
    rows[3].comparative = '-1.0';
    const bad = await tech.agent.put(`/api/v1/studies/${study.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf)
      .send({ version: 1, rows: [...rows, { label: 'S6', comparative: '4', candidate: '4.1', excluded: true, exclusionReason: '' }] }).expect(400);
    // Exactly these three, in row order: the good rows raise nothing.
    expect(bad.body.issues).toEqual([
      { path: 'rows.1.candidate', message: 'row 2: candidate result "5,x" is not a number' },
      { path: 'rows.3.comparative', message: 'row 4: comparative result is negative, which this analyte cannot be' },
      { path: 'rows.5.exclusionReason', message: 'row 6: excluded without a reason; give the reason' },
    ]);
    const got = await tech.agent.get(`/api/v1/studies/${study.id}/specimens`).expect(200);
    expect(got.body).toEqual({ version: 1, rows: [], warnings: [] });
  });

  it('warns of labels that included rows repeat, naming them, until an exclusion resolves each repeat', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = await createComparison(h, tech);
    const rows = inventedPairs(10).map((r, i) => ({ ...r, label: i === 4 ? 's001 ' : i === 8 ? 'S007' : r.label }));
    const saved = await tech.agent.put(`/api/v1/studies/${study.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: 1, rows }).expect(200);
    const twice = 'Labels S001, S007 appear more than once (4 rows); give each specimen its own label, or exclude the extra rows with a reason';
    expect(saved.body.warnings).toEqual([twice]);
    expect((await tech.agent.get(`/api/v1/studies/${study.id}/specimens`).expect(200)).body.warnings).toEqual([twice]);
    const resolved = rows.map((r, i) => (i === 4 ? { ...r, excluded: true, exclusionReason: 'entered twice' } : r));
    const once = await tech.agent.put(`/api/v1/studies/${study.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: 2, rows: resolved }).expect(200);
    expect(once.body.warnings).toEqual(['Label S007 appears more than once (2 rows); give each specimen its own label, or exclude the extra rows with a reason']);
  });

  it('audits each changed cell with its before and after value, and answers 409 to a stale version', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = await createComparison(h, tech);
    const rows = inventedPairs(3);
    await tech.agent.put(`/api/v1/studies/${study.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: 1, rows }).expect(200);
    const changed = rows.map((r) => ({ ...r }));
    changed[1].candidate = '9.9';
    await tech.agent.put(`/api/v1/studies/${study.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: 2, rows: changed }).expect(200);
    await tech.agent.put(`/api/v1/studies/${study.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: 2, rows }).expect(409);
    const events = await h.database.db.select().from(auditEvents).where(eq(auditEvents.studyId, study.id)).orderBy(asc(auditEvents.id));
    const last = events.filter((e) => e.action === 'specimens.saved').pop()!;
    expect((last.after as { changes: unknown[] }).changes).toEqual([{ row: 2, field: 'candidate', from: rows[1].candidate, to: '9.9' }]);
  });
});
