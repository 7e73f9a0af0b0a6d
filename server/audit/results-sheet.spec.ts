import { serverKind } from '../kinds';
import ExcelJS from 'exceljs';
import { analytes, instruments } from '../db/schema';
import { renderStudyReport } from '../reports/render-report';
import type { ComparisonFindings } from '../reports/report-model';
import { comparisonReport } from '../reports/testing/fixtures';
import { flat, pdfPages } from '../reports/testing/pdf-text';
import { analysedComparison, waitForAnalysis } from '../test/fixtures';
import { binary, Harness, signedIn, startHarness } from '../test/harness';
import { resultsSheet } from './results-sheet';

let h: Harness;
beforeAll(async () => { h = await startHarness({}, { jobs: true }); });
afterAll(() => h.close());

type Session = Awaited<ReturnType<typeof signedIn>>;

async function workbook(id: number): Promise<ExcelJS.Workbook> {
  const quality = await signedIn(h, 'quality@valeharbor.example');
  const bytes = (await quality.agent.get(`/api/v1/studies/${id}/export.xlsx`).buffer(true).parse(binary).expect(200)).body;
  const book = new ExcelJS.Workbook();
  await book.xlsx.load(bytes);
  return book;
}

const headers = (ws: ExcelJS.Worksheet): string[] => (ws.getRow(1).values as unknown[]).slice(1) as string[];

/** The Results sheet's row whose "Estimate" cell is `name`, as header → cell. */
function line(ws: ExcelJS.Worksheet, name: string): Record<string, ExcelJS.Cell> {
  const head = headers(ws);
  let found: Record<string, ExcelJS.Cell> | null = null;
  ws.eachRow((row) => {
    if (row.getCell(2).value === name) found = Object.fromEntries(head.map((h, k) => [h, row.getCell(k + 1)]));
  });
  if (!found) throw new Error(`no row "${name}" in ${ws.name}`);
  return found;
}

async function intervalStudy(s: Session, kind: 'interval-establish' | 'interval-verify', settings: object, values: number[]) {
  const potassium = (await h.database.db.select().from(analytes)).find((a) => a.name === 'Potassium')!;
  const instrument = (await h.database.db.select().from(instruments)).find((i) => i.laboratoryId === potassium.laboratoryId)!;
  const created = await s.agent.post('/api/v1/studies').set('X-XSRF-TOKEN', s.xsrf)
    .send({ kind, title: `${kind} sheet ${Date.now()}`, analyteId: potassium.id, instrumentId: instrument.id, settings: { resamples: 1000, seed: 'sheet', ...settings } }).expect(201);
  const rows = values.map((v, i) => ({ label: `K${i + 1}`, value: v.toFixed(1) }));
  await s.agent.put(`/api/v1/studies/${created.body.id}/specimens`).set('X-XSRF-TOKEN', s.xsrf).send({ version: created.body.version, rows }).expect(200);
  const queued = await s.agent.post(`/api/v1/studies/${created.body.id}/analyses`).set('X-XSRF-TOKEN', s.xsrf).expect(202);
  expect((await waitForAnalysis(s, queued.body.id)).state).toBe('done');
  return created.body.id as number;
}

