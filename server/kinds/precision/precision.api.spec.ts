import ExcelJS from 'exceljs';
import { sql } from 'drizzle-orm';
import { analytes, instruments } from '../../db/schema';
import { flat, pdfPages } from '../../reports/testing/pdf-text';
import { waitForAnalysis } from '../../test/fixtures';
import { binary, Harness, signedIn, startHarness } from '../../test/harness';
import { precisionRuns } from './demo';

/**
 * A precision study through the API, as people use it: setup with materials and claims, rows, the analysis,
 * submission, the director's signature, the signed PDF, the archive, the full record and the re-checks.
 */
let h: Harness;
beforeAll(async () => { h = await startHarness({}, { jobs: true }); });
afterAll(() => h.close());

type Session = Awaited<ReturnType<typeof signedIn>>;
const post = (s: Session, path: string, body: object = {}) => s.agent.post(`/api/v1${path}`).set('X-XSRF-TOKEN', s.xsrf).send(body);
const put = (s: Session, path: string, body: object) => s.agent.put(`/api/v1${path}`).set('X-XSRF-TOKEN', s.xsrf).send(body);

const DAYS = ['1', '2', '3', '4', '5'];
const MATERIALS = [
  { name: 'Low', claimRepeatability: 0.08, claimWithinLab: 0.12, claimAs: 'sd', assignedValue: 5.4, assignedUncertainty: 0.05, assignedSource: 'Invented target' },
  { name: 'High', claimRepeatability: 1.0, claimWithinLab: 1.4, claimAs: 'cv' },
];
/** The demo's generator (server/kinds/precision/demo.ts): 'Low' verifies both claims, 'High' within-lab is consistent with its claim. */
const rowsOf = () => [
  ...precisionRuns('vh-prec-low', 'Low', DAYS, 5, 5.42, 0.06, 0.03, 2),
  ...precisionRuns('vh-prec-high', 'High', DAYS, 5, 16.8, 0.15, 0.2, 2),
];

async function precisionStudy(s: Session, settings: object = { materials: MATERIALS, decimals: 2 }, status = 201) {
  // The demo laboratory's (another laboratory keeps a glucose of its own).
  const line = (await h.database.db.select().from(instruments)).find((i) => i.name === 'Chemistry line 2')!;
  const glucose = (await h.database.db.select().from(analytes)).find((a) => a.laboratoryId === line.laboratoryId && a.name === 'Glucose')!;
  return post(s, '/studies', { kind: 'precision', title: `Precision ${Date.now()}`, analyteId: glucose.id, instrumentId: line.id, settings }).expect(status);
}

async function analysed(s: Session) {
  const study = (await precisionStudy(s)).body;
  const saved = await put(s, `/studies/${study.id}/specimens`, { version: study.version, rows: rowsOf() }).expect(200);
  const queued = await post(s, `/studies/${study.id}/analyses`).expect(202);
  return { study, saved: saved.body, done: await waitForAnalysis(s, queued.body.id) };
}

/** An analysed precision study, submitted by the technologist and signed by the director; with the people involved. */
async function signedPrecision() {
  const tech = await signedIn(h, 'tech@valeharbor.example');
  const director = await signedIn(h, 'director@valeharbor.example');
  const quality = await signedIn(h, 'quality@valeharbor.example');
  const { study } = await analysed(tech);
  await post(tech, `/studies/${study.id}/submit`).expect(200);
  await post(director, `/studies/${study.id}/sign`, { meaning: 'accepted', password: 'parallax-demo' }).expect(200);
  return { study, director, quality };
}

