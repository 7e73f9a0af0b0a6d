import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { SUBMISSION_NOTE_MAX, SubmitBody } from '@shared/schemas';
import { FieldErrorPipe } from '../../../ui/field-error';
import { schemaRule } from '../../../ui/schema-rule';

export interface SubmitData {
  title: string;
  /** The note typed before, when a submission was refused and is tried again. */
  note: string;
}

/**
 * Asks before a submission, saying what it does (the study is locked while the director reviews it), with an
 * optional note for the director. Closes with the body to send (the note trimmed), or nothing on Cancel.
 */
@Component({
  selector: 'app-submit-dialog',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, FieldErrorPipe],
  template: `
    <h2 mat-dialog-title>Submit for sign-off</h2>
    <mat-dialog-content>
      <p><strong>{{ data.title }}</strong></p>
      <p data-testid="submit-what">
        Submitting locks the study for the director: its rows and settings cannot change while a director reviews it.
        The laboratory's directors are told by e-mail; a director signs it, or returns it to draft with a comment.
      </p>
      <form [formGroup]="form" (ngSubmit)="confirm()" id="submit-form">
        <mat-form-field class="full-width" subscriptSizing="dynamic">
          <mat-label>Note for the director (optional)</mat-label>
          <textarea matInput rows="4" formControlName="note" data-testid="submit-note"></textarea>
          <mat-hint>Shown on the review page and in the directors' e-mail.</mat-hint>
          <mat-hint align="end" data-testid="submit-note-count">{{ length() }} / {{ max }}</mat-hint>
          <mat-error data-testid="submit-note-error">{{ form.controls.note.errors | fieldError: 'The note' }}</mat-error>
        </mat-form-field>
      </form>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" mat-dialog-close>Cancel</button>
      <button mat-flat-button type="submit" form="submit-form" data-testid="submit-confirm"><mat-icon>send</mat-icon> Submit and lock</button>
    </mat-dialog-actions>
  `,
})
export class SubmitDialog {
  protected readonly data = inject<SubmitData>(MAT_DIALOG_DATA);
  private readonly dialog = inject<MatDialogRef<SubmitDialog, SubmitBody>>(MatDialogRef);
  protected readonly max = SUBMISSION_NOTE_MAX;
  /** Checked by the server's own rule (trimmed, at most SUBMISSION_NOTE_MAX characters), so the field says what the server would. */
  protected readonly form = new FormGroup({
    note: new FormControl(this.data.note, { nonNullable: true, validators: [schemaRule(SubmitBody.shape.note)] }),
  });

  protected length(): number {
    return this.form.controls.note.value.trim().length;
  }

  protected confirm(): void {
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    this.dialog.close(SubmitBody.parse(this.form.getRawValue()));
  }
}
