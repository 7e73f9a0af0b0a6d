import { TestBed } from '@angular/core/testing';
import type { Analysis, SpecimenRow, Study } from '@shared/schemas';
import { StudySettings } from '@shared/schemas';
import { analyzeInterval } from '@shared/stats/analyze-interval';
import { Notices } from '../../../../core/notify/notices';
import { httpController, noAnimations, provideTestHttp } from '../../../../../testing/http';
import { provideSession, restoreSession, sessionUser } from '../../../../../testing/session-users';
import { doneAnalysis, glucoseStudy, specimensAnswer } from '../../../../../testing/engine-findings';
import { SpecimensStore } from '../../specimens/specimens-store';
import { StudyStore } from '../../study/study-store';
import { EstablishFindings } from './establish-findings';

const SETTINGS = StudySettings.parse({
  unit: 'µmol/L', decimals: 0, confidenceLevel: 0.9, resamples: 1000, seed: 'h8-interval', partitionFields: ['sex'],
  populationDescription: 'Invented healthy adults for the tests',
});
const STUDY: Study = glucoseStudy({
  id: 14, kind: 'interval-establish', title: 'Creatinine reference interval', analyte: { id: 4, name: 'Creatinine' }, analyteUnit: 'µmol/L',
  settings: SETTINGS, n: 120, instruments: 'Chemistry line 2',
});

/** 120 invented creatinine values (µmol/L), women lower than men; row 60 (CR-060) reads 190, far above the rest. */
function creatinineRows(): SpecimenRow[] {
  return Array.from({ length: 120 }, (_, i) => {
    const sex = i % 2 === 0 ? 'F' : 'M';
    const value = i === 59 ? 190 : Math.round((sex === 'F' ? 62 : 80) + 12 * Math.sin(i * 2.3) + 6 * Math.cos(i * 0.7));
    return {
      position: i + 1, label: `CR-${String(i + 1).padStart(3, '0')}`, comparative: null, candidate: null, value, comparativeText: null,
      candidateText: null, valueText: String(value), sex, ageBand: null, excluded: false, exclusionReason: null, note: '', uploadId: null,
    };
  });
}

/** The establishment the server's worker stores for these rows (server/kinds/interval-establish/index.ts): every row has a value. */
function engineInterval(rows: SpecimenRow[]) {
  const result = analyzeInterval(
    rows.map((r) => ({ value: r.value!, label: r.label, sex: r.sex ?? undefined, excluded: r.excluded, exclusionReason: r.exclusionReason ?? undefined })),
    { resamples: SETTINGS.resamples, seed: SETTINGS.seed, level: SETTINGS.confidenceLevel, method: SETTINGS.intervalMethod, percentiles: SETTINGS.percentiles, partitionFields: SETTINGS.partitionFields, decimals: SETTINGS.decimals },
  );
  return { ...result, outlierPositions: result.outliers };
}

async function render(analysis: Analysis, rows: SpecimenRow[]) {
  TestBed.configureTestingModule({ providers: [...provideTestHttp(), noAnimations, ...provideSession(sessionUser(['technologist'])), SpecimensStore, StudyStore] });
  await restoreSession();
  TestBed.inject(StudyStore).adopt(STUDY);
  const fixture = TestBed.createComponent(EstablishFindings);
  fixture.componentRef.setInput('study', STUDY);
  fixture.componentRef.setInput('analysis', analysis);
  fixture.componentRef.setInput('results', analysis.results);
  await fixture.whenStable();
  httpController().expectOne('/api/v1/studies/14/specimens').flush(specimensAnswer(rows, 4));
  await fixture.whenStable();
  const el = fixture.nativeElement as HTMLElement;
  const text = (id: string) => el.querySelector(`[data-testid="${id}"]`)?.textContent?.replace(/\s+/g, ' ').trim() ?? null;
  return { fixture, el, text };
}

describe('EstablishFindings on the engine’s findings', () => {
  beforeEach(() => jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null));
  afterEach(() => {
    httpController().verify();
    jest.restoreAllMocks();
  });

  it('shows the counts, the partition by sex and the flagged value, and excludes it with its reason', async () => {
    const rows = creatinineRows();
    const results = engineInterval(rows);
    const { fixture, el, text } = await render(doneAnalysis(results, { id: 41, studyId: 14 }), rows);
    expect(text('interval-counts')).toBe('n = 120 analysed of 120 entered; 0 excluded with a reason.');
    expect(text('interval-method')).toMatch(/^Method: Nonparametric/);
    expect(text('partition-sex')).toMatch(/^By sex: separate intervals recommended \(z = /);
    expect(text('warnings')).toContain('Possible outliers flagged at rows 60; exclude only with a documented reason.');
    expect(Array.from(el.querySelectorAll('[data-testid="outliers"] tbody tr')).map((tr) => tr.getAttribute('data-testid'))).toEqual(['outlier-60']);
    const cells = () => Array.from(el.querySelectorAll('[data-testid="outlier-60"] > *')).map((c) => c.textContent!.replace('block', '').trim());
    expect(cells()).toEqual(['60', 'CR-060', '190', "Tukey's fences, Dixon's rule", 'Exclude…']);
    (el.querySelector('[data-testid="exclude-60"]') as HTMLButtonElement).click();
    await fixture.whenStable();
    const reason = document.querySelector('mat-dialog-container [data-testid="exclude-reason"]') as HTMLTextAreaElement;
    reason.value = 'Donor reported strenuous exercise the day before sampling';
    reason.dispatchEvent(new Event('input'));
    (document.querySelector('mat-dialog-container [data-testid="exclude-confirm"]') as HTMLButtonElement).click();
    await fixture.whenStable();
    const put = httpController().expectOne({ method: 'PUT', url: '/api/v1/studies/14/specimens' });
    const sent = (put.request.body as { rows: { label: string; excluded: boolean; exclusionReason: string | null }[] }).rows;
    expect(sent.filter((r) => r.excluded)).toEqual([
      expect.objectContaining({ label: 'CR-060', exclusionReason: 'Donor reported strenuous exercise the day before sampling' }),
    ]);
    put.flush(specimensAnswer(rows.map((r) => (r.position === 60 ? { ...r, excluded: true, exclusionReason: 'Donor reported strenuous exercise the day before sampling' } : r)), 5));
    await fixture.whenStable();
    httpController().expectOne('/api/v1/studies/14').flush({ ...STUDY, version: 5, findings: 'out-of-date' });
    await fixture.whenStable();
    expect(TestBed.inject(Notices).message()).toBe('Row 60 is excluded with its reason. Run the analysis again to update the findings.');
    expect(cells()).toEqual(['60', 'CR-060', '190', "Tukey's fences, Dixon's rule", 'Excluded; run again to update']);
  });

  it('counts the excluded value on the next run and flags nothing more', async () => {
    const rows = creatinineRows().map((r) => (r.position === 60 ? { ...r, excluded: true, exclusionReason: 'Strenuous exercise' } : r));
    const results = engineInterval(rows);
    const { text } = await render(doneAnalysis(results, { id: 42, studyId: 14 }), rows);
    expect(text('interval-counts')).toBe('n = 119 analysed of 120 entered; 1 excluded with a reason.');
    expect(text('no-outliers')).toBe('No value is flagged.');
  });
});
