import { ChangeDetectionStrategy, Component, OnInit, inject, input, signal } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import type { PasswordLinkInfo } from '@shared/schemas';
import { ErrorBanner } from '../../../ui/error-banner';
import { ZonedPipe } from '../../../ui/lab-time';
import { NewPasswordFields } from '../../../ui/new-password/new-password-fields';
import { newPasswordGroup } from '../../../ui/new-password/new-password-group';
import { ApiError } from '../../http/api-error';
import { showApiError } from '../../http/form-errors';
import { Notices } from '../../notify/notices';
import { AuthApi } from '../auth-api';

const INVALID_LINK = 'This link is not valid or has expired; ask for a new one with “Forgot your password?” on the sign-in page, or ask your administrator.';

/** Opened from an invitation or a password-reset e-mail: the user chooses a password once. */
@Component({
  selector: 'app-set-password-page',
  templateUrl: './set-password-page.html',
  styleUrl: '../auth-card.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    ReactiveFormsModule, MatCardModule, MatButtonModule, MatProgressBarModule, RouterLink, ZonedPipe,
    ErrorBanner, NewPasswordFields,
  ],
})
export class SetPasswordPage implements OnInit {
  private readonly api = inject(AuthApi);
  private readonly router = inject(Router);
  private readonly notices = inject(Notices);

  /** The route's :token. */
  readonly token = input.required<string>();

  protected readonly link = signal<PasswordLinkInfo | null>(null);
  protected readonly loading = signal(true);
  protected readonly problem = signal<string | null>(null);
  protected readonly busy = signal(false);
  protected readonly form = newPasswordGroup();

  ngOnInit(): void {
    this.api.passwordLink(this.token()).subscribe({
      next: (link) => {
        this.link.set(link);
        this.loading.set(false);
      },
      error: (err: ApiError) => {
        this.loading.set(false);
        this.problem.set(err.status === 404 || err.status === 400 ? INVALID_LINK : err.message);
      },
    });
  }

  protected save(): void {
    const link = this.link();
    if (!link || this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.problem.set(null);
    this.api.setPassword(this.token(), this.form.controls.password.value).subscribe({
      next: () => {
        this.notices.post('Your password is set. Sign in with your e-mail and the new password.');
        void this.router.navigate(['/sign-in'], { queryParams: { email: link.email } });
      },
      error: (err: ApiError) => {
        this.busy.set(false);
        if (err.status === 404) this.link.set(null);
        this.problem.set(err.status === 404 ? INVALID_LINK : showApiError(this.form, err));
      },
    });
  }
}
