import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, computed, effect, inject, untracked, viewChild } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatSidenav, MatSidenavModule } from '@angular/material/sidenav';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatToolbarModule } from '@angular/material/toolbar';
import { Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { map } from 'rxjs';
import { RoleNamesPipe } from '../../../ui/role-names';
import { AuthStore } from '../../auth/auth-store';
import { Notices } from '../../notify/notices';
import { navigationFor, sectionsOf } from '../navigation';

/** The frame around every signed-in page: toolbar, navigation by role, and the page itself. */
@Component({
  selector: 'app-shell',
  templateUrl: './shell.html',
  styleUrl: './shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    MatToolbarModule, MatSidenavModule, MatListModule, MatIconModule, MatButtonModule,
    RouterLink, RouterLinkActive, RouterOutlet, RoleNamesPipe,
  ],
})
export class Shell {
  protected readonly auth = inject(AuthStore);
  private readonly router = inject(Router);
  private readonly notices = inject(Notices);
  private readonly snackBar = inject(MatSnackBar);
  private readonly sidenav = viewChild.required(MatSidenav);

  protected readonly narrow = toSignal(
    inject(BreakpointObserver).observe('(max-width: 959.98px)').pipe(map((state) => state.matches)),
    { initialValue: false },
  );
  protected readonly sections = computed(() => sectionsOf(navigationFor(this.auth.roles())));

  constructor() {
    // A new shell is a new session (the sign-in page lies outside it): close a snack bar the last one left open.
    this.snackBar.dismiss();
    effect(() => {
      const text = this.notices.message();
      if (text) untracked(() => this.snackBar.open(this.notices.take() ?? text, 'Close', { duration: 6000 }));
    });
  }

  protected closeIfNarrow(): void {
    if (this.narrow()) void this.sidenav().close();
  }

  protected signOut(): void {
    this.auth.signOut().subscribe({
      next: () => {
        this.notices.post('You are signed out.');
        void this.router.navigateByUrl('/sign-in');
      },
      error: () => this.notices.post('Signing out did not work. Try again.'),
    });
  }
}
