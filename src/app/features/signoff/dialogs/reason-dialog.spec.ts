import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { apiError, httpController, noAnimations, provideTestHttp } from '../../../../testing/http';
import { ReasonData, ReasonDialog } from './reason-dialog';

async function open(step: ReasonData['step']) {
  const close = jest.fn();
  TestBed.configureTestingModule({
    providers: [
      ...provideTestHttp(), noAnimations,
      { provide: MAT_DIALOG_DATA, useValue: { step, studyId: 9, title: 'Creatinine: new analyser' } satisfies ReasonData },
      { provide: MatDialogRef, useValue: { close } },
    ],
  });
  const fixture = TestBed.createComponent(ReasonDialog);
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const el = fixture.nativeElement as HTMLElement;
  const write = async (text: string) => (await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="reason-text"]' }))).setValue(text);
  const confirm = async () => {
    await (await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="reason-confirm"]' }))).click();
    await fixture.whenStable();
  };
  const text = (selector: string) => el.querySelector(selector)?.textContent?.trim() ?? '';
  return { fixture, el, close, write, confirm, text };
}

describe('ReasonDialog (return)', () => {
  afterEach(() => httpController().verify());

  it('requires a comment: blank or spaces are refused and nothing is sent', async () => {
    const { write, confirm, text, close } = await open('return');
    await confirm();
    expect(text('[data-testid="reason-error"]')).toBe('Comment for the technologist is required.');
    await write('    ');
    await confirm();
    httpController().expectNone('/api/v1/studies/9/return');
    expect(close).not.toHaveBeenCalled();
  });

  it('sends the trimmed comment and closes with the returned draft', async () => {
    const { el, write, confirm, close } = await open('return');
    expect(el.textContent).toContain('Return to technologist');
    await write('  Add five specimens above 800 µmol/L ');
    await confirm();
    const req = httpController().expectOne({ method: 'POST', url: '/api/v1/studies/9/return' });
    expect(req.request.body).toEqual({ comment: 'Add five specimens above 800 µmol/L' });
    req.flush({ id: 9, state: 'draft', returnComment: 'Add five specimens above 800 µmol/L' });
    expect(close).toHaveBeenCalledWith(expect.objectContaining({ id: 9, state: 'draft' }));
  });

  it('shows a refusal in words and stays open', async () => {
    const { fixture, write, confirm, text, close } = await open('return');
    await write('Check row 14');
    await confirm();
    httpController().expectOne('/api/v1/studies/9/return').flush(apiError('This study is not awaiting sign-off'), { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    expect(text('[data-testid="banner"] span')).toBe('This study is not awaiting sign-off');
    expect(close).not.toHaveBeenCalled();
  });
});

describe('ReasonDialog (amend)', () => {
  afterEach(() => httpController().verify());

  it('requires a reason and sends it to the amendment, closing with the new draft', async () => {
    const { write, confirm, text, close } = await open('amend');
    await confirm();
    expect(text('[data-testid="reason-error"]')).toBe('Reason for the amendment is required.');
    await write('A transcription error in row 3');
    await confirm();
    const req = httpController().expectOne({ method: 'POST', url: '/api/v1/studies/9/amend' });
    expect(req.request.body).toEqual({ reason: 'A transcription error in row 3' });
    req.flush({ id: 31, state: 'draft', supersedesId: 9 }, { status: 201, statusText: 'Created' });
    expect(close).toHaveBeenCalledWith(expect.objectContaining({ id: 31 }));
  });
});
