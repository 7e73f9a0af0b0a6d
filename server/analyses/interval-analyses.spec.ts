import { eq } from 'drizzle-orm';
import seedrandom from 'seedrandom';
import { analyses, analytes, instruments } from '../db/schema';
import { flat, pdfPages } from '../reports/testing/pdf-text';
import { binary } from '../test/harness';
import { waitForAnalysis } from '../test/fixtures';
import { Harness, signedIn, startHarness } from '../test/harness';

let h: Harness;
beforeAll(async () => { h = await startHarness({}, { jobs: true }); });
afterAll(() => h.close());

type Session = Awaited<ReturnType<typeof signedIn>>;

async function intervalStudy(s: Session, kind: 'interval-establish' | 'interval-verify', settings: object) {
  const potassium = (await h.database.db.select().from(analytes)).find((a) => a.name === 'Potassium')!;
  const instrument = (await h.database.db.select().from(instruments)).find((i) => i.laboratoryId === potassium.laboratoryId)!;
  const res = await s.agent.post('/api/v1/studies').set('X-XSRF-TOKEN', s.xsrf)
    .send({ kind, title: `${kind} ${Date.now()}`, analyteId: potassium.id, instrumentId: instrument.id, settings: { resamples: 1000, seed: 'interval-test', ...settings } }).expect(201);
  return res.body as { id: number; version: number; settings: { confidenceLevel: number } };
}

async function run(s: Session, id: number) {
  const queued = await s.agent.post(`/api/v1/studies/${id}/analyses`).set('X-XSRF-TOKEN', s.xsrf).expect(202);
  return waitForAnalysis(s, queued.body.id);
}

/** Invented potassium values (mmol/L) for two sexes, the men's a little higher. */
function values(n: number, seed: string, shift = 0.35) {
  const rng = seedrandom(seed);
  return Array.from({ length: n }, (_, i) => {
    const sex = i % 2 ? 'M' : 'F';
    const z = Math.sqrt(-2 * Math.log(1 - rng())) * Math.cos(2 * Math.PI * rng());
    return { label: `R${i + 1}`, value: (4.1 + (sex === 'M' ? shift : 0) + 0.3 * z).toFixed(2), sex };
  });
}

