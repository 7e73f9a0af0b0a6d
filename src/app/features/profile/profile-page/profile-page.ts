import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatCardModule } from '@angular/material/card';
import { AuthStore } from '../../../core/auth/auth-store';
import { RoleNamesPipe } from '../../../ui/role-names';
import { ChangePasswordForm } from '../change-password-form/change-password-form';

/** The signed-in user's own account. */
@Component({
  selector: 'app-profile-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatCardModule, RoleNamesPipe, ChangePasswordForm],
  template: `
    <section class="page">
      <h1>Profile</h1>
      <div class="cards">
        @if (user(); as u) {
          <mat-card appearance="outlined">
            <mat-card-header><mat-card-title><h2>Your account</h2></mat-card-title></mat-card-header>
            <mat-card-content>
              <dl class="facts" data-testid="account">
                <dt>Name</dt><dd>{{ u.name }}</dd>
                <dt>E-mail</dt><dd>{{ u.email }}</dd>
                <dt>Roles</dt><dd>{{ u.roles | roleNames }}</dd>
                <dt>Laboratory</dt><dd>{{ u.laboratory.name }}</dd>
                <dt>Time zone</dt><dd>{{ u.laboratory.timeZone }}</dd>
              </dl>
              <p class="muted">Your administrator changes your name and roles.</p>
            </mat-card-content>
          </mat-card>
        }
        <app-change-password-form />
      </div>
    </section>
  `,
  styles: `
    .cards {
      display: grid;
      grid-template-columns: repeat(auto-fit, minmax(320px, 1fr));
      gap: 16px;
      align-items: start;
    }
    .facts {
      display: grid;
      grid-template-columns: max-content 1fr;
      gap: 8px 16px;
      margin: 0 0 16px;
    }
    dt {
      font: var(--mat-sys-label-large);
      color: var(--mat-sys-on-surface-variant);
    }
    dd {
      margin: 0;
    }
  `,
})
export class ProfilePage {
  protected readonly user = inject(AuthStore).user;
}
