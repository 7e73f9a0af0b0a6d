import { TestBed } from '@angular/core/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { noAnimations } from '../../../../../../testing/http';
import { ExcludeDialog } from './exclude-dialog';

async function open() {
  const close = jest.fn();
  TestBed.configureTestingModule({
    providers: [noAnimations, { provide: MAT_DIALOG_DATA, useValue: { row: 'row 17 (VH-017)' } }, { provide: MatDialogRef, useValue: { close } }],
  });
  const fixture = TestBed.createComponent(ExcludeDialog);
  await fixture.whenStable();
  const el = fixture.nativeElement as HTMLElement;
  const confirm = el.querySelector('[data-testid="exclude-confirm"]') as HTMLButtonElement;
  const reason = el.querySelector('[data-testid="exclude-reason"]') as HTMLTextAreaElement;
  return { fixture, el, close, confirm, reason };
}

describe('ExcludeDialog', () => {
  it('names the row and refuses to exclude without a reason', async () => {
    const { fixture, el, close, confirm, reason } = await open();
    expect(el.textContent).toContain('Exclude row 17 (VH-017)');
    reason.value = '   ';
    reason.dispatchEvent(new Event('input'));
    confirm.click();
    await fixture.whenStable();
    expect(close).not.toHaveBeenCalled();
    expect(el.textContent).toContain('A reason is required.');
  });

  it('closes with the reason, trimmed', async () => {
    const { close, confirm, reason } = await open();
    reason.value = '  clotted on the candidate run ';
    reason.dispatchEvent(new Event('input'));
    confirm.click();
    expect(close).toHaveBeenCalledWith('clotted on the candidate run');
  });
});
