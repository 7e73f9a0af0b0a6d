import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { FormControl, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { filter, Observable } from 'rxjs';
import { FieldErrorPipe } from '../../../../../ui/field-error';

export interface ExcludeData {
  /** "row 14 (S014)" */
  row: string;
}

/** Asks why a flagged row is to be excluded; closes with the reason, or nothing when cancelled. */
@Component({
  selector: 'app-exclude-dialog',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule, FieldErrorPipe],
  template: `
    <h2 mat-dialog-title>Exclude {{ data.row }}</h2>
    <mat-dialog-content>
      <p>An excluded row stays in the study and its report, with this reason; the findings are shown with and without it.</p>
      <mat-form-field class="full-width">
        <mat-label>Reason for the exclusion</mat-label>
        <textarea matInput rows="3" [formControl]="reason" data-testid="exclude-reason"></textarea>
        <mat-hint>For example a clotted specimen, a mix-up found on review, or a result outside the measuring range.</mat-hint>
        <mat-error>{{ reason.errors | fieldError: 'A reason' }}</mat-error>
      </mat-form-field>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" mat-dialog-close>Cancel</button>
      <button mat-flat-button type="button" (click)="exclude()" data-testid="exclude-confirm">Exclude the row</button>
    </mat-dialog-actions>
  `,
})
export class ExcludeDialog {
  protected readonly data = inject<ExcludeData>(MAT_DIALOG_DATA);
  private readonly dialog = inject<MatDialogRef<ExcludeDialog, string>>(MatDialogRef);
  protected readonly reason = new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(500)] });

  protected exclude(): void {
    this.reason.markAsTouched();
    const text = this.reason.value.trim();
    if (!text) {
      this.reason.setErrors({ required: true });
      return;
    }
    this.dialog.close(text);
  }
}

/** Asks for the reason to exclude one row; emits the reason once given (nothing when cancelled). */
export function askExclusionReason(dialogs: MatDialog, position: number, label: string): Observable<string> {
  const data: ExcludeData = { row: `row ${position}${label !== '—' ? ` (${label})` : ''}` };
  return dialogs
    .open<ExcludeDialog, ExcludeData, string>(ExcludeDialog, { data, width: '520px', maxWidth: '95vw' })
    .afterClosed()
    .pipe(filter((reason): reason is string => !!reason));
}
