import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { AuthStore } from '../../../core/auth/auth-store';
import { navigationFor } from '../../../core/layout/navigation';
import { DueSection } from '../../releases/due/due-section';
import { WorklistSections } from '../sections/worklist-sections';
import { dutiesOf } from '../role-duties';

/** The home page: who you are, what your roles are for, and the pages open to you now. */
@Component({
  selector: 'app-worklist-page',
  templateUrl: './worklist-page.html',
  styleUrl: './worklist-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatCardModule, MatIconModule, RouterLink, WorklistSections, DueSection],
})
export class WorklistPage {
  private readonly auth = inject(AuthStore);
  protected readonly user = this.auth.user;
  /** The worklist of studies and what is due for re-verification, for the roles that read studies (an administrator has none). */
  protected readonly readsStudies = computed(() => this.auth.hasAnyRole(['technologist', 'director', 'quality']));
  protected readonly duties = computed(() => dutiesOf(this.user()?.roles ?? []));
  /** Every page the navigation offers this user, except this one. */
  protected readonly pages = computed(() =>
    navigationFor(this.user()?.roles ?? []).filter((item) => item.path !== '/'),
  );
}
