import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import type { SignBody, Study } from '@shared/schemas';
import { AuthStore } from '../../../core/auth/auth-store';
import { ErrorBanner } from '../../../ui/error-banner';
import { FieldErrorPipe } from '../../../ui/field-error';
import { SignoffApi } from '../signoff-api';
import { DialogSend } from './dialog-send';

export interface SignatureData {
  /** 'signoff': the director's decision on the findings; 'plan': the approval of the plan before data. */
  kind: 'signoff' | 'plan';
  studyId: number;
  title: string;
}

type Meaning = SignBody['meaning'];

export const MEANING_CHOICES: readonly { value: Meaning; label: string; icon: string }[] = [
  { value: 'accepted', label: 'Accepted for patient testing', icon: 'verified' },
  { value: 'not-accepted', label: 'Not accepted for patient testing', icon: 'block' },
];

/**
 * An electronic signature: the director's password again, an optional comment and, at sign-off, the
 * meaning as two plain choices. Closes with the study the server answered; a wrong password shows on
 * its field, a locked account or segregation of duties in words above the form.
 */
@Component({
  selector: 'app-signature-dialog',
  templateUrl: './signature-dialog.html',
  styleUrl: './signature-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatRadioModule, ErrorBanner, FieldErrorPipe],
})
export class SignatureDialog {
  protected readonly data = inject<SignatureData>(MAT_DIALOG_DATA);
  private readonly api = inject(SignoffApi);
  private readonly auth = inject(AuthStore);
  protected readonly sender = new DialogSend<Study>(inject<MatDialogRef<SignatureDialog, Study>>(MatDialogRef));
  protected readonly choices = MEANING_CHOICES;
  protected readonly signoff = this.data.kind === 'signoff';
  protected readonly signer = computed(() => this.auth.user()?.name ?? 'you');

  protected readonly form = new FormGroup({
    meaning: new FormControl<Meaning | null>(null, this.signoff ? [Validators.required] : []),
    comment: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(2000)] }),
    password: new FormControl('', { nonNullable: true, validators: [Validators.required] }),
  });

  protected sign(): void {
    const { meaning, comment, password } = this.form.getRawValue();
    const id = this.data.studyId;
    this.sender.send(this.form, () =>
      this.signoff
        ? this.api.sign(id, { meaning: meaning!, comment: comment.trim(), password })
        : this.api.approvePlan(id, { comment: comment.trim(), password }),
    );
  }
}
