import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import type { DueItem } from '../../../../../shared/schemas';
import { DayDates } from '../../../ui/day-dates';
import { ErrorBanner } from '../../../ui/error-banner';
import { FieldErrorPipe } from '../../../ui/field-error';
import { DialogSend } from '../../review/dialogs/dialog-send';
import { notBlank } from '../../review/dialogs/not-blank';
import { ReleaseApi } from '../release-api';

/** A director moves a re-verification's due date, with the reason (kept in the release's history). */
@Component({
  selector: 'app-due-date-dialog',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, DayDates, ErrorBanner, FieldErrorPipe,
  ],
  template: `
    <h2 mat-dialog-title>Move the due date</h2>
    <mat-dialog-content>
      <p><strong>{{ item.label }}</strong> · now due {{ item.dueDate }}</p>
      <app-error-banner [message]="sender.problem()" />
      <form [formGroup]="form" (ngSubmit)="send()" id="due-date-form">
        <mat-form-field class="full-width">
          <mat-label>New due date</mat-label>
          <input matInput [matDatepicker]="picker" formControlName="dueDate" data-testid="due-new-date" />
          <mat-datepicker-toggle matIconSuffix [for]="picker" />
          <mat-datepicker #picker />
          <mat-error data-testid="due-date-error">{{ form.controls.dueDate.errors | fieldError: 'A date' }}</mat-error>
        </mat-form-field>
        <mat-form-field class="full-width">
          <mat-label>Reason for the new date</mat-label>
          <textarea matInput rows="3" formControlName="reason" maxlength="500" data-testid="due-reason"></textarea>
          <mat-error data-testid="due-reason-error">{{ form.controls.reason.errors | fieldError: 'A reason' }}</mat-error>
        </mat-form-field>
      </form>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" mat-dialog-close [disabled]="sender.busy()">Cancel</button>
      <button mat-flat-button type="submit" form="due-date-form" [disabled]="sender.busy()" data-testid="due-date-save">
        <mat-icon>event</mat-icon> Move the date
      </button>
    </mat-dialog-actions>
  `,
})
export class DueDateDialog {
  protected readonly item = inject<DueItem>(MAT_DIALOG_DATA);
  private readonly api = inject(ReleaseApi);
  protected readonly sender = new DialogSend<DueItem>(inject<MatDialogRef<DueDateDialog, DueItem>>(MatDialogRef));
  protected readonly form = new FormGroup({
    dueDate: new FormControl<string | null>(this.item.dueDate, [Validators.required]),
    reason: new FormControl('', { nonNullable: true, validators: [notBlank, Validators.maxLength(500)] }),
  });

  protected send(): void {
    const { dueDate, reason } = this.form.getRawValue();
    this.sender.send(this.form, () => this.api.updateDue(this.item.id, { version: this.item.version, dueDate: dueDate!, reason: reason.trim() }));
  }
}
