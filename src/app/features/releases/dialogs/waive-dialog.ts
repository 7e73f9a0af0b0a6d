import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import type { Release } from '../../../../../shared/schemas';
import { ErrorBanner } from '../../../ui/error-banner';
import { FieldErrorPipe } from '../../../ui/field-error';
import { DialogSend } from '../../review/dialogs/dialog-send';
import { notBlank } from '../../review/dialogs/not-blank';
import { ReleaseApi } from '../release-api';

export interface WaiveData {
  releaseId: number;
  requirement: { key: string; label: string };
}

/** A director waives one requirement of a release: the reason is required and kept with the release and its PDF. */
@Component({
  selector: 'app-waive-dialog',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, ErrorBanner, FieldErrorPipe],
  template: `
    <h2 mat-dialog-title>Waive “{{ data.requirement.label }}”</h2>
    <mat-dialog-content>
      <p>
        The release may then be signed without a study for this requirement. The waiver, your name and your reason are kept in its history
        and printed on its PDF. It cannot be taken back.
      </p>
      <app-error-banner [message]="sender.problem()" />
      <form [formGroup]="form" (ngSubmit)="send()" id="waive-form">
        <mat-form-field class="full-width">
          <mat-label>Reason for the waiver</mat-label>
          <textarea matInput rows="4" formControlName="reason" maxlength="1000" data-testid="waive-reason"></textarea>
          <mat-hint>E.g. why this study is not needed for this change.</mat-hint>
          <mat-error data-testid="waive-reason-error">{{ form.controls.reason.errors | fieldError: 'A reason' }}</mat-error>
        </mat-form-field>
      </form>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" mat-dialog-close [disabled]="sender.busy()">Cancel</button>
      <button mat-flat-button type="submit" form="waive-form" [disabled]="sender.busy()" data-testid="waive-confirm">
        <mat-icon>do_not_disturb_on</mat-icon> Waive the requirement
      </button>
    </mat-dialog-actions>
  `,
})
export class WaiveDialog {
  protected readonly data = inject<WaiveData>(MAT_DIALOG_DATA);
  private readonly api = inject(ReleaseApi);
  protected readonly sender = new DialogSend<Release>(inject<MatDialogRef<WaiveDialog, Release>>(MatDialogRef));
  protected readonly form = new FormGroup({
    reason: new FormControl('', { nonNullable: true, validators: [notBlank, Validators.maxLength(1000)] }),
  });

  protected send(): void {
    const reason = this.form.controls.reason.value.trim();
    this.sender.send(this.form, () => this.api.waive(this.data.releaseId, { requirement: this.data.requirement.key, reason }));
  }
}