describe('reference-interval studies', () => {
  it('establishes an interval with rank and bootstrap CIs, and tests the sex partition', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = await intervalStudy(tech, 'interval-establish', { partitionFields: ['sex'], populationDescription: 'Invented healthy adults' });
    expect(study.settings.confidenceLevel).toBe(0.9);
    const rows = values(240, 'establish');
    await tech.agent.put(`/api/v1/studies/${study.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: study.version, rows }).expect(200);
    const done = await run(tech, study.id);
    expect(done.error).toBeNull();
    const r = done.results;
    expect(r.n).toBe(240);
    expect(r.lower.estimate).toBeLessThan(r.upper.estimate);
    expect(r.lower.rankCi).toHaveLength(2);
    expect(r.upper.ci).toHaveLength(2);
    expect(r.partitions[0]).toMatchObject({ field: 'sex', recommended: true });
  });

  it('refuses an invalid sex value naming the row', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = await intervalStudy(tech, 'interval-establish', {});
    const res = await tech.agent.put(`/api/v1/studies/${study.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf)
      .send({ version: study.version, rows: [{ value: '4.1', sex: 'X' }] }).expect(400);
    expect(res.body.issues[0]).toEqual({ path: 'rows.0.sex', message: 'row 1: sex must be F or M (or empty)' });
  });

  it('verifies a stated interval: accepted with at most 2 of 20 outside, refused with more, with the advice', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const fits = await intervalStudy(tech, 'interval-verify', { statedLower: 3.5, statedUpper: 5.1, statedSource: 'Invented insert' });
    const twenty = Array.from({ length: 20 }, (_, i) => ({ label: `V${i + 1}`, value: (3.6 + i * 0.07).toFixed(2) }));
    twenty[0].value = '3.3';
    await tech.agent.put(`/api/v1/studies/${fits.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: fits.version, rows: twenty }).expect(200);
    const ok = (await run(tech, fits.id)).results;
    expect(ok).toMatchObject({ n: 20, outside: 1, accepted: true, outsidePositions: [1] });
    const fails = await intervalStudy(tech, 'interval-verify', { statedLower: 3.5, statedUpper: 5.1, statedSource: 'Invented insert' });
    const high = twenty.map((r, i) => ({ ...r, value: i < 3 ? '5.4' : r.value }));
    await tech.agent.put(`/api/v1/studies/${fails.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: fails.version, rows: high }).expect(200);
    const bad = (await run(tech, fails.id)).results;
    expect(bad).toMatchObject({ outside: 3, accepted: false });
    expect(bad.advice).toMatch(/20 more/);
  });

  it("serves a verification's findings with the source of the stated interval as Setup holds it, also after a record-only change", async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const source = 'Invented package insert for the potassium reagent, edition 4 (2026)';
    const study = await intervalStudy(tech, 'interval-verify', { statedLower: 3.5, statedUpper: 5.1, statedSource: source });
    const twenty = Array.from({ length: 20 }, (_, i) => ({ label: `S${i + 1}`, value: (3.6 + i * 0.07).toFixed(2) }));
    await tech.agent.put(`/api/v1/studies/${study.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: study.version, rows: twenty }).expect(200);
    const done = await run(tech, study.id);
    expect(done.state).toBe('done');
    expect(done.results.stated).toEqual({ lower: 3.5, upper: 5.1, source });

    // The source is a record-only setting: changing it leaves the findings current, and they name the new one.
    const now = (await tech.agent.get(`/api/v1/studies/${study.id}`).expect(200)).body;
    const edition5 = 'Invented package insert for the potassium reagent, edition 5 (2027)';
    await tech.agent.patch(`/api/v1/studies/${study.id}`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: now.version, settings: { statedSource: edition5 } }).expect(200);
    const after = (await tech.agent.get(`/api/v1/studies/${study.id}`).expect(200)).body;
    expect(after).toMatchObject({ findings: 'current', currentAnalysisId: done.id });
    const served = (await tech.agent.get(`/api/v1/analyses/${done.id}`).expect(200)).body;
    expect(served.results.stated).toEqual({ lower: 3.5, upper: 5.1, source: edition5 });

    // The stored results stay as the engine made them (a signature binds them; a re-run compares them).
    const [stored] = await h.database.db.select({ results: analyses.results }).from(analyses).where(eq(analyses.id, done.id));
    expect((stored.results as { stated: unknown }).stated).toEqual({ lower: 3.5, upper: 5.1, source: '' });
  });

  it("prints the source of the stated interval in the PDF's findings of the analysis the job made", async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const source = 'Invented multicentre study of adult outpatients, 2025, table 3';
    const study = await intervalStudy(tech, 'interval-verify', { statedLower: 3.5, statedUpper: 5.1, statedSource: source, decimals: 1 });
    const twenty = Array.from({ length: 20 }, (_, i) => ({ label: `P${i + 1}`, value: (3.6 + i * 0.07).toFixed(1) }));
    twenty[4].value = '5.3';
    await tech.agent.put(`/api/v1/studies/${study.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: study.version, rows: twenty }).expect(200);
    expect((await run(tech, study.id)).results).toMatchObject({ n: 20, outside: 1, accepted: true });
    const pdf = await tech.agent.get(`/api/v1/studies/${study.id}/report.pdf`).buffer(true).parse(binary).expect(200);
    const text = flat(pdfPages(pdf.body as Buffer));
    // In the findings, beside the stated interval (the plan names it too, before its rule).
    expect(text).toContain(`Stated interval 3.5 to 5.1 mmol/L Source of the stated interval ${source} Values tested (n) 20`);
    expect(text).toContain(`Source of the stated interval ${source} Rule the engine applies`);
  });
});
