import { TestBed } from '@angular/core/testing';
import { Router } from '@angular/router';
import type { Release, Role } from '@shared/schemas';
import { apiError, httpController, noAnimations, provideTestHttp } from '../../../../testing/http';
import { provideSession, restoreSession, sessionUser } from '../../../../testing/session-users';
import { boardRequirement, componentStudy, dueItem, release } from '../release-fixtures.testing';
import { ReleaseBoardPage } from './release-board-page';

const pause = (ms = 0) => new Promise((resolve) => setTimeout(resolve, ms));

async function open(roles: Role[], answer: Release = release()) {
  TestBed.configureTestingModule({ providers: [...provideTestHttp(), noAnimations, ...provideSession(sessionUser(roles, 'Dr Mara Quist'))] });
  await restoreSession();
  const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
  const fixture = TestBed.createComponent(ReleaseBoardPage);
  fixture.componentRef.setInput('id', '7');
  await fixture.whenStable();
  httpController().expectOne({ method: 'GET', url: '/api/v1/releases/7' }).flush(answer);
  await fixture.whenStable();
  httpController().expectOne('/api/v1/releases/7/history').flush([]);
  await fixture.whenStable();
  const el = fixture.nativeElement as HTMLElement;
  const q = (id: string) => el.querySelector(`[data-testid="${id}"]`) as HTMLElement | null;
  const inDialog = (id: string) => document.querySelector(`mat-dialog-container [data-testid="${id}"]`) as HTMLElement | null;
  const click = async (target: HTMLElement | null) => {
    expect(target).not.toBeNull();
    target!.click();
    await fixture.whenStable();
    await pause();
    await fixture.whenStable();
  };
  const type = async (target: HTMLElement | null, value: string) => {
    const input = target as HTMLInputElement;
    input.value = value;
    input.dispatchEvent(new Event('input'));
    await fixture.whenStable();
  };
  return { fixture, el, q, inDialog, click, type, navigate };
}

