import { and, desc, eq, sql } from 'drizzle-orm';
import { analyses, auditEvents, signatures } from '../db/schema';
import { apiPost, Harness, signedIn, signedStudy, startHarness } from '../test/harness';

/**
 * The re-checks of a signed study when what is stored was changed behind the application's back (as the
 * database owner with triggers off, as an intruder with direct access could): the reproducibility re-check names
 * the result fields that differ and records that it found them; the integrity re-check names the check that fails.
 */
let h: Harness;
beforeAll(async () => { h = await startHarness({}, { jobs: true }); });
afterAll(() => h.close());

type Check = { name: string; passed: boolean; detail: string };
type Difference = { path: string; stored: unknown; recomputed: unknown };

const asOwnerWithoutTriggers = (statement: ReturnType<typeof sql>) =>
  h.database.db.transaction(async (tx) => {
    await tx.execute(sql`SET LOCAL session_replication_role = replica`);
    await tx.execute(statement);
  });

const signedAnalysis = async (studyId: number) =>
  (await h.database.db.select().from(signatures).where(and(eq(signatures.studyId, studyId), eq(signatures.meaning, 'accepted'))))[0];

const lastEvent = async (studyId: number, action: string) =>
  (await h.database.db.select().from(auditEvents).where(and(eq(auditEvents.studyId, studyId), eq(auditEvents.action, action))).orderBy(desc(auditEvents.id)).limit(1))[0];

const checksOf = (report: { checks: Check[] }) => Object.fromEntries(report.checks.map((c) => [c.name, c.passed]));

describe('the reproducibility re-check of a tampered signed study', () => {
  it('names the one result field whose stored value was changed, with both values, and records that it found a difference', async () => {
    const id = await signedStudy(h, `Tampered findings ${Date.now()}`);
    const { analysisId } = await signedAnalysis(id);
    const [stored] = await h.database.db.select().from(analyses).where(eq(analyses.id, analysisId!));
    const n = (stored.results as { n: number }).n;
    expect(n).toBe(40);
    await asOwnerWithoutTriggers(sql`UPDATE analyses SET results = jsonb_set(results, '{n}', '39') WHERE id = ${analysisId}`);
    const quality = await signedIn(h, 'quality@valeharbor.example');
    const report = (await apiPost(quality, `/studies/${id}/reproduce`).expect(200)).body;
    expect(report).toMatchObject({ studyId: id, analysisId, identical: false, sameEngine: true });
    expect(report.differences).toEqual([{ path: 'n', stored: 39, recomputed: 40 }]);
    expect(report.summary).toBe(`1 of ${report.fieldsCompared} result fields differ with the same engine version: investigate.`);
    const event = await lastEvent(id, 'reproduce.checked');
    expect(event).toMatchObject({ userName: 'Helga Lindqvist', entity: 'study', entityId: String(id) });
    expect(event.after).toMatchObject({ identical: false, differences: 1 });
  });

  it('finds the results no longer follow from a stored input whose row was changed, naming the fields that differ', async () => {
    const id = await signedStudy(h, `Tampered input ${Date.now()}`);
    const { analysisId } = await signedAnalysis(id);
    // Row 7 of the input the signed analysis was made from: the candidate result moved by 2 mmol/L.
    await asOwnerWithoutTriggers(sql`UPDATE analyses SET input = jsonb_set(input, '{rows,6,candidate}', to_jsonb((input #>> '{rows,6,candidate}')::numeric + 2)) WHERE id = ${analysisId}`);
    const quality = await signedIn(h, 'quality@valeharbor.example');
    const report = (await apiPost(quality, `/studies/${id}/reproduce`).expect(200)).body;
    expect(report.identical).toBe(false);
    const paths = (report.differences as Difference[]).map((d) => d.path);
    // The bias is a mean of the differences: one difference 2 larger moves it by 2/40 (and the stored one stays as signed).
    const bias = (report.differences as Difference[]).find((d) => d.path === 'bias.mean.estimate');
    expect(paths.length).toBeGreaterThan(1);
    expect(bias).toBeDefined();
    expect((bias!.recomputed as number) - (bias!.stored as number)).toBeCloseTo(2 / 40, 9);
    // The summary and the history count every difference; the answer lists the first 200.
    const [, counted] = /^(\d+) of (\d+) result fields differ with the same engine version: investigate\.$/.exec(report.summary) ?? [];
    expect(Number(counted)).toBeGreaterThanOrEqual(report.differences.length);
    expect(report.differences.length).toBe(Math.min(200, Number(counted)));
    expect(report.summary).toBe(`${counted} of ${report.fieldsCompared} result fields differ with the same engine version: investigate.`);
    expect((await lastEvent(id, 'reproduce.checked')).after).toMatchObject({ identical: false, differences: Number(counted) });
  });
});

