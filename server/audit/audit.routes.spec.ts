import ExcelJS from 'exceljs';
import { eq, sql } from 'drizzle-orm';
import { studies } from '../db/schema';
import { analysedComparison, createComparison, inventedPairs } from '../test/fixtures';
import { binary, Harness, signedIn, startHarness, signedStudy } from '../test/harness';

let h: Harness;
beforeAll(async () => { h = await startHarness({}, { jobs: true }); });
afterAll(() => h.close());

type Session = Awaited<ReturnType<typeof signedIn>>;
const post = (s: Session, path: string, body: object = {}) => s.agent.post(`/api/v1${path}`).set('X-XSRF-TOKEN', s.xsrf).send(body);


/** As the database owner, with triggers off: what an intruder with direct access could do. */
const asOwnerWithoutTriggers = (statement: ReturnType<typeof sql>) =>
  h.database.db.transaction(async (tx) => {
    await tx.execute(sql`SET LOCAL session_replication_role = replica`);
    await tx.execute(statement);
  });


describe('archive', () => {
  it('filters, sorts and pages on the server, with verdict and signer', async () => {
    const tag = `Archive ${Date.now()}`;
    const id = await signedStudy(h, `${tag} signed`);
    const quality = await signedIn(h, 'quality@valeharbor.example');
    const page = await quality.agent.get('/api/v1/archive').query({ q: tag, state: 'signed' }).expect(200);
    expect(page.body.total).toBe(1);
    expect(page.body.items[0]).toMatchObject({ id, state: 'signed', signerName: 'Dr. Imani Okafor', meaning: 'accepted', n: 40 });
    // inventedPairs(40): the candidate reads 0.1 mmol/L above (noise ±0.1); the bias CI (about 0.05 to 0.10, judged on
    // 0.05 to 0.15 at the 0.1 step) lies inside the allowable 0.2 mmol/L or 4 % at 2.8, 7.0 and 11.1 mmol/L.
    expect(page.body.items[0].verdict).toBe('within');
    const byVerdict = await quality.agent.get('/api/v1/archive').query({ q: tag, verdict: 'within' }).expect(200);
    expect(byVerdict.body.items.map((i: { id: number }) => i.id)).toEqual([id]);
    for (const other of ['inconclusive', 'exceeds']) {
      expect((await quality.agent.get('/api/v1/archive').query({ q: tag, verdict: other }).expect(200)).body.total).toBe(0);
    }
    const paged = await quality.agent.get('/api/v1/archive').query({ sort: 'createdAt', order: 'asc', pageSize: 1, page: 2 }).expect(200);
    expect(paged.body.items).toHaveLength(1);
    expect(paged.body.total).toBeGreaterThan(1);
    await quality.agent.get('/api/v1/archive').query({ verdict: 'maybe' }).expect(400);
    const cedar = await signedIn(h, 'director@cedarpoint.example');
    expect((await cedar.agent.get('/api/v1/archive').query({ q: tag })).body.total).toBe(0);
  });

  it('exports the list and one study\'s full record as .xlsx that reads back', async () => {
    const id = await signedStudy(h, `Export ${Date.now()}`);
    const quality = await signedIn(h, 'quality@valeharbor.example');
    const list = await quality.agent.get('/api/v1/archive/export.xlsx').buffer(true).parse(binary).expect(200);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(list.body);
    const rows = wb.getWorksheet('Studies')!.getSheetValues().filter(Boolean) as unknown[][];
    expect(rows.some((r) => r[1] === id)).toBe(true);
    const record = await quality.agent.get(`/api/v1/studies/${id}/export.xlsx`).buffer(true).parse(binary).expect(200);
    const book = new ExcelJS.Workbook();
    await book.xlsx.load(record.body);
    expect(book.worksheets.map((w) => w.name)).toEqual(['Study', 'Rows', 'Results', 'All result fields', 'Signatures', 'Audit history']);
    expect(book.getWorksheet('Rows')!.rowCount).toBe(41);
    expect(book.getWorksheet('Signatures')!.getRow(2).getCell(2).value).toBe('Dr. Imani Okafor');
    const history = book.getWorksheet('Audit history')!.getColumn(4).values as string[]; // after the laboratory time and the UTC instant
    expect(history).toEqual(expect.arrayContaining(['Submitted for sign-off', 'Signed: accepted for patient testing']));
  });
});