describe('the Results sheet of the full record', () => {
  it('lays a comparison out like its findings tables: numbers stored as numbers in the tables\' decimals, states in words', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const study = await analysedComparison(h, tech, `Sheet comparison ${Date.now()}`);
    const ws = (await workbook(study.id)).getWorksheet('Results')!;
    expect(headers(ws)).toEqual(['Section', 'Estimate', 'Value', '95% CI low', '95% CI high', 'p', 'Unit', 'In words']);

    const mean = line(ws, 'Mean bias');
    for (const column of ['Value', '95% CI low', '95% CI high', 'p']) expect(mean[column].type).toBe(ExcelJS.ValueType.Number);
    expect([mean['Value'].numFmt, mean['p'].numFmt, mean['Unit'].value]).toEqual(['0.00', '[<0.001]"< 0.001";0.000', 'mmol/L']);
    const slope = line(ws, 'Slope');
    expect(slope['Value'].type).toBe(ExcelJS.ValueType.Number);
    expect(slope['Value'].numFmt).toBe('0.000');
    // inventedPairs(40) is y = x + 0.1 with a small noise, so Passing–Bablok's slope is exactly 1 (its rank-based CI too).
    expect(slope['Value'].value).toBeCloseTo(1, 12);
    expect(slope['In words'].value).toBe('The candidate reads neither higher nor lower per unit (slope 1.000, 95% CI 1.000 to 1.000, that is 0.0% to 0.0%). The CI includes 1: a proportional difference is not shown.');
    expect(line(ws, 'Pearson r (for reference only)')['Value'].numFmt).toBe('0.0000');
    expect(line(ws, 'Pairs analysed')['Value'].value).toBe(40);
    expect(line(ws, 'CIs of slope and intercept')['In words'].value).toBe('rank-based (Passing & Bablok 1983)');
    expect(String(line(ws, 'Linearity (the cusum test for linearity of Passing–Bablok)')['In words'].value)).toMatch(/^The cusum test for linearity of Passing–Bablok finds/);
    expect(line(ws, 'Findings')['In words'].value).toBe('Current: they match the rows and settings as they are now');
    const level = line(ws, 'Predicted bias at 7.0 mmol/L');
    expect(level['Value'].type).toBe(ExcelJS.ValueType.Number);
    // Bias 0.1 mmol/L at 7.0 against an allowable max(0.2, 4 % of 7.0) = 0.28 mmol/L: the whole CI lies inside.
    expect(level['Value'].value).toBeCloseTo(0.1, 10);
    expect(level['In words'].value).toBe('Within the allowable bias (allowable ±0.28 mmol/L)');
  });

  it('gives an establishment its two CIs per limit and no p column', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const values = Array.from({ length: 120 }, (_, i) => 3.5 + ((i * 37) % 120) / 100);
    const ws = (await workbook(await intervalStudy(tech, 'interval-establish', { populationDescription: 'Invented' }, values))).getWorksheet('Results')!;
    expect(headers(ws)).toEqual([
      'Section', 'Estimate', 'Percentile', 'Value', '90% CI low, rank-based', '90% CI high, rank-based', '90% CI low, bootstrap', '90% CI high, bootstrap', 'Unit', 'In words',
    ]);
    const upper = line(ws, 'Upper limit');
    for (const column of ['Percentile', 'Value', '90% CI low, rank-based', '90% CI high, bootstrap']) expect(upper[column].type).toBe(ExcelJS.ValueType.Number);
    expect([upper['Percentile'].value, upper['Value'].numFmt, upper['Unit'].value]).toEqual([97.5, '0.00', 'mmol/L']);
    expect(line(ws, 'Method')['In words'].value).toBe('Nonparametric (rank p(n + 1))');
  });

  it('gives a verification its counts and its decision in words, with neither CI nor p column', async () => {
    const tech = await signedIn(h, 'tech@valeharbor.example');
    const values = Array.from({ length: 20 }, (_, i) => 3.6 + (i % 10) * 0.15);
    const ws = (await workbook(await intervalStudy(tech, 'interval-verify', { statedLower: 3.5, statedUpper: 5.1, statedSource: 'Insert (invented)' }, values))).getWorksheet('Results')!;
    expect(headers(ws)).toEqual(['Section', 'Estimate', 'Value', 'Unit', 'In words']);
    const outside = line(ws, 'Outside the stated interval');
    expect([outside['Value'].type, outside['Value'].value]).toEqual([ExcelJS.ValueType.Number, 0]);
    expect(line(ws, 'Stated upper limit')['Value'].numFmt).toBe('0.0');
    expect(String(line(ws, 'Decision')['In words'].value)).toMatch(/^Accepted: 0 of 20 outside, at most 2 allowed\./);
  });

  it('names the regression\'s CI method exactly as the report does', async () => {
    const report = comparisonReport(40, { regression: 'deming', demingRatio: 1.5 });
    const results = report.results as ComparisonFindings;
    const ws = resultsSheet(new ExcelJS.Workbook(), serverKind('method-comparison'), results, { unit: 'mmol/L', decimals: 1, heading: { analysis: 'fixture', findings: 'fixture' } });
    const named = String(line(ws, 'CIs of slope and intercept')['In words'].value);
    expect(named).toBe('percentile bootstrap of resampled pairs');
    const pdf = flat(pdfPages(await renderStudyReport(report)));
    expect(pdf).toContain(`CIs of slope and intercept: ${named}`);
    expect(pdf).toContain(String(line(ws, 'Method')['In words'].value));
  });
});
