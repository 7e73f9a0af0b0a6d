import { intervalEstablishMeta } from '@shared/kinds/interval-establish/meta';
import { DeferBlockState, DeferBlockBehavior, TestBed } from '@angular/core/testing';
import type { Analysis, Role, SpecimenRow, Study } from '@shared/schemas';
import { Notices } from '../../../../core/notify/notices';
import { httpController, noAnimations, provideTestHttp } from '../../../../../testing/http';
import { withoutViewportEntries } from '../../../../../testing/never-intersecting';
import { provideSession, restoreSession, sessionUser } from '../../../../../testing/session-users';
import { doneAnalysis, engineComparison, glucoseFindings, glucoseStudy, specimensAnswer } from '../../../../../testing/engine-findings';
import { SpecimensStore } from '../../specimens/specimens-store';
import { StudyStore } from '../../study/study-store';
import { ComparisonFindings } from './comparison-findings';

/** An element's words, without its icons' ligatures. */
function words(e: Element | null): string | null {
  if (!e) return null;
  const copy = e.cloneNode(true) as Element;
  copy.querySelectorAll('mat-icon').forEach((icon) => icon.remove());
  return copy.textContent!.replace(/\s+/g, ' ').trim();
}

/** The method comparison's Findings panel for `study`, `analysis` and its rows (answered as GET /specimens answers them). */
async function mount(roles: Role[], study: Study, analysis: Analysis, rows: SpecimenRow[]) {
  TestBed.configureTestingModule({
    providers: [...provideTestHttp(), noAnimations, ...provideSession(sessionUser(roles)), StudyStore, SpecimensStore],
    // The plots and the table of pairs wait in their @defer placeholder until a test renders them.
    deferBlockBehavior: DeferBlockBehavior.Manual,
  });
  await restoreSession();
  TestBed.inject(StudyStore).adopt(study);
  const fixture = TestBed.createComponent(ComparisonFindings);
  fixture.componentRef.setInput('study', study);
  fixture.componentRef.setInput('analysis', analysis);
  fixture.componentRef.setInput('results', analysis.results);
  await fixture.whenStable();
  httpController().expectOne('/api/v1/studies/12/specimens').flush(specimensAnswer(rows));
  await fixture.whenStable();
  const el = fixture.nativeElement as HTMLElement;
  const text = (id: string) => words(el.querySelector(`[data-testid="${id}"]`));
  const cells = (selector: string) => Array.from(el.querySelectorAll(`${selector} tbody tr`)).map((tr) => Array.from(tr.children).map((c) => words(c)));
  return { fixture, el, text, cells };
}

