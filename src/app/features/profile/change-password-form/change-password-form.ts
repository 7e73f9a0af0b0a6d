import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormControl, FormGroup, FormGroupDirective, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { AuthApi } from '../../../core/auth/auth-api';
import { ApiError } from '../../../core/http/api-error';
import { showIssues } from '../../../core/http/form-errors';
import { Notices } from '../../../core/notify/notices';
import { ErrorBanner } from '../../../ui/error-banner';
import { FieldErrorPipe } from '../../../ui/field-error';
import { NewPasswordFields } from '../../../ui/new-password/new-password-fields';
import { newPasswordGroup } from '../../../ui/new-password/new-password-group';

/** Change one's own password: the current one, then the new one twice. */
@Component({
  selector: 'app-change-password-form',
  templateUrl: './change-password-form.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    ReactiveFormsModule, MatCardModule, MatFormFieldModule, MatInputModule, MatButtonModule,
    ErrorBanner, FieldErrorPipe, NewPasswordFields,
  ],
})
export class ChangePasswordForm {
  private readonly api = inject(AuthApi);
  private readonly notices = inject(Notices);

  protected readonly form = new FormGroup({
    currentPassword: new FormControl('', { nonNullable: true, validators: [Validators.required] }),
    next: newPasswordGroup(),
  });
  protected readonly problem = signal<string | null>(null);
  protected readonly busy = signal(false);

  protected save(formDirective: FormGroupDirective): void {
    this.problem.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    const body = { currentPassword: this.form.controls.currentPassword.value, newPassword: this.form.controls.next.controls.password.value };
    this.api.changePassword(body).subscribe({
      next: () => {
        this.busy.set(false);
        formDirective.resetForm();
        this.notices.post('Your password is changed.');
      },
      error: (err: ApiError) => {
        this.busy.set(false);
        // The API names the new password `newPassword`; in this form it is `next.password`.
        const issues = err.issues.map((i) => (i.path === 'newPassword' ? { ...i, path: 'next.password' } : i));
        this.problem.set(showIssues(this.form, err.message, issues));
      },
    });
  }
}