describe('precision studies', () => {
  it('creates a study with its materials, defaults and one instrument, and refuses bad claims naming the field', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const created = (await precisionStudy(tech)).body;
    expect(created.kind).toBe('precision');
    expect(created.settings).toMatchObject({ days: 5, replicates: 5, alpha: 0.05, materials: [expect.objectContaining({ name: 'Low', claimAs: 'sd' }), expect.objectContaining({ name: 'High' })] });
    expect(created.settings.outlierRule).toMatch(/5\.5 repeatability SDs/);
    const bad = await precisionStudy(tech, { materials: [{ ...MATERIALS[0], claimRepeatability: -1 }] }, 400);
    expect(bad.body.issues[0].message).toBe('settings.materials.0.claimRepeatability: The repeatability claim must be above 0');
    const swapped = await precisionStudy(tech, { materials: [{ ...MATERIALS[0], claimWithinLab: 0.05 }] }, 400);
    expect(swapped.body.issues[0].message).toMatch(/within-laboratory claim cannot be smaller than the repeatability claim/);
    // A change of the materials is checked for the kind too, and nothing is saved.
    const patched = await tech.agent.patch(`/api/v1/studies/${created.id}`).set("X-XSRF-TOKEN", tech.xsrf).send({ version: created.version, settings: { materials: [{ ...MATERIALS[1], claimAs: "percent" }] } }).expect(400);
    expect(patched.body.issues[0].message).toMatch(/^settings\.materials\.0\.claimAs: /);
    expect((await tech.agent.get(`/api/v1/studies/${created.id}`).expect(200)).body.settings.materials).toHaveLength(2);
  });

  it('keeps material, day and replicate with each row, and names a bad cell by row and field', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = (await precisionStudy(tech)).body;
    const bad = await put(tech, `/studies/${study.id}/specimens`, { version: study.version, rows: [{ material: 'Low', day: '1', replicate: 'two', value: '5.4' }] }).expect(400);
    expect(bad.body.issues[0]).toEqual({ path: 'rows.0.replicate', message: 'row 1: replicate "two" must be a whole number from 1' });
    const rows = rowsOf();
    const saved = (await put(tech, `/studies/${study.id}/specimens`, { version: study.version, rows }).expect(200)).body;
    expect(saved.rows).toHaveLength(50);
    expect(saved.rows[6]).toMatchObject({ position: 7, material: 'Low', day: '2', replicate: 2, value: Number(rows[6].value), valueText: rows[6].value });
    // An edit of a kind's own field is audited cell by cell like any other.
    const edited = rows.map((r, i) => (i === 6 ? { ...r, day: '3' } : r));
    await put(tech, `/studies/${study.id}/specimens`, { version: saved.version, rows: edited }).expect(200);
    const history = (await tech.agent.get(`/api/v1/studies/${study.id}/history`).expect(200)).body as { details: string[] }[];
    expect(history.flatMap((e) => e.details)).toContain('row 7: day 2 → 3');
  });

  it('imports a CSV file with material, day, replicate and result columns, suggesting the mapping from the headers', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = (await precisionStudy(tech)).body;
    const csv = ['Material,Run date,Rep,Result,Comment', ...rowsOf().map((r) => `${r.material},2026-11-1${r.day},${r.replicate},${r.value},`)].join('\n');
    const preview = (await tech.agent.post(`/api/v1/studies/${study.id}/uploads`).set('X-XSRF-TOKEN', tech.xsrf).attach('file', Buffer.from(csv), 'precision.csv').expect(201)).body;
    expect(preview.suggestedMapping).toEqual({ material: 'Material', day: 'Run date', replicate: 'Rep', value: 'Result', note: 'Comment' });
    const missing = await post(tech, `/studies/${study.id}/uploads/${preview.uploadId}/import`, { version: study.version, mode: 'replace', mapping: { material: 'Material', value: 'Result' } }).expect(400);
    expect(missing.body.issues[0]).toEqual({ path: 'mapping.day', message: 'Choose the column that holds the day' });
    const imported = (await post(tech, `/studies/${study.id}/uploads/${preview.uploadId}/import`, { version: study.version, mode: 'replace', mapping: preview.suggestedMapping }).expect(200)).body;
    expect(imported.rows).toHaveLength(50);
    expect(imported.rows[0]).toMatchObject({ material: 'Low', day: '2026-11-11', replicate: 1, uploadId: preview.uploadId });
  });

  it('analyses per material: the ANOVA components, the verdicts against the claims, trueness', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const { done } = await analysed(tech);
    expect(done.error).toBeNull();
    const r = done.results;
    expect(r.kind).toBe('precision');
    expect(r.materialsTested).toBe(2);
    const [low, high] = r.materials;
    expect(low).toMatchObject({ name: 'Low', n: 25, days: 5, verdicts: { repeatability: 'verified', withinLab: 'verified' }, trueness: expect.objectContaining({ verdict: 'verified' }) });
    expect(high).toMatchObject({ name: 'High', n: 25, verdicts: { repeatability: 'verified', withinLab: 'consistent' }, trueness: null });
    expect(high.withinLab.cv).toBeGreaterThan(1.4);
    expect(high.withinLab.cv).toBeLessThanOrEqual(high.uvl.withinLab);
    expect(r.caution).toMatch(/Decision support only/);
  });

  it('fails the analysis in words when a row names a material the settings do not list', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = (await precisionStudy(tech)).body;
    const rows = rowsOf().map((r, i) => (i === 3 ? { ...r, material: 'Middle' } : r));
    await put(tech, `/studies/${study.id}/specimens`, { version: study.version, rows }).expect(200);
    const queued = await post(tech, `/studies/${study.id}/analyses`).expect(202);
    const done = await waitForAnalysis(tech, queued.body.id);
    expect(done.state).toBe('failed');
    expect(done.error).toMatch(/material "Middle", named at row 4/);
  });

  it('goes from submission to a signed PDF, the archive, the full record and both re-checks', async () => {
    const { study, director, quality } = await signedPrecision();
    const pdf = (await director.agent.get(`/api/v1/studies/${study.id}/report.pdf`).buffer(true).parse(binary).expect(200)).body as Buffer;
    const text = flat(await pdfPages(pdf));
    expect(text).toContain('Precision verification: study report');
    expect(text).toMatch(/consistent with the claim/i);
    expect(text).toMatch(/Decision support only/);
    const archive = (await quality.agent.get('/api/v1/archive').query({ q: study.title, kind: 'precision' }).expect(200)).body;
    expect(archive.items[0]).toMatchObject({ id: study.id, state: 'signed', verdict: 'claims-verified', n: 50 });
    expect((await quality.agent.get('/api/v1/archive').query({ q: study.title, verdict: 'claims-not-verified' }).expect(200)).body.total).toBe(0);
    const record = (await quality.agent.get(`/api/v1/studies/${study.id}/export.xlsx`).buffer(true).parse(binary).expect(200)).body as Buffer;
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(record as unknown as ArrayBuffer);
    const sheetText = JSON.stringify(wb.getWorksheet('Results')!.getSheetValues());
    expect(sheetText).toMatch(/High/);
    expect(sheetText).toMatch(/consistent with the claim/i);
    const integrity = (await post(quality, `/studies/${study.id}/integrity-check`).expect(200)).body;
    expect(integrity.checks.map((c: { name: string; passed: boolean }) => [c.name, c.passed])).toEqual([
      ['Content hash', true], ['Signed PDF', true], ['Analysis input', true], ['History chain', true],
    ]);
    const repro = (await post(quality, `/studies/${study.id}/reproduce`).expect(200)).body;
    expect(repro).toMatchObject({ identical: true, sameEngine: true, differences: [] });
    expect(repro.fieldsCompared).toBeGreaterThan(50);
  });

  it('fails the content-hash check when a precision row\'s day is changed behind the application\'s back', async () => {
    const { study, director, quality } = await signedPrecision();
    await h.database.db.transaction(async (tx) => {
      await tx.execute(sql`SET LOCAL session_replication_role = replica`);
      await tx.execute(sql`UPDATE specimens SET extra = jsonb_set(extra, '{day}', '"4"') WHERE study_id = ${study.id} AND position = 2`);
    });
    const report = (await post(quality, `/studies/${study.id}/integrity-check`).expect(200)).body;
    expect(report.checks.find((c: { name: string }) => c.name === 'Content hash')).toMatchObject({ passed: false });
  });

  it('will not submit without materials and claims', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = (await precisionStudy(tech, {})).body;
    expect(study.settings.materials).toEqual([]);
    const res = await post(tech, `/studies/${study.id}/submit`);
    expect(res.status).toBe(400);
    expect(res.body.issues).toContainEqual({ path: 'settings.materials', message: 'Name at least one material with its repeatability and within-laboratory claims' });
  });
});
