import { ChangeDetectionStrategy, Component, OnInit, inject, input, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import { ErrorBanner } from '../../../ui/error-banner';
import { FieldErrorPipe } from '../../../ui/field-error';
import { ApiError } from '../../http/api-error';
import { showApiError } from '../../http/form-errors';
import { AuthApi } from '../auth-api';

/**
 * "Forgot your password?": asks for a one-time link by e-mail. It always says the same thing afterwards,
 * whether or not the address has an account (the server answers alike either way).
 */
@Component({
  selector: 'app-forgot-password-page',
  templateUrl: './forgot-password-page.html',
  styleUrl: '../auth-card.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatCardModule, MatFormFieldModule, MatInputModule, MatButtonModule, RouterLink, ErrorBanner, FieldErrorPipe],
})
export class ForgotPasswordPage implements OnInit {
  private readonly api = inject(AuthApi);

  /** Query parameter (router input binding): the e-mail typed on the sign-in page. */
  readonly email = input<string>();

  protected readonly form = new FormGroup({
    email: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.email] }),
  });
  protected readonly sent = signal<string | null>(null);
  protected readonly problem = signal<string | null>(null);
  protected readonly busy = signal(false);

  ngOnInit(): void {
    const email = this.email();
    if (email) this.form.controls.email.setValue(email);
  }

  protected send(): void {
    this.problem.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.api.requestPasswordReset(this.form.controls.email.value).subscribe({
      next: (answer) => {
        this.busy.set(false);
        this.sent.set(answer.message);
      },
      error: (err: ApiError) => {
        this.busy.set(false);
        this.problem.set(showApiError(this.form, err));
      },
    });
  }
}
