import { ChangeDetectionStrategy, Component, OnInit, inject, input, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { Router, RouterLink } from '@angular/router';
import { ErrorBanner } from '../../../ui/error-banner';
import { FieldErrorPipe } from '../../../ui/field-error';
import { ApiError } from '../../http/api-error';
import { showApiError } from '../../http/form-errors';
import { Notices } from '../../notify/notices';
import { AuthStore } from '../auth-store';
import { safeNext } from '../safe-next';

@Component({
  selector: 'app-sign-in-page',
  templateUrl: './sign-in-page.html',
  styleUrl: '../auth-card.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatCardModule, MatFormFieldModule, MatInputModule, MatButtonModule, RouterLink, ErrorBanner, FieldErrorPipe],
})
export class SignInPage implements OnInit {
  private readonly auth = inject(AuthStore);
  private readonly router = inject(Router);

  /** Query parameters (router input binding): where to return, and an e-mail to fill in. */
  readonly next = input<string>();
  readonly email = input<string>();

  protected readonly form = new FormGroup({
    email: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.email] }),
    password: new FormControl('', { nonNullable: true, validators: [Validators.required] }),
  });
  protected readonly notice = signal(inject(Notices).take());
  protected readonly problem = signal<string | null>(null);
  protected readonly busy = signal(false);

  ngOnInit(): void {
    const email = this.email();
    if (email) this.form.controls.email.setValue(email);
  }

  /** "Forgot your password?" carries the e-mail already typed, if any. */
  protected forgotParams(): { email?: string } {
    const email = this.form.controls.email.value.trim();
    return email ? { email } : {};
  }

  protected signIn(): void {
    this.problem.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.auth.signIn(this.form.getRawValue()).subscribe({
      next: () => void this.router.navigateByUrl(safeNext(this.next())),
      error: (err: ApiError) => {
        this.busy.set(false);
        this.notice.set(null);
        this.problem.set(showApiError(this.form, err));
      },
    });
  }
}
