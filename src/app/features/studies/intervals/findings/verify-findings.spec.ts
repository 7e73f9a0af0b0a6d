import { TestBed } from '@angular/core/testing';
import type { Analysis, SpecimenRow, Study } from '@shared/schemas';
import { StudySettings } from '@shared/schemas';
import { httpController, noAnimations, provideTestHttp } from '../../../../../testing/http';
import { SpecimensStore } from '../../specimens/specimens-store';
import { intervalEstablishMeta } from '@shared/kinds/interval-establish/meta';
import { CAUTION } from '@shared/stats/comparison-types';
import { outsideStated, verifyInterval } from '@shared/stats/verify-interval';
import type { VerifyResult } from './interval-result';
import { VerifyFindings } from './verify-findings';

const STUDY = {
  id: 12, kind: 'interval-verify', title: 'Potassium: stated interval', analyte: { id: 4, name: 'Potassium' }, analyteUnit: 'mmol/L',
  settings: StudySettings.parse({ unit: 'mmol/L', decimals: 1, statedLower: 3.5, statedUpper: 5.1, statedSource: "Manufacturer's insert, edition 7" }),
  version: 3, state: 'draft', findings: 'current',
} as unknown as Study;
const ANALYSIS = { id: 40, studyId: 12, state: 'done', current: true } as Analysis;

const STATED = { lower: 3.5, upper: 5.1 };
/** 20 potassium values inside 3.5–5.1 (4.0 to 4.95); `beyond` replaces the first ones with values outside. */
const values = (...beyond: number[]): number[] => Array.from({ length: 20 }, (_, i) => beyond[i] ?? Number((4 + i * 0.05).toFixed(2)));

/**
 * The results as the app stores them for these values: the engine's count (verifyInterval, the function the
 * server's analysis runs) with what server/kinds/interval-verify adds. The source of the stated interval is a
 * record-only setting, no input of the engine, so the stored results carry an empty one (the API test in
 * server/analyses/interval-analyses.spec.ts pins that on a real run); the findings must name it anyway.
 */
function stored(vs: number[]): VerifyResult {
  const engine = verifyInterval(vs, STATED, 1);
  return {
    ...engine, excludedCount: 0, outsidePositions: vs.flatMap((v, i) => (outsideStated(v, STATED) ? [i + 1] : [])),
    stated: { ...STATED, source: '' }, caution: CAUTION,
  };
}

function row(position: number, value: number): SpecimenRow {
  return {
    position, label: `K-${position}`, comparative: null, candidate: null, value, comparativeText: null, candidateText: null,
    valueText: value.toFixed(2), sex: null, ageBand: null, excluded: false, exclusionReason: null, note: '', uploadId: null,
  };
}

async function render(results: VerifyResult, vs: number[] = values(), study: Study = STUDY) {
  TestBed.configureTestingModule({ providers: [...provideTestHttp(), noAnimations, SpecimensStore] });
  const fixture = TestBed.createComponent(VerifyFindings);
  fixture.componentRef.setInput('study', study);
  fixture.componentRef.setInput('analysis', ANALYSIS);
  fixture.componentRef.setInput('results', results);
  await fixture.whenStable();
  httpController().expectOne('/api/v1/studies/12/specimens').flush({ version: 3, rows: vs.map((v, i) => row(i + 1, v)) });
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
    const vs = values(3.4);
    const r = stored(vs);
    expect(r).toMatchObject({ n: 20, outside: 1, below: 1, above: 0, allowedOutside: 2, accepted: true });
    const { text } = await render(r, vs);
    expect(text('verify-acceptance')).toBe('Accepted: 1 of 20 outside; at most 2 allowed.');
    expect(text('verify-outside')).toBe('1 below and 0 above the stated interval 3.5 to 5.1.');
    // P(X ≥ 1), X ~ Binomial(20, 0.05) = 1 − 0.95^20 = 0.642 (closed form).
    expect(text('verify-probability')).toBe('0.642');
    // P(X ≤ 2), X ~ Binomial(20, 0.10) = 0.677 (closed form): "68% of the time".
    expect(text('verify-power')).toContain('68% of the time');
    expect(text('verify-advice')).toBeNull();
  });

  it('gives the advice to test 20 more when the interval is not accepted', async () => {
    const vs = values(3.4, 5.2, 5.6);
    const r = stored(vs);
    expect(r).toMatchObject({ outside: 3, below: 1, above: 2, accepted: false });
    const { text } = await render(r, vs);
    expect(text('verify-acceptance')).toBe('Not accepted: 3 of 20 outside; at most 2 allowed.');
    expect(text('verify-outside')).toBe('1 below and 2 above the stated interval 3.5 to 5.1.');
    expect(text('verify-advice')).toContain('test 20 more');
    expect(text('verify-advice')).toContain('establish the interval locally');
  });

  it("names the stated interval's source the study gives, on results stored as the analysis made them (no source in them)", async () => {
    const r = stored(values());
    expect(r.stated.source).toBe('');
    const { text } = await render(r);
    expect(text('verify-source')).toBe("Manufacturer's insert, edition 7");
  });

  it("names the source as it stands after a record-only change, not an older one the served results may hold", async () => {
    const changed = { ...STUDY, settings: { ...STUDY.settings, statedSource: "Manufacturer's insert, edition 8" } } as Study;
    const { text } = await render({ ...stored(values()), stated: { ...STATED, source: "Manufacturer's insert, edition 7" } }, values(), changed);
    expect(text('verify-source')).toBe("Manufacturer's insert, edition 8");
  });

  it('shows a dash only when no source is given at all', async () => {
    const none = { ...STUDY, settings: { ...STUDY.settings, statedSource: '' } } as Study;
    const { text } = await render(stored(values()), values(), none);
    expect(text('verify-source')).toBe('—');
  });

  it('draws the strip plot once the saved rows are loaded', async () => {
    const { fixture, text } = await render(stored(values(3.4)), values(3.4));
    expect(text('plots-stale')).toBeNull();
    expect((fixture.nativeElement as HTMLElement).querySelector('[data-testid="plot-strip"] canvas')).not.toBeNull();
  });

  it('refuses results of another kind in words', async () => {
    TestBed.configureTestingModule({ providers: [...provideTestHttp(), noAnimations, SpecimensStore] });
    const fixture = TestBed.createComponent(VerifyFindings);
    fixture.componentRef.setInput('study', STUDY);
    fixture.componentRef.setInput('analysis', ANALYSIS);
    fixture.componentRef.setInput('results', { kind: intervalEstablishMeta.resultKind });
    await fixture.whenStable();
    httpController().expectOne('/api/v1/studies/12/specimens').flush({ version: 3, rows: [] });
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('not those of a reference-interval verification');
  });
});
