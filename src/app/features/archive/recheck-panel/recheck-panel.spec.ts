import { TestBed } from '@angular/core/testing';
import type { IntegrityReport, ReproduceReport } from '@shared/schemas';
import { apiError, httpController, provideTestHttp } from '../../../../testing/http';
import { RecheckPanel } from './recheck-panel';

const integrity: IntegrityReport = {
  studyId: 5, passed: false, checkedAt: '2026-07-01T12:00:09Z',
  checks: [
    { name: 'Content hash', passed: true, detail: 'The rows, settings and results still hash to abc, as signed.' },
    { name: 'Signed PDF', passed: false, detail: "The PDF's bytes hash to def, not to the recorded abc." },
  ],
};

const reproduce: ReproduceReport = {
  studyId: 5, analysisId: 9, identical: false, storedEngine: 'engine 1.0.0', currentEngine: 'engine 1.1.0', sameEngine: false, fieldsCompared: 120,
  differences: [{ path: 'decisionLevels[0].bias.estimate', stored: 0.12, recomputed: 0.13 }, { path: 'notes', stored: null, recomputed: ['x'] }],
  summary: '2 of 120 result fields differ: the engine changed from engine 1.0.0 to engine 1.1.0.',
};

async function setUp(signed = true) {
  TestBed.configureTestingModule({ providers: provideTestHttp() });
  const fixture = TestBed.createComponent(RecheckPanel);
  fixture.componentRef.setInput('studyId', 5);
  fixture.componentRef.setInput('signed', signed);
  await fixture.whenStable();
  const el = fixture.nativeElement as HTMLElement;
  const q = (id: string) => el.querySelector(`[data-testid="${id}"]`) as HTMLElement;
  const click = async (id: string) => {
    (q(id) as HTMLButtonElement).click();
    await fixture.whenStable();
  };
  return { fixture, el, q, click };
}

describe('RecheckPanel', () => {
  afterEach(() => httpController().verify());

  it('posts the integrity check and shows each check passed or failed in words, with icons', async () => {
    const { fixture, q, click } = await setUp();
    await click('check-integrity');
    const req = httpController().expectOne('/api/v1/studies/5/integrity-check');
    expect(req.request.method).toBe('POST');
    expect((q('check-integrity') as HTMLButtonElement).disabled).toBe(true);
    req.flush(integrity);
    await fixture.whenStable();
    expect(q('integrity-outcome').textContent).toContain('Failed. 1 of 2 checks failed');
    expect(q('integrity-outcome').textContent).toContain('report');
    const ok = q('check-Content hash');
    const bad = q('check-Signed PDF');
    expect(ok.textContent).toContain('Content hash: passed');
    expect(ok.querySelector('mat-icon')?.textContent).toBe('check_circle');
    expect(bad.textContent).toContain('Signed PDF: failed');
    expect(bad.textContent).toContain('not to the recorded abc');
    expect(bad.querySelector('mat-icon')?.textContent).toBe('cancel');
    expect(q('integrity').textContent).toContain('Checked 2026-07-01 12:00:09 UTC (UTC+00:00).');
  });

  it('shows a passing re-run in words and no table of differences', async () => {
    const { fixture, q, click } = await setUp();
    await click('reproduce-results');
    httpController().expectOne({ method: 'POST', url: '/api/v1/studies/5/reproduce' }).flush({ ...reproduce, identical: true, differences: [], sameEngine: true, summary: 'All 120 result fields are identical.' });
    await fixture.whenStable();
    expect(q('reproduce-outcome').textContent).toContain('Passed. Re-running the analysis gave identical results in all 120 result fields.');
    expect(q('differences')).toBeNull();
  });

  it('lists the fields that differ as path, stored and recomputed', async () => {
    const { fixture, q, click } = await setUp();
    await click('reproduce-results');
    httpController().expectOne('/api/v1/studies/5/reproduce').flush(reproduce);
    await fixture.whenStable();
    expect(q('reproduce-outcome').textContent).toContain('Failed. Re-running the analysis gave different values in 2 of 120 result fields.');
    expect(q('reproduce').textContent).toContain('Stored with engine engine 1.0.0; re-run with engine 1.1.0, a different version.');
    const rows = [...q('differences').querySelectorAll('tr.mat-mdc-row')].map((tr) => [...tr.querySelectorAll('td')].map((td) => td.textContent?.trim()));
    expect(rows).toEqual([
      ['decisionLevels[0].bias.estimate', '0.12', '0.13'],
      ['notes', '(none)', '["x"]'],
    ]);
  });

  it('shows the server’s words when a re-check is refused', async () => {
    const { fixture, q, click } = await setUp();
    await click('reproduce-results');
    httpController().expectOne('/api/v1/studies/5/reproduce').flush(apiError('This study has no finished analysis to reproduce'), { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    expect(q('reproduce').querySelector('[data-testid="banner"]')?.textContent).toContain('This study has no finished analysis to reproduce');
    expect(q('reproduce-outcome')).toBeNull();
  });

  it('offers no integrity check for a study without a signature', async () => {
    const { q } = await setUp(false);
    expect((q('check-integrity') as HTMLButtonElement).disabled).toBe(true);
    expect(q('integrity').textContent).toContain('Only a signed study has a signature to check against.');
  });
});
