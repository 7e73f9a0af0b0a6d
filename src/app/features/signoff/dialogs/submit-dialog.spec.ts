import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { noAnimations } from '../../../../testing/http';
import { SubmitData, SubmitDialog } from './submit-dialog';

async function open(note = '') {
  const close = jest.fn();
  TestBed.configureTestingModule({
    providers: [noAnimations, { provide: MAT_DIALOG_DATA, useValue: { title: 'Creatinine: new analyser', note } satisfies SubmitData }, { provide: MatDialogRef, useValue: { close } }],
  });
  const fixture = TestBed.createComponent(SubmitDialog);
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const field = () => loader.getHarness(MatInputHarness.with({ selector: '[data-testid="submit-note"]' }));
  const confirm = async () => {
    await (await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="submit-confirm"]' }))).click();
    await fixture.whenStable();
  };
  const text = (id: string) => (fixture.nativeElement as HTMLElement).querySelector(`[data-testid="${id}"]`)?.textContent?.trim() ?? '';
  return { fixture, close, field, confirm, text };
}

describe('SubmitDialog', () => {
  it('closes with the trimmed note, or an empty one when none is written', async () => {
    const first = await open();
    await first.confirm();
    expect(first.close).toHaveBeenCalledWith({ note: '' });
    TestBed.resetTestingModule();
    const second = await open();
    await (await second.field()).setValue('\n  Please look at the high decision level first.  ');
    expect(second.text('submit-note-count')).toBe('45 / 1000');
    await second.confirm();
    expect(second.close).toHaveBeenCalledWith({ note: 'Please look at the high decision level first.' });
  });

  it('refuses a note over 1,000 characters with the server’s words and stays open', async () => {
    const { field, confirm, close, text } = await open();
    await (await field()).setValue('z'.repeat(1001));
    await confirm();
    expect(text('submit-note-error')).toBe('Keep the note for the director to 1,000 characters or fewer');
    expect(close).not.toHaveBeenCalled();
  });

  it('offers again the note of a refused submission', async () => {
    const { field } = await open('Rows 12 and 31 were run again.');
    expect(await (await field()).getValue()).toBe('Rows 12 and 31 were run again.');
  });
});