describe('exports of what users typed', () => {
  it('writes text that a spreadsheet could read as a formula so that none does, and keeps numbers as they are', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = await createComparison(h, tech, '=HYPERLINK("http://example.invalid","open me")');
    const rows = inventedPairs(5).map((r, i) => ({ ...r, label: ['+1+1', '-2+3', '@SUM(A1)', 'S4', '-12'][i], note: ['=1+1', 'plain', '', '\tcmd', ''][i] }));
    await tech.agent.put(`/api/v1/studies/${study.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: study.version, rows }).expect(200);
    const quality = await signedIn(h, 'quality@valeharbor.example');
    const bytes = (await quality.agent.get(`/api/v1/studies/${study.id}/export.xlsx`).buffer(true).parse(binary).expect(200)).body;
    const book = new ExcelJS.Workbook();
    await book.xlsx.load(bytes);
    const cells: ExcelJS.Cell[] = [];
    book.eachSheet((ws) => ws.eachRow((row) => row.eachCell((c) => cells.push(c))));
    expect(cells.filter((c) => c.type === ExcelJS.ValueType.Formula)).toEqual([]);
    const texts = cells.map((c) => c.value).filter((v): v is string => typeof v === 'string');
    expect(texts.filter((t) => /^[=+@\t\r]/.test(t) || /^-[^\d.]/.test(t))).toEqual([]);
    expect(texts).toEqual(expect.arrayContaining(["'=HYPERLINK(\"http://example.invalid\",\"open me\")", "'+1+1", "'-2+3", "'@SUM(A1)", "'\tcmd", "'=1+1", '-12', 'plain']));
  });
});

describe('re-checks', () => {
  it('passes integrity and reproducibility for an untouched signed study', async () => {
    const id = await signedStudy(h, `Intact ${Date.now()}`);
    const quality = await signedIn(h, 'quality@valeharbor.example');
    const integrity = await post(quality, `/studies/${id}/integrity-check`).expect(200);
    expect(integrity.body.checks.map((c: { name: string; passed: boolean }) => [c.name, c.passed])).toEqual([
      ['Content hash', true], ['Signed PDF', true], ['Analysis input', true], ['History chain', true],
    ]);
    const repro = await post(quality, `/studies/${id}/reproduce`).expect(200);
    expect(repro.body).toMatchObject({ identical: true, sameEngine: true, differences: [] });
    expect(repro.body.fieldsCompared).toBeGreaterThan(50);
  });

  it('fails the content-hash check after a row is changed behind the application\'s back', async () => {
    const id = await signedStudy(h, `Tampered row ${Date.now()}`);
    await asOwnerWithoutTriggers(sql`UPDATE specimens SET candidate = candidate + 0.5, candidate_text = 'tampered' WHERE study_id = ${id} AND position = 7`);
    const quality = await signedIn(h, 'quality@valeharbor.example');
    const report = (await post(quality, `/studies/${id}/integrity-check`).expect(200)).body;
    expect(report.passed).toBe(false);
    expect(report.checks.find((c: { name: string }) => c.name === 'Content hash')).toMatchObject({ passed: false, detail: expect.stringMatching(/changed after signing/) });
  });

  it('fails the chain check after an audit event is edited behind the application\'s back', async () => {
    const id = await signedStudy(h, `Tampered history ${Date.now()}`);
    const [study] = await h.database.db.select().from(studies).where(eq(studies.id, id));
    await asOwnerWithoutTriggers(sql`UPDATE audit_events SET reason = 'rewritten' WHERE id = (SELECT min(id) FROM audit_events WHERE study_id = ${study.id})`);
    const quality = await signedIn(h, 'quality@valeharbor.example');
    const report = (await post(quality, `/studies/${id}/integrity-check`).expect(200)).body;
    expect(report.checks.find((c: { name: string }) => c.name === 'History chain')).toMatchObject({ passed: false, detail: expect.stringMatching(/broken/) });
    // Put the laboratory's chain back for the tests that follow: restore the original value.
    await asOwnerWithoutTriggers(sql`UPDATE audit_events SET reason = NULL WHERE id = (SELECT min(id) FROM audit_events WHERE study_id = ${study.id})`);
  });

  it('shows a study\'s history in words and the laboratory history with filters', async () => {
    const id = await signedStudy(h, `History ${Date.now()}`);
    const quality = await signedIn(h, 'quality@valeharbor.example');
    const events = (await quality.agent.get(`/api/v1/studies/${id}/history`).expect(200)).body;
    expect(events.map((e: { headline: string }) => e.headline)).toEqual(expect.arrayContaining(['Submitted for sign-off', 'Signed: accepted for patient testing']));
    const page = (await quality.agent.get('/api/v1/audit').query({ studyId: id, action: 'study.' }).expect(200)).body;
    // Newest first: of this study's events only those whose action starts with "study.".
    expect(page.items.map((e: { action: string }) => e.action)).toEqual(['study.signed', 'study.submitted', 'study.created']);
    expect(page.total).toBe(3);
    const unfiltered = (await quality.agent.get('/api/v1/audit').query({ studyId: id }).expect(200)).body;
    expect(unfiltered.items.map((e: { action: string }) => e.action)).toContain('analysis.queued');
    expect(unfiltered.items.every((e: { studyId: number }) => e.studyId === id)).toBe(true);
    expect(unfiltered.total).toBeGreaterThan(3);
  });
});
