import { TestBed } from '@angular/core/testing';
import type { ReleaseIntegrityReport } from '@shared/schemas';
import { httpController, provideTestHttp } from '../../../../testing/http';
import { boardRequirement } from '../release-fixtures.testing';
import { ReleaseIntegrity, releaseIntegrityOutcome } from './release-integrity';

const check = (name: string, passed = true) => ({ name, passed, detail: `${name} ${passed ? 'matches' : 'does not match'} what was signed.` });
const report = (over: Partial<ReleaseIntegrityReport> = {}): ReleaseIntegrityReport => ({
  releaseId: 7, passed: true, checkedAt: '2026-07-01T12:00:09Z',
  checks: [check('Release content hash'), check('Release PDF')],
  components: [{ requirement: 'comparison', studyId: 41, passed: true, checks: [check('Content hash'), check('Signed PDF')] }],
  ...over,
});

describe('releaseIntegrityOutcome', () => {
  it('passes only when the release’s checks and every component study’s pass', () => {
    expect(releaseIntegrityOutcome(report())).toEqual(expect.objectContaining({ passed: true, word: 'Passed', headline: 'The release and its 1 component study are as they were signed.' }));
    const broken = report({
      passed: false,
      components: [{ requirement: 'comparison', studyId: 41, passed: false, checks: [check('Content hash', false)] }],
    });
    expect(releaseIntegrityOutcome(broken)).toEqual(expect.objectContaining({ passed: false, word: 'Failed' }));
    expect(releaseIntegrityOutcome(broken).headline).toContain('0 checks of the release and 1 component study failed');
    // A failed check counts even if the server's summary says passed.
    expect(releaseIntegrityOutcome(report({ checks: [check('Release PDF', false)] })).passed).toBe(false);
  });
});

describe('ReleaseIntegrity', () => {
  afterEach(() => httpController().verify());

  it('re-checks a signed release and shows each check and each component study’s checks', async () => {
    TestBed.configureTestingModule({ providers: provideTestHttp() });
    const fixture = TestBed.createComponent(ReleaseIntegrity);
    fixture.componentRef.setInput('releaseId', 7);
    fixture.componentRef.setInput('signed', true);
    fixture.componentRef.setInput('requirements', [boardRequirement()]);
    let checked = 0;
    fixture.componentInstance.checked.subscribe(() => checked++);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    (el.querySelector('[data-testid="release-integrity-check"]') as HTMLButtonElement).click();
    await fixture.whenStable();
    httpController().expectOne({ method: 'POST', url: '/api/v1/releases/7/integrity-check' }).flush(report({
      passed: false, checks: [check('Release content hash'), check('Release PDF', false)],
    }));
    await fixture.whenStable();
    expect(el.querySelector('[data-testid="release-integrity-outcome"]')?.textContent).toContain('Failed.');
    expect(el.querySelector('[data-testid="check-Release PDF"]')?.textContent).toContain('Release PDF: failed');
    expect(el.querySelector('[data-testid="integrity-component-41"]')?.textContent).toContain('Comparison with the current method · study 41: passed');
    expect(el.querySelector('[data-testid="check-Signed PDF"]')?.textContent).toContain('Signed PDF: passed');
    expect(checked).toBe(1);
  });

  it('offers no re-check before the release is signed', async () => {
    TestBed.configureTestingModule({ providers: provideTestHttp() });
    const fixture = TestBed.createComponent(ReleaseIntegrity);
    fixture.componentRef.setInput('releaseId', 7);
    fixture.componentRef.setInput('signed', false);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    expect((el.querySelector('[data-testid="release-integrity-check"]') as HTMLButtonElement).disabled).toBe(true);
    expect(el.textContent).toContain('Only a signed release has a signature to check against.');
  });
});