describe('ReleaseBoardPage', () => {
  afterEach(() => {
    httpController().verify();
    document.querySelectorAll('.cdk-overlay-container').forEach((c) => (c.innerHTML = ''));
  });

  it('shows the release, the caution and each requirement with its status in words and an icon, its study or “missing”', async () => {
    const { q } = await open(['technologist']);
    expect(q('release-title')?.textContent).toBe('Glucose on chemistry line 2');
    expect(q('release-change')?.textContent).toContain('New measuring system');
    expect(q('release-state')?.textContent).toContain('Open');
    expect(q('release-state')?.textContent).toContain('1 of 2 met');
    expect(q('release-caution')?.textContent).toContain('decision support');
    expect(q('requirement-status-comparison')?.textContent?.trim()).toBe('check_circleMet');
    expect(q('requirement-status-precision')?.textContent?.trim()).toBe('radio_button_uncheckedMissing');
    expect(q('requirement-study-comparison')?.textContent).toContain('Within the goal');
    expect(q('requirement-study-comparison')?.textContent).toContain('GLU-7Q4M-2K9P');
    expect(q('requirement-study-comparison')?.textContent).toContain('Accepted for patient testing');
    expect(q('requirement-study-link-comparison')?.getAttribute('href')).toBe('/studies/41/review');
    expect(q('requirement-missing-precision')?.textContent).toContain('No study meets it yet.');
    expect(q('release-pdf')?.textContent).toContain('Preview PDF');
    expect(q('release-pdf')?.getAttribute('href')).toBe('/api/v1/releases/7/report.pdf');
  });

  it('opens a draft component study at its Setup', async () => {
    const draft = componentStudy({ id: 52, state: 'draft', verdictWord: null, signedAt: null, signerName: null, meaning: null, verificationCode: null });
    const { q } = await open(['technologist'], release({
      requirements: [boardRequirement({ status: 'in-progress', study: draft, linked: [draft] })],
    }));
    expect(q('requirement-study-link-comparison')?.getAttribute('href')).toBe('/studies/52/setup');
    expect(q('requirement-status-comparison')?.textContent).toContain('In progress');
    expect(q('requirement-study-comparison')?.textContent).toContain('No verdict yet');
  });

  it('lets a technologist start, link and unlink studies, but neither waive nor sign', async () => {
    const { q } = await open(['technologist']);
    expect(q('start-precision')).not.toBeNull();
    expect(q('link-precision')).not.toBeNull();
    expect(q('unlink-comparison-41')).not.toBeNull();
    expect(q('start-comparison')).toBeNull();
    expect(q('waive-precision')).toBeNull();
    expect(q('sign-panel')).toBeNull();
    expect(q('release-awaits')?.textContent).toContain('A director signs this release once every requirement is met');
    expect(q('release-integrity')).toBeNull();
  });

  it('lets a director waive what is not met and shows the sign panel with what blocks it', async () => {
    const { q } = await open(['director']);
    expect(q('waive-precision')).not.toBeNull();
    expect(q('waive-comparison')).toBeNull();
    expect(q('sign-panel')).not.toBeNull();
    expect(q('release-blockers')?.textContent).toContain('“Precision” has no signed study and is not waived.');
    expect((q('sign-release') as HTMLButtonElement).disabled).toBe(true);
    expect(q('release-integrity')).not.toBeNull();
  });

  it('gives the quality officer the record to read and the integrity re-check, and no actions', async () => {
    const { el, q } = await open(['quality']);
    expect(el.querySelectorAll('[data-testid^="start-"], [data-testid^="link-"], [data-testid^="unlink-"], [data-testid^="waive-"]')).toHaveLength(0);
    expect(q('sign-panel')).toBeNull();
    expect(q('release-edit')).toBeNull();
    expect(q('release-integrity')).not.toBeNull();
  });

  it('offers no changes on a decided release', async () => {
    const signed = release({ state: 'released', ready: true, blockers: [] });
    const { el, q } = await open(['director', 'technologist'], signed);
    expect(el.querySelectorAll('[data-testid^="start-"], [data-testid^="link-"], [data-testid^="unlink-"], [data-testid^="waive-"]')).toHaveLength(0);
    expect(q('sign-panel')).toBeNull();
  });

  it('while a release waits for review, still lets studies be linked and requirements waived, but not unlinked', async () => {
    const { q } = await open(['technologist', 'director'], release({ state: 'needs-review', reviewReasons: ['Study 41 was amended.'] }));
    expect(q('start-precision')).not.toBeNull();
    expect(q('link-precision')).not.toBeNull();
    expect(q('waive-precision')).not.toBeNull();
    expect(q('unlink-comparison-41')).toBeNull();
    expect(q('release-edit')).toBeNull();
    expect(q('sign-panel')).not.toBeNull();
  });

  it('starts a study of the one kind a requirement takes and opens its Setup', async () => {
    const { fixture, q, click, navigate } = await open(['technologist']);
    await click(q('start-precision'));
    const req = httpController().expectOne({ method: 'POST', url: '/api/v1/releases/7/studies' });
    expect(req.request.body).toEqual({ requirement: 'precision', start: { kind: 'precision' } });
    const started = componentStudy({ id: 60, kind: 'precision', state: 'draft', title: 'Precision (draft)' });
    const answer = release({ version: 4 });
    answer.requirements[1] = boardRequirement({ key: 'precision', label: 'Precision', kinds: ['precision'], status: 'in-progress', study: started, linked: [started] });
    req.flush(answer);
    await fixture.whenStable();
    httpController().expectOne('/api/v1/releases/7/history').flush([]);
    expect(navigate).toHaveBeenCalledWith(['/studies', 60, 'setup']);
  });

  it('asks which kind when several kinds meet a requirement', async () => {
    const { q, click } = await open(['director'], release({
      requirements: [boardRequirement({ key: 'range', label: 'Range', kinds: ['reportable-range', 'precision'] })],
    }));
    await click(q('start-range'));
    const choice = document.querySelector('[data-testid="start-range-kind-reportable-range"]') as HTMLElement;
    expect(choice.textContent).toContain('Reportable range');
    expect(document.querySelector('[data-testid="start-range-kind-precision"]')?.textContent).toContain('Precision verification');
    await click(choice);
    const req = httpController().expectOne({ method: 'POST', url: '/api/v1/releases/7/studies' });
    expect(req.request.body).toEqual({ requirement: 'range', start: { kind: 'reportable-range' } });
    req.flush(apiError('This release is no longer open'), { status: 409, statusText: 'Conflict' });
  });

  it('shows the server’s words when a change is refused', async () => {
    const { fixture, q, click } = await open(['technologist']);
    await click(q('start-precision'));
    httpController().expectOne('/api/v1/releases/7/studies').flush(apiError('This release is no longer open'), { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    expect(q('banner')?.textContent).toContain('This release is no longer open');
  });

  it('links a study picked from the analyte’s studies of the kind required, leaving out linked and superseded ones', async () => {
    const { fixture, q, inDialog, click } = await open(['technologist']);
    await click(q('link-precision'));
    const list = httpController().expectOne((r) => r.url === '/api/v1/studies');
    expect(list.request.params.get('analyteId')).toBe('3');
    expect(list.request.params.get('kind')).toBe('precision');
    const item = (id: number, over = {}) => ({
      id, kind: 'precision', title: `Precision ${id}`, analyte: { id: 3, name: 'Glucose' }, instruments: 'Chemistry line 2', n: 25, state: 'signed',
      superseded: false, findings: 'current', updatedAt: '2026-05-01T00:00:00Z', createdBy: { id: 8, name: 'Tomas Reyes' }, ...over,
    });
    list.flush({ items: [item(70), item(41), item(71, { superseded: true }), item(72, { kind: 'method-comparison' })], total: 4 });
    await fixture.whenStable();
    expect(inDialog('link-study-70')).not.toBeNull();
    expect(inDialog('link-study-41')).toBeNull();
    expect(inDialog('link-study-71')).toBeNull();
    expect(inDialog('link-study-72')).toBeNull();
    await click(inDialog('link-confirm'));
    expect(inDialog('link-error')?.textContent).toBe('Choose a study to link.');
    await click(inDialog('link-study-70')!.querySelector('input'));
    await click(inDialog('link-confirm'));
    const req = httpController().expectOne({ method: 'POST', url: '/api/v1/releases/7/studies' });
    expect(req.request.body).toEqual({ requirement: 'precision', studyId: 70 });
    req.flush(release({ version: 4, met: 2 }));
    await fixture.whenStable();
    httpController().expectOne('/api/v1/releases/7/history').flush([]);
    await fixture.whenStable();
    expect(q('release-state')?.textContent).toContain('2 of 2 met');
  });

  it('asks before unlinking a study, then unlinks it', async () => {
    const { fixture, q, click } = await open(['technologist']);
    await click(q('unlink-comparison-41'));
    expect(document.querySelector('mat-dialog-container')?.textContent).toContain('Unlink study 41?');
    await click(document.querySelector('mat-dialog-container [data-testid="confirm"]'));
    httpController().expectOne({ method: 'DELETE', url: '/api/v1/releases/7/studies/41' }).flush(release({ version: 4 }));
    await fixture.whenStable();
    httpController().expectOne('/api/v1/releases/7/history').flush([]);
  });

  it('waives a requirement only with a reason, then shows the waiver', async () => {
    const { fixture, q, inDialog, click, type } = await open(['director']);
    await click(q('waive-precision'));
    await click(inDialog('waive-confirm'));
    httpController().expectNone('/api/v1/releases/7/waivers');
    expect(inDialog('waive-reason-error')?.textContent).toBe('A reason is required.');
    await type(inDialog('waive-reason'), '  The previous system’s precision study still applies  ');
    await click(inDialog('waive-confirm'));
    const req = httpController().expectOne({ method: 'POST', url: '/api/v1/releases/7/waivers' });
    expect(req.request.body).toEqual({ requirement: 'precision', reason: 'The previous system’s precision study still applies' });
    const waived = release({ version: 4, ready: true, blockers: [] });
    waived.requirements[1] = boardRequirement({
      key: 'precision', label: 'Precision', kinds: ['precision'], status: 'waived',
      waiver: { requirement: 'precision', reason: 'The previous system’s precision study still applies', by: { id: 7, name: 'Dr Mara Quist' }, at: '2026-05-05T09:00:00Z' },
    });
    req.flush(waived);
    await fixture.whenStable();
    httpController().expectOne('/api/v1/releases/7/history').flush([]);
    await fixture.whenStable();
    expect(q('requirement-status-precision')?.textContent).toContain('Waived');
    expect(q('requirement-waiver-precision')?.textContent).toContain('Waived by Dr Mara Quist');
    expect(q('requirement-waiver-precision')?.textContent).toContain('still applies');
    expect(q('requirement-missing-precision')).toBeNull();
    expect((q('sign-release') as HTMLButtonElement).disabled).toBe(false);
  });

  it('warns when a released method needs review, with the reasons', async () => {
    const { q } = await open(['quality'], release({ state: 'needs-review', reviewReasons: ['Study 41 was amended after the release was signed.'] }));
    expect(q('release-review-reasons')?.textContent).toContain('Study 41 was amended after the release was signed.');
    expect(q('release-state')?.textContent).toContain('Needs review');
  });

  it('lists the signature and calls the PDF the signed one', async () => {
    const { q } = await open(['director'], release({
      state: 'released', ready: true, blockers: [],
      signatures: [{
        id: 3, meaning: 'released', meaningWords: 'Released for patient testing', signerName: 'Dr Mara Quist', signedAt: '2026-05-06T14:00:00Z',
        goLiveDate: '2026-05-11', comment: 'Go', contentHash: 'b'.repeat(64), verificationCode: 'REL-9X2A-77QD', pdfSha256: 'c'.repeat(64),
      }],
    }));
    expect(q('release-signature-3')?.textContent).toContain('Released for patient testing');
    expect(q('release-signature-3')?.textContent).toContain('2026-05-11');
    expect(q('release-verification-code')?.textContent).toBe('REL-9X2A-77QD');
    expect(q('release-pdf')?.textContent).toContain('Signed PDF');
  });

  it('lets a director move a due date with a reason', async () => {
    const item = dueItem({ id: 12, dueDate: '2027-05-11', status: 'later' });
    const { fixture, q, inDialog, click, type } = await open(['director'], release({ state: 'released', due: [item] }));
    expect(q('due-item')?.textContent).toContain('Yearly comparison');
    await click(q('edit-due-12'));
    await type(inDialog('due-new-date'), '2027-06-30');
    await click(inDialog('due-date-save'));
    httpController().expectNone('/api/v1/due/12');
    expect(inDialog('due-reason-error')?.textContent).toBe('A reason is required.');
    await type(inDialog('due-reason'), 'Instrument service in May');
    await click(inDialog('due-date-save'));
    const req = httpController().expectOne({ method: 'PATCH', url: '/api/v1/due/12' });
    expect(req.request.body).toEqual({ version: 1, dueDate: '2027-06-30', reason: 'Instrument service in May' });
    req.flush({ ...item, dueDate: '2027-06-30', version: 2 });
    await fixture.whenStable();
    httpController().expectOne('/api/v1/releases/7').flush(release({ state: 'released', due: [{ ...item, dueDate: '2027-06-30', version: 2 }] }));
    httpController().expectOne('/api/v1/releases/7/history').flush([]);
  });
});
