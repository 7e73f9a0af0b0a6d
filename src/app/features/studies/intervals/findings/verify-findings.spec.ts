import { TestBed } from '@angular/core/testing';
import type { Analysis, SpecimenRow, Study } from '@shared/schemas';
import { StudySettings } from '@shared/schemas';
import { httpController, noAnimations, provideTestHttp } from '../../../../../testing/http';
import { SpecimensStore } from '../../specimens/specimens-store';
import type { VerifyResult } from './interval-result';
import { VerifyFindings } from './verify-findings';

const STUDY = {
  id: 12, kind: 'interval-verify', title: 'Potassium: stated interval', analyte: { id: 4, name: 'Potassium' }, analyteUnit: 'mmol/L',
  settings: StudySettings.parse({ unit: 'mmol/L', decimals: 1, statedLower: 3.5, statedUpper: 5.1, statedSource: "Manufacturer's insert, edition 7" }),
  version: 3, state: 'draft', findings: 'current',
} as unknown as Study;
const ANALYSIS = { id: 40, studyId: 12, state: 'done', current: true } as Analysis;

function result(outside: number, accepted: boolean): VerifyResult {
  return {
    kind: 'verify-interval', n: 20, outside, below: outside, above: 0, allowedOutside: 2, accepted,
    probability: accepted ? 0.642 : 0.075, passRiskAt10Percent: 0.677,
    advice: accepted ? 'Accepted: the stated interval may be transferred.' : 'Not accepted: test 20 more reference individuals; if that also fails, re-examine the population and methods or establish the interval locally.',
    resolution: { increment: 0.1, source: 'analyte', limitedEstimates: [] },
    warnings: [], excludedCount: 0, outsidePositions: [], stated: { lower: 3.5, upper: 5.1, source: "Manufacturer's insert, edition 7" }, caution: '',
  };
}

function row(position: number, value: number): SpecimenRow {
  return {
    position, label: `K-${position}`, comparative: null, candidate: null, value, comparativeText: null, candidateText: null,
    valueText: value.toFixed(1), sex: null, ageBand: null, excluded: false, exclusionReason: null, note: '', uploadId: null,
  };
}

async function render(results: VerifyResult) {
  TestBed.configureTestingModule({ providers: [...provideTestHttp(), noAnimations, SpecimensStore] });
  const fixture = TestBed.createComponent(VerifyFindings);
  fixture.componentRef.setInput('study', STUDY);
  fixture.componentRef.setInput('analysis', ANALYSIS);
  fixture.componentRef.setInput('results', results);
  await fixture.whenStable();
  httpController().expectOne('/api/v1/studies/12/specimens').flush({ version: 3, rows: Array.from({ length: 20 }, (_, i) => row(i + 1, 3.4 + i * 0.08)) });
  await fixture.whenStable();
  fixture.detectChanges();
  const text = (id: string): string | null => (fixture.nativeElement as HTMLElement).querySelector(`[data-testid="${id}"]`)?.textContent?.trim() ?? null;
  return { fixture, text };
}

describe('VerifyFindings', () => {
  // jsdom has no canvas: chart.js gets no context and draws nothing, which is all these tests need.
  beforeEach(() => jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null));
  afterEach(() => {
    httpController().verify();
    jest.restoreAllMocks();
  });

  it('says the acceptance in words with the count outside, the probability and the low power, without advice', async () => {
    const { text } = await render(result(1, true));
    expect(text('verify-acceptance')).toBe('Accepted: 1 of 20 outside; at most 2 allowed.');
    expect(text('verify-outside')).toBe('1 below and 0 above the stated interval 3.5 to 5.1.');
    expect(text('verify-probability')).toBe('0.642');
    expect(text('verify-power')).toContain('68% of the time');
    expect(text('verify-advice')).toBeNull();
  });

  it('gives the advice to test 20 more when the interval is not accepted', async () => {
    const { text } = await render(result(3, false));
    expect(text('verify-acceptance')).toBe('Not accepted: 3 of 20 outside; at most 2 allowed.');
    expect(text('verify-advice')).toContain('test 20 more');
    expect(text('verify-advice')).toContain('establish the interval locally');
  });

  it("names the stated interval's source as Setup holds it, even where the stored results carry none", async () => {
    const { text } = await render({ ...result(1, true), stated: { lower: 3.5, upper: 5.1, source: '' } });
    expect(text('verify-source')).toBe("Manufacturer's insert, edition 7");
  });

  it('draws the strip plot once the saved rows are loaded', async () => {
    const { fixture, text } = await render(result(1, true));
    expect(text('plots-stale')).toBeNull();
    expect((fixture.nativeElement as HTMLElement).querySelector('[data-testid="plot-strip"] canvas')).not.toBeNull();
  });

  it('refuses results of another kind in words', async () => {
    TestBed.configureTestingModule({ providers: [...provideTestHttp(), noAnimations, SpecimensStore] });
    const fixture = TestBed.createComponent(VerifyFindings);
    fixture.componentRef.setInput('study', STUDY);
    fixture.componentRef.setInput('analysis', ANALYSIS);
    fixture.componentRef.setInput('results', { kind: 'interval' });
    await fixture.whenStable();
    httpController().expectOne('/api/v1/studies/12/specimens').flush({ version: 3, rows: [] });
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('not those of a reference-interval verification');
  });
});