describe('ComparisonFindings', () => {
  withoutViewportEntries();
  beforeEach(() => jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null));
  afterEach(() => {
    httpController().verify();
    jest.restoreAllMocks();
  });

  it('puts the engine’s verdict first, lists the flagged row with an exclusion offer, and the 40 pairs once drawn', async () => {
    const { rows, results } = glucoseFindings();
    const { fixture, el, text, cells } = await mount(['technologist'], glucoseStudy(), doneAnalysis(results), rows);
    expect(text('verdict-overall')).toBe(
      'Within the allowable bias at 4.0 and 10.0 mmol/L; exceeds it at 20.0 mmol/L. ' +
        'Judged on the 95% CI of the bias that the Passing–Bablok regression of 40 pairs predicts at each level.',
    );
    expect(text('no-exclusions')).toBe('No row is excluded, so the findings already use every row.');
    expect(cells('[data-testid="outliers"]')).toEqual([['17', 'G17', '10.8', '13.2', 'Exclude…']]);
    expect(text('warnings')).toContain('Generalized ESD flags 1 possible outlier in the differences (row 17); exclude only with a documented reason.');
    expect(text('plots-drawing')).toBe('Drawing the plots and the table of pairs…');
    const [deferred] = await fixture.getDeferBlocks();
    await deferred.render(DeferBlockState.Complete);
    await fixture.whenStable();
    expect(el.querySelectorAll('[data-testid="pairs-table"] tbody tr')).toHaveLength(40);
    expect(text('plots-drawing')).toBeNull();
  });

  it('excludes the flagged row with its reason, saves the rows at once and says to run again', async () => {
    const { rows, results } = glucoseFindings();
    const { fixture, cells } = await mount(['technologist'], glucoseStudy(), doneAnalysis(results), rows);
    (fixture.nativeElement.querySelector('[data-testid="exclude-17"]') as HTMLButtonElement).click();
    await fixture.whenStable();
    const reason = document.querySelector('mat-dialog-container [data-testid="exclude-reason"]') as HTMLTextAreaElement;
    reason.value = 'Haemolysed specimen (lab note 2026-11-30)';
    reason.dispatchEvent(new Event('input'));
    (document.querySelector('mat-dialog-container [data-testid="exclude-confirm"]') as HTMLButtonElement).click();
    await fixture.whenStable();
    const put = httpController().expectOne({ method: 'PUT', url: '/api/v1/studies/12/specimens' });
    const sent = put.request.body as { version: number; rows: { label: string; excluded: boolean; exclusionReason: string | null }[] };
    expect(sent.version).toBe(4);
    expect(sent.rows.filter((r) => r.excluded)).toEqual([expect.objectContaining({ label: 'G17', excluded: true, exclusionReason: 'Haemolysed specimen (lab note 2026-11-30)' })]);
    const saved = rows.map((r) => (r.position === 17 ? { ...r, excluded: true, exclusionReason: 'Haemolysed specimen (lab note 2026-11-30)' } : r));
    put.flush(specimensAnswer(saved, 5));
    await fixture.whenStable();
    httpController().expectOne('/api/v1/studies/12').flush(glucoseStudy({ version: 5, findings: 'out-of-date' }));
    await fixture.whenStable();
    expect(TestBed.inject(Notices).message()).toBe('Row 17 is excluded with its reason. Run the analysis again to update the findings.');
    expect(cells('[data-testid="outliers"]')).toEqual([['17', 'G17', '10.8', '13.2', 'Excluded; run again to update']]);
  });

  it('offers no exclusion to a reader without an entering role, nor on findings that are not current', async () => {
    const { rows, results } = glucoseFindings();
    const quality = await mount(['quality'], glucoseStudy(), doneAnalysis(results), rows);
    expect(quality.cells('[data-testid="outliers"]')).toEqual([['17', 'G17', '10.8', '13.2', '']]);
    TestBed.resetTestingModule();
    const stale = await mount(['technologist'], glucoseStudy({ findings: 'out-of-date' }), doneAnalysis(results, { current: false }), rows);
    expect(stale.cells('[data-testid="outliers"]')).toEqual([['17', 'G17', '10.8', '13.2', '']]);
  });

  it('shows the estimates with and without a row the engine left out', async () => {
    const rows = glucoseFindings().rows.map((r) => (r.position === 17 ? { ...r, excluded: true, exclusionReason: 'Haemolysed specimen' } : r));
    const results = engineComparison(rows);
    const { text, el } = await mount(['technologist'], glucoseStudy({ n: 39 }), doneAnalysis(results), rows);
    expect(text('sensitivity-panel')).toContain('One row is excluded; its reason is on the Specimens tab. The findings above leave it out;');
    expect(el.querySelectorAll('[data-testid="sensitivity-panel"] tbody tr').length).toBeGreaterThan(0);
    expect(text('verdict-overall')).toContain('Passing–Bablok regression of 39 pairs');
    expect(el.querySelector('[data-testid="exclude-17"]')).toBeNull();
  });

  it('refuses in words to show results of another kind', async () => {
    const { rows } = glucoseFindings();
    const { el, text } = await mount(['technologist'], glucoseStudy(), doneAnalysis({ kind: intervalEstablishMeta.resultKind, n: 120 }), rows);
    expect(text('banner')).toBe('These results are not those of a method comparison; Parallax cannot show them here.');
    expect(el.querySelector('[data-testid="verdict-panel"]')).toBeNull();
  });
});
