import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import type { DueItem, Release } from '@shared/schemas';
import { DayDates } from '../../../ui/day-dates';
import { ErrorBanner } from '../../../ui/error-banner';
import { FieldErrorPipe } from '../../../ui/field-error';
import { DialogSend } from '../../signoff/dialogs/dialog-send';
import { notBlank } from '../../signoff/dialogs/not-blank';
import { ReleaseApi } from '../release-api';

/**
 * A director's step on a release that needs a reason: waiving a requirement (the dialog closes with the release), or
 * moving a re-verification's due date (it closes with the due item).
 */
export type ReleaseReasonData =
  | { step: 'waive'; releaseId: number; requirement: { key: string; label: string } }
  | { step: 'move-due'; item: DueItem };

type Step = ReleaseReasonData['step'];

const WORDS: Record<Step, { label: string; hint: string; rows: number; max: number; action: string; icon: string; testId: string; confirmId: string }> = {
  waive: {
    label: 'Reason for the waiver',
    hint: 'E.g. why this study is not needed for this change.',
    rows: 4,
    max: 1000,
    action: 'Waive the requirement',
    icon: 'do_not_disturb_on',
    testId: 'waive',
    confirmId: 'waive-confirm',
  },
  'move-due': { label: 'Reason for the new date', hint: '', rows: 3, max: 500, action: 'Move the date', icon: 'event', testId: 'due', confirmId: 'due-date-save' },
};

/** Asks for the required reason (and, for a due item, the new date), sends the step, and closes with the server's answer. */
@Component({
  selector: 'app-release-reason-dialog',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, DayDates, ErrorBanner, FieldErrorPipe,
  ],
  template: `
    @let d = data;
    <h2 mat-dialog-title>{{ d.step === 'waive' ? 'Waive “' + d.requirement.label + '”' : 'Move the due date' }}</h2>
    <mat-dialog-content>
      @if (d.step === 'waive') {
        <p>
          The release may then be signed without a study for this requirement. The waiver, your name and your reason are kept in its history
          and printed on its PDF. It cannot be taken back.
        </p>
      } @else {
        <p><strong>{{ d.item.label }}</strong> · now due {{ d.item.dueDate }}</p>
      }
      <app-error-banner [message]="sender.problem()" />
      <form [formGroup]="form" (ngSubmit)="send()" id="release-reason-form">
        @if (d.step === 'move-due') {
          <mat-form-field class="full-width">
            <mat-label>New due date</mat-label>
            <input matInput [matDatepicker]="picker" formControlName="dueDate" data-testid="due-new-date" />
            <mat-datepicker-toggle matIconSuffix [for]="picker" />
            <mat-datepicker #picker />
            <mat-error data-testid="due-date-error">{{ form.controls.dueDate.errors | fieldError: 'A date' }}</mat-error>
          </mat-form-field>
        }
        <mat-form-field class="full-width">
          <mat-label>{{ words.label }}</mat-label>
          <textarea matInput [rows]="words.rows" formControlName="reason" [maxlength]="words.max" [attr.data-testid]="words.testId + '-reason'"></textarea>
          @if (words.hint) { <mat-hint>{{ words.hint }}</mat-hint> }
          <mat-error [attr.data-testid]="words.testId + '-reason-error'">{{ form.controls.reason.errors | fieldError: 'A reason' }}</mat-error>
        </mat-form-field>
      </form>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" mat-dialog-close [disabled]="sender.busy()">Cancel</button>
      <button mat-flat-button type="submit" form="release-reason-form" [disabled]="sender.busy()" [attr.data-testid]="words.confirmId">
        <mat-icon>{{ words.icon }}</mat-icon> {{ words.action }}
      </button>
    </mat-dialog-actions>
  `,
})
export class ReleaseReasonDialog {
  protected readonly data = inject<ReleaseReasonData>(MAT_DIALOG_DATA);
  private readonly api = inject(ReleaseApi);
  protected readonly sender = new DialogSend<Release | DueItem>(inject<MatDialogRef<ReleaseReasonDialog, Release | DueItem>>(MatDialogRef));
  protected readonly words = WORDS[this.data.step];
  protected readonly form = new FormGroup({
    dueDate: new FormControl<string | null>(this.data.step === 'move-due' ? this.data.item.dueDate : null, this.data.step === 'move-due' ? [Validators.required] : []),
    reason: new FormControl('', { nonNullable: true, validators: [notBlank, Validators.maxLength(this.words.max)] }),
  });

  protected send(): void {
    const reason = this.form.controls.reason.value.trim();
    const d = this.data;
    this.sender.send(this.form, () =>
      d.step === 'waive'
        ? this.api.waive(d.releaseId, { requirement: d.requirement.key, reason })
        : this.api.updateDue(d.item.id, { version: d.item.version, dueDate: this.form.controls.dueDate.value!, reason }),
    );
  }
}