describe('the integrity re-check of a tampered signed study', () => {
  it('fails the signed-PDF check, and only it, when the stored PDF bytes are changed', async () => {
    const id = await signedStudy(h, `Tampered PDF ${Date.now()}`);
    const sig = await signedAnalysis(id);
    expect(sig.pdf).not.toBeNull();
    await asOwnerWithoutTriggers(sql`UPDATE signatures SET pdf = overlay(pdf placing '\\x58'::bytea from 200 for 1) WHERE id = ${sig.id}`);
    const quality = await signedIn(h, 'quality@valeharbor.example');
    const report = (await apiPost(quality, `/studies/${id}/integrity-check`).expect(200)).body;
    expect(report.passed).toBe(false);
    expect(checksOf(report)).toEqual({ 'Content hash': true, 'Signed PDF': false, 'Analysis input': true, 'History chain': true });
    const pdf = report.checks.find((c: Check) => c.name === 'Signed PDF');
    expect(pdf.detail).toMatch(new RegExp(`^The PDF's bytes hash to [0-9a-f]{64}, not to the recorded ${sig.pdfSha256}\\.$`));
    expect(pdf.detail).not.toContain(`hash to ${sig.pdfSha256},`);
    expect((await lastEvent(id, 'integrity.checked')).after).toEqual({ passed: false, failed: ['Signed PDF'] });
  });

  it('fails the signed-PDF check when the recorded hash of the PDF is changed, and when the PDF is gone', async () => {
    const id = await signedStudy(h, `Tampered PDF hash ${Date.now()}`);
    const sig = await signedAnalysis(id);
    await asOwnerWithoutTriggers(sql`UPDATE signatures SET pdf_sha256 = ${'0'.repeat(64)} WHERE id = ${sig.id}`);
    const quality = await signedIn(h, 'quality@valeharbor.example');
    let report = (await apiPost(quality, `/studies/${id}/integrity-check`).expect(200)).body;
    expect(checksOf(report)).toEqual({ 'Content hash': true, 'Signed PDF': false, 'Analysis input': true, 'History chain': true });
    expect(report.checks.find((c: Check) => c.name === 'Signed PDF').detail).toBe(`The PDF's bytes hash to ${sig.pdfSha256}, not to the recorded ${'0'.repeat(64)}.`);
    await asOwnerWithoutTriggers(sql`UPDATE signatures SET pdf = NULL, pdf_sha256 = ${sig.pdfSha256} WHERE id = ${sig.id}`);
    report = (await apiPost(quality, `/studies/${id}/integrity-check`).expect(200)).body;
    expect(report.checks.find((c: Check) => c.name === 'Signed PDF')).toEqual({ name: 'Signed PDF', passed: false, detail: `The PDF's bytes hash to (missing), not to the recorded ${sig.pdfSha256}.` });
  });

  it('fails the analysis-input check when the hash of the signed analysis\'s input is changed', async () => {
    const id = await signedStudy(h, `Tampered input hash ${Date.now()}`);
    const { analysisId } = await signedAnalysis(id);
    await asOwnerWithoutTriggers(sql`UPDATE analyses SET input_hash = ${'a'.repeat(64)} WHERE id = ${analysisId}`);
    const quality = await signedIn(h, 'quality@valeharbor.example');
    const report = (await apiPost(quality, `/studies/${id}/integrity-check`).expect(200)).body;
    // The signature binds the analysis's input hash, so the content hash fails with it.
    expect(checksOf(report)).toEqual({ 'Content hash': false, 'Signed PDF': true, 'Analysis input': false, 'History chain': true });
    expect(report.checks.find((c: Check) => c.name === 'Analysis input').detail).toBe('The stored rows or settings differ from those the signed analysis used.');
    expect((await lastEvent(id, 'integrity.checked')).after).toEqual({ passed: false, failed: ['Content hash', 'Analysis input'] });
  });

  it('fails the analysis-input check when the input stored with the signed analysis is changed (the one the reproducibility re-check re-runs)', async () => {
    const id = await signedStudy(h, `Tampered stored input ${Date.now()}`);
    const { analysisId } = await signedAnalysis(id);
    await asOwnerWithoutTriggers(sql`UPDATE analyses SET input = jsonb_set(input, '{rows,6,candidate}', to_jsonb((input #>> '{rows,6,candidate}')::numeric + 2)) WHERE id = ${analysisId}`);
    const quality = await signedIn(h, 'quality@valeharbor.example');
    const report = (await apiPost(quality, `/studies/${id}/integrity-check`).expect(200)).body;
    expect(report.passed).toBe(false);
    expect(checksOf(report)).toEqual({ 'Content hash': true, 'Signed PDF': true, 'Analysis input': false, 'History chain': true });
    expect(report.checks.find((c: Check) => c.name === 'Analysis input').detail).toMatch(/input stored with the signed analysis/);
    expect((await lastEvent(id, 'integrity.checked')).after).toEqual({ passed: false, failed: ['Analysis input'] });
  });
});
