import { eq, sql } from 'drizzle-orm';
import { specimens, studies } from '../db/schema';
import { studyInputHash } from '../specimens/input-hash';
import { analysedComparison, createComparison, inventedPairs } from '../test/fixtures';
import { Harness, signedIn, startHarness, queriesDuring } from '../test/harness';

/**
 * Reads do not load rows: the study keeps the hash of its analysed rows and settings (and its included
 * count), written with every change, and the database clears it whenever rows or settings change without it.
 */
let h: Harness;
beforeAll(async () => { h = await startHarness({}, { jobs: true }); });
afterAll(() => h.close());

type Session = Awaited<ReturnType<typeof signedIn>>;
const stored = async (id: number) => (await h.database.db.select().from(studies).where(eq(studies.id, id)))[0];
const fresh = async (id: number) => studyInputHash(h.database.db, await stored(id));
const findings = async (s: Session, id: number) => (await s.agent.get(`/api/v1/studies/${id}`).expect(200)).body.findings as string;


it('keeps the hash and the included count with every change of rows or settings', async () => {
  const tech = await signedIn(h, 'tech@valeharbor.example');
  const study = await createComparison(h, tech, 'Stored hash');
  expect((await stored(study.id)).inputHash).toBe(await fresh(study.id));
  const rows = inventedPairs(30).map((r, i) => (i < 4 ? { ...r, excluded: true, exclusionReason: 'haemolysed' } : r));
  const put = await tech.agent.put(`/api/v1/studies/${study.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: study.version, rows }).expect(200);
  let row = await stored(study.id);
  expect(row.inputHash).toBe(await fresh(study.id));
  expect(row.includedCount).toBe(26);
  const before = row.inputHash;
  await tech.agent.patch(`/api/v1/studies/${study.id}`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: put.body.version, settings: { resamples: 2000 } }).expect(200);
  row = await stored(study.id);
  expect(row.inputHash).not.toBe(before);
  expect(row.inputHash).toBe(await fresh(study.id));
});

it('lists, opens and reads an analysis of a study without loading its rows; the rows route does', async () => {
  const tech = await signedIn(h, 'tech@valeharbor.example');
  const study = await analysedComparison(h, tech, 'No rows loaded');
  const latest = (await tech.agent.get(`/api/v1/studies/${study.id}`).expect(200)).body.latestAnalysisId as number;
  const reads = await queriesDuring(h, async () => {
    await tech.agent.get('/api/v1/studies').expect(200);
    await tech.agent.get('/api/v1/worklist').expect(200);
    const opened = await tech.agent.get(`/api/v1/studies/${study.id}`).expect(200);
    expect(opened.body.findings).toBe('current');
    expect(opened.body.n).toBe(40);
    await tech.agent.get(`/api/v1/analyses/${latest}`).expect(200);
  });
  expect(reads.length).toBeGreaterThan(5);
  expect(reads.filter((q) => /from "specimens"/i.test(q))).toEqual([]);
  expect(reads.filter((q) => /"input"/.test(q))).toEqual([]);
  const rowsRoute = await queriesDuring(h, () => tech.agent.get(`/api/v1/studies/${study.id}/specimens`).expect(200));
  expect(rowsRoute.some((q) => /from "specimens"/i.test(q))).toBe(true);
});

it('forgets the hash when rows or settings change behind the application, and the next read finds the findings out of date', async () => {
  const tech = await signedIn(h, 'tech@valeharbor.example');
  const study = await analysedComparison(h, tech, 'Changed behind the app');
  expect(await findings(tech, study.id)).toBe('current');
  await h.database.db.execute(sql`UPDATE specimens SET candidate = candidate + 1 WHERE study_id = ${study.id} AND position = 3`);
  expect((await stored(study.id)).inputHash).toBeNull();
  expect(await findings(tech, study.id)).toBe('out-of-date');
  expect((await stored(study.id)).inputHash).toBe(await fresh(study.id));
  await h.database.db.execute(sql`UPDATE specimens SET candidate = candidate - 1 WHERE study_id = ${study.id} AND position = 3`);
  expect(await findings(tech, study.id)).toBe('current');
  await h.database.db.execute(sql`UPDATE studies SET settings = settings || '{"seed": "other"}'::jsonb WHERE id = ${study.id}`);
  expect((await stored(study.id)).inputHash).toBeNull();
  expect(await findings(tech, study.id)).toBe('out-of-date');
  await h.database.db.execute(sql`DELETE FROM specimens WHERE study_id = ${study.id} AND position = 40`);
  expect((await stored(study.id)).inputHash).toBeNull();
  const listed = (await tech.agent.get('/api/v1/studies?q=Changed%20behind').expect(200)).body.items[0];
  expect(listed).toMatchObject({ id: study.id, n: 39, findings: 'out-of-date' });
});

const refusal = (p: Promise<unknown>) => p.then(() => 'accepted', (e: Error & { cause?: Error }) => e.cause?.message ?? e.message);

it('lets a signed study have its hash filled in once, never changed', async () => {
  const tech = await signedIn(h, 'tech@valeharbor.example');
  const made = await createComparison(h, tech, 'Signed hash');
  // A study signed before the hash was kept: inserted as such, with no hash.
  const { id: _id, inputHash: _h, includedCount: _c, ...copy } = await stored(made.id);
  const [study] = await h.database.db.insert(studies).values({ ...copy, title: 'Signed before hashes', state: 'signed' }).returning();
  expect(study.inputHash).toBeNull();
  expect(await findings(tech, study.id)).toBe('none');
  expect((await stored(study.id)).inputHash).toBe(await fresh(study.id));
  expect((await stored(study.id)).includedCount).toBe(0);
  expect(await refusal(h.database.db.update(studies).set({ inputHash: 'f'.repeat(64) }).where(eq(studies.id, study.id)))).toMatch(/signed and cannot be changed/);
  expect(await refusal(h.database.db.update(studies).set({ inputHash: null }).where(eq(studies.id, study.id)))).toMatch(/signed and cannot be changed/);
  expect(await refusal(h.database.db.update(studies).set({ title: 'x' }).where(eq(studies.id, study.id)))).toMatch(/signed and cannot be changed/);
});
