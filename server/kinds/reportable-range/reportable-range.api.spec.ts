import ExcelJS from 'exceljs';
import { sql } from 'drizzle-orm';
import { analytes, instruments } from '../../db/schema';
import { flat, pdfPages } from '../../reports/testing/pdf-text';
import { waitForAnalysis } from '../../test/fixtures';
import { binary, Harness, signedIn, startHarness } from '../../test/harness';
import { RANGE_DEMOS } from './demo';

/**
 * A reportable-range study through the API, as people use it: setup with levels, pools and the goal, rows, the
 * analysis, submission, the director's signature, the signed PDF, the archive, the full record and the re-checks.
 */
let h: Harness;
beforeAll(async () => { h = await startHarness({}, { jobs: true }); });
afterAll(() => h.close());

type Session = Awaited<ReturnType<typeof signedIn>>;
const post = (s: Session, path: string, body: object = {}) => s.agent.post(`/api/v1${path}`).set('X-XSRF-TOKEN', s.xsrf).send(body);
const put = (s: Session, path: string, body: object) => s.agent.put(`/api/v1${path}`).set('X-XSRF-TOKEN', s.xsrf).send(body);
const patch = (s: Session, path: string, body: object) => s.agent.patch(`/api/v1${path}`).set('X-XSRF-TOKEN', s.xsrf).send(body);

/** The demo's levels, goal and rows (server/kinds/reportable-range/demo.ts): the top level bends off the line. */
const demo = RANGE_DEMOS[0];
const SETTINGS = { ...demo.settings, resamples: 2000 };
const rowsOf = () => demo.rows.map((r) => ({ ...r }));

async function rangeStudy(s: Session, settings: object = SETTINGS, status = 201) {
  // The demo laboratory's (another laboratory keeps a glucose of its own).
  const line = (await h.database.db.select().from(instruments)).find((i) => i.name === 'Chemistry line 2')!;
  const glucose = (await h.database.db.select().from(analytes)).find((a) => a.laboratoryId === line.laboratoryId && a.name === 'Glucose')!;
  return post(s, '/studies', { kind: 'reportable-range', title: `Reportable range ${Date.now()}`, analyteId: glucose.id, instrumentId: line.id, settings }).expect(status);
}

async function analysed(s: Session) {
  const study = (await rangeStudy(s)).body;
  const saved = await put(s, `/studies/${study.id}/specimens`, { version: study.version, rows: rowsOf() }).expect(200);
  const queued = await post(s, `/studies/${study.id}/analyses`).expect(202);
  return { study, saved: saved.body, done: await waitForAnalysis(s, queued.body.id) };
}

async function signedRange() {
  const tech = await signedIn(h, 'tech@valeharbor.example');
  const director = await signedIn(h, 'director@valeharbor.example');
  const quality = await signedIn(h, 'quality@valeharbor.example');
  const { study } = await analysed(tech);
  await post(tech, `/studies/${study.id}/submit`).expect(200);
  await post(director, `/studies/${study.id}/sign`, { meaning: 'accepted', password: 'parallax-demo' }).expect(200);
  return { study, tech, director, quality };
}

