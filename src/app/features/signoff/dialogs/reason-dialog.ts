import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import type { Study } from '@shared/schemas';
import { ErrorBanner } from '../../../ui/error-banner';
import { FieldErrorPipe } from '../../../ui/field-error';
import { SignoffApi } from '../signoff-api';
import { DialogSend } from './dialog-send';
import { notBlank } from './not-blank';

/** A sign-off step that needs only words: returning a study to its technologist, or amending a signed one. */
export type ReasonStep = 'return' | 'amend';

export interface ReasonData {
  step: ReasonStep;
  studyId: number;
  title: string;
}

const WORDS: Record<ReasonStep, { heading: string; intro: string; label: string; hint: string; action: string; icon: string }> = {
  return: {
    heading: 'Return to technologist',
    intro: 'The study goes back to draft so its rows or settings can change. Your comment is shown on the study and e-mailed to its author.',
    label: 'Comment for the technologist',
    hint: 'Say what to change or check, e.g. which specimens to add or which exclusion to explain.',
    action: 'Return the study',
    icon: 'undo',
  },
  amend: {
    heading: 'Amend the signed study',
    intro: 'A signed study never changes. Amending copies it, with its rows, into a new draft that supersedes it once that draft is signed.',
    label: 'Reason for the amendment',
    hint: 'Kept in the history of both studies.',
    action: 'Start the amendment',
    icon: 'edit_document',
  },
};

/** Asks for the required comment or reason, sends the step, and closes with the study the server answered. */
@Component({
  selector: 'app-reason-dialog',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, ErrorBanner, FieldErrorPipe],
  template: `
    <h2 mat-dialog-title>{{ words.heading }}</h2>
    <mat-dialog-content>
      <p><strong>{{ data.title }}</strong></p>
      <p>{{ words.intro }}</p>
      <app-error-banner [message]="sender.problem()" />
      <form [formGroup]="form" (ngSubmit)="send()" id="reason-form">
        <mat-form-field class="full-width">
          <mat-label>{{ words.label }}</mat-label>
          <textarea matInput rows="4" formControlName="text" data-testid="reason-text"></textarea>
          <mat-hint>{{ words.hint }}</mat-hint>
          <mat-error data-testid="reason-error">{{ form.controls.text.errors | fieldError: words.label }}</mat-error>
        </mat-form-field>
      </form>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" mat-dialog-close [disabled]="sender.busy()">Cancel</button>
      <button mat-flat-button type="submit" form="reason-form" [disabled]="sender.busy()" data-testid="reason-confirm">
        <mat-icon>{{ words.icon }}</mat-icon> {{ words.action }}
      </button>
    </mat-dialog-actions>
  `,
})
export class ReasonDialog {
  protected readonly data = inject<ReasonData>(MAT_DIALOG_DATA);
  private readonly api = inject(SignoffApi);
  protected readonly sender = new DialogSend<Study>(inject<MatDialogRef<ReasonDialog, Study>>(MatDialogRef));
  protected readonly words = WORDS[this.data.step];
  protected readonly form = new FormGroup({
    text: new FormControl('', { nonNullable: true, validators: [notBlank, Validators.maxLength(2000)] }),
  });

  protected send(): void {
    const text = this.form.controls.text.value.trim();
    const id = this.data.studyId;
    this.sender.send(this.form, () =>
      this.data.step === 'return' ? this.api.returnToDraft(id, { comment: text }) : this.api.amend(id, { reason: text }),
    );
  }
}