describe('reportable-range studies', () => {
  it('creates a study with its levels, defaults and one instrument, and refuses bad levels naming the field', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const created = (await rangeStudy(tech)).body;
    expect(created.kind).toBe('reportable-range');
    expect(created.settings).toMatchObject({ replicates: 2, alpha: 0.05, poolLow: 0.3, poolHigh: 32.3, allowableNonlinearity: 0.5, levels: expect.arrayContaining([{ name: 'Level 1', fraction: 0, assigned: null }]) });
    expect(created.settings.acceptanceRule).toMatch(/deviation of the best-fitting polynomial/);
    const both = await rangeStudy(tech, { levels: [{ name: 'A', assigned: 1, fraction: 0.5 }] }, 400);
    expect(both.body.issues[0].message).toBe('settings.levels.0.assigned: Give the level either an assigned value or a mixing fraction, not both');
    const pools = await rangeStudy(tech, { ...SETTINGS, poolHigh: null }, 400);
    expect(pools.body.issues[0].message).toBe('settings.poolHigh: Give both pool values or neither');
    const bad = await patch(tech, `/studies/${created.id}`, { version: created.version, settings: { allowableNonlinearityPercent: -2 } }).expect(400);
    expect(bad.body.issues[0].message).toBe('settings.allowableNonlinearityPercent: The allowable nonlinearity in % must be above 0');
    expect((await tech.agent.get(`/api/v1/studies/${created.id}`).expect(200)).body.settings.allowableNonlinearityPercent).toBe(1.5);
  });

  it('keeps level and replicate with each row, names a bad cell by row and field, and audits an edit of the level', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = (await rangeStudy(tech)).body;
    const bad = await put(tech, `/studies/${study.id}/specimens`, { version: study.version, rows: [{ level: 'Level 1', replicate: 'one', value: '0.3' }] }).expect(400);
    expect(bad.body.issues[0]).toEqual({ path: 'rows.0.replicate', message: 'row 1: replicate "one" must be a whole number from 1' });
    const rows = rowsOf();
    const saved = (await put(tech, `/studies/${study.id}/specimens`, { version: study.version, rows }).expect(200)).body;
    expect(saved.rows).toHaveLength(18);
    expect(saved.rows[3]).toMatchObject({ position: 4, level: 'Level 2', replicate: 2, value: Number(rows[3].value), valueText: rows[3].value });
    const edited = rows.map((r, i) => (i === 3 ? { ...r, level: 'Level 3' } : r));
    await put(tech, `/studies/${study.id}/specimens`, { version: saved.version, rows: edited }).expect(200);
    const history = (await tech.agent.get(`/api/v1/studies/${study.id}/history`).expect(200)).body as { details: string[] }[];
    expect(history.flatMap((e) => e.details)).toContain('row 4: level Level 2 → Level 3');
  });

  it('imports a CSV file with level, replicate and result columns, suggesting the mapping from the headers', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = (await rangeStudy(tech)).body;
    const csv = ['Level,Rep,Result,Comment', ...rowsOf().map((r) => `${r.level},${r.replicate},${r.value},`)].join('\n');
    const preview = (await tech.agent.post(`/api/v1/studies/${study.id}/uploads`).set('X-XSRF-TOKEN', tech.xsrf).attach('file', Buffer.from(csv), 'range.csv').expect(201)).body;
    expect(preview.suggestedMapping).toEqual({ level: 'Level', replicate: 'Rep', value: 'Result', note: 'Comment' });
    const imported = (await post(tech, `/studies/${study.id}/uploads/${preview.uploadId}/import`, { version: study.version, mode: 'replace', mapping: preview.suggestedMapping }).expect(200)).body;
    expect(imported.rows).toHaveLength(18);
    expect(imported.rows[17]).toMatchObject({ level: 'Level 9', replicate: 2, uploadId: preview.uploadId });
  });

  it('analyses the levels: the fits, the best degree, the deviations against the goal and the verified range', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const { done } = await analysed(tech);
    expect(done.error).toBeNull();
    const r = done.results;
    expect(r).toMatchObject({ kind: 'reportable-range', bestDegree: 3, verdict: 'range-shortened', verifiedRange: { low: 0.3, high: 28.3, lowLevel: 'Level 1', highLevel: 'Level 8' } });
    expect(r.levels.map((l: { within: boolean }) => l.within)).toEqual([true, true, true, true, true, true, true, true, false]);
    expect(r.verdictWords).toMatch(/verified only from 0\.30 to 28\.30 mmol\/L/);
    // the record-only source of the goal is shown with the findings, as the study has it
    expect(r.goal).toEqual({ absolute: 0.5, percent: 1.5, source: demo.settings.nonlinearitySource });
    expect(r.caution).toMatch(/Decision support only/);
  });

  it('shows a changed source of the goal at once and leaves the findings current; a changed goal makes them out of date', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const { study, done } = await analysed(tech);
    const now = (await tech.agent.get(`/api/v1/studies/${study.id}`).expect(200)).body;
    const renamed = (await patch(tech, `/studies/${study.id}`, { version: now.version, settings: { nonlinearitySource: 'Director\'s goal, memo 12 (invented)' } }).expect(200)).body;
    expect(renamed.findings).toBe('current');
    const shown = (await tech.agent.get(`/api/v1/analyses/${done.id}`).expect(200)).body;
    expect(shown.results.goal.source).toBe('Director\'s goal, memo 12 (invented)');
    const tighter = (await patch(tech, `/studies/${study.id}`, { version: renamed.version, settings: { allowableNonlinearity: 0.4 } }).expect(200)).body;
    expect(tighter.findings).toBe('out-of-date');
  });

  it('fails the analysis in words when a row names a level the settings do not list', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = (await rangeStudy(tech)).body;
    const rows = rowsOf().map((r, i) => (i === 5 ? { ...r, level: 'Level 10' } : r));
    await put(tech, `/studies/${study.id}/specimens`, { version: study.version, rows }).expect(200);
    const done = await waitForAnalysis(tech, (await post(tech, `/studies/${study.id}/analyses`).expect(202)).body.id);
    expect(done.state).toBe('failed');
    expect(done.error).toMatch(/level "Level 10", named at row 6/);
  });

  it('will not submit without five levels, the goal and its source', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = (await rangeStudy(tech, {})).body;
    expect(study.settings.levels).toEqual([]);
    const res = await post(tech, `/studies/${study.id}/submit`);
    expect(res.status).toBe(400);
    expect(res.body.issues).toEqual(expect.arrayContaining([
      { path: 'settings.levels', message: 'Name at least 5 levels (CLSI EP06 practice: 5 to 11)' },
      { path: 'settings.allowableNonlinearity', message: 'Give the allowable nonlinearity (in the unit or in %)' },
      { path: 'settings.nonlinearitySource', message: 'Name the source of the allowable nonlinearity' },
    ]));
  });

  it('goes from submission to a signed PDF, the archive, the full record and both re-checks', async () => {
    const { study, director, quality } = await signedRange();
    const pdf = (await director.agent.get(`/api/v1/studies/${study.id}/report.pdf`).buffer(true).parse(binary).expect(200)).body as Buffer;
    const text = flat(await pdfPages(pdf));
    expect(text).toContain('Reportable range verification: study report');
    expect(text).toMatch(/verified only from 0\.30 to 28\.30 mmol\/L/);
    expect(text).toMatch(/Decision support only/);
    const archive = (await quality.agent.get('/api/v1/archive').query({ q: study.title, kind: 'reportable-range' }).expect(200)).body;
    expect(archive.items[0]).toMatchObject({ id: study.id, state: 'signed', verdict: 'range-shortened', n: 18 });
    expect((await quality.agent.get('/api/v1/archive').query({ q: study.title, verdict: 'range-verified' }).expect(200)).body.total).toBe(0);
    const record = (await quality.agent.get(`/api/v1/studies/${study.id}/export.xlsx`).buffer(true).parse(binary).expect(200)).body as Buffer;
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(record as unknown as ArrayBuffer);
    const sheetText = JSON.stringify(wb.getWorksheet('Results')!.getSheetValues());
    expect(sheetText).toMatch(/Level 9/);
    expect(sheetText).toMatch(/Beyond the goal/);
    const integrity = (await post(quality, `/studies/${study.id}/integrity-check`).expect(200)).body;
    expect(integrity.checks.map((c: { name: string; passed: boolean }) => [c.name, c.passed])).toEqual([
      ['Content hash', true], ['Signed PDF', true], ['Analysis input', true], ['History chain', true],
    ]);
    const repro = (await post(quality, `/studies/${study.id}/reproduce`).expect(200)).body;
    expect(repro).toMatchObject({ identical: true, sameEngine: true, differences: [] });
    expect(repro.fieldsCompared).toBeGreaterThan(100);
  });

  it('fails the content-hash check when a row\'s level is changed behind the application\'s back', async () => {
    const { study, quality } = await signedRange();
    await h.database.db.transaction(async (tx) => {
      await tx.execute(sql`SET LOCAL session_replication_role = replica`);
      await tx.execute(sql`UPDATE specimens SET extra = jsonb_set(extra, '{level}', '"Level 5"') WHERE study_id = ${study.id} AND position = 2`);
    });
    const report = (await post(quality, `/studies/${study.id}/integrity-check`).expect(200)).body;
    expect(report.checks.find((c: { name: string }) => c.name === 'Content hash')).toMatchObject({ passed: false });
  });
});
