import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import type { StudySummary, Worklist } from '@shared/schemas';
import { AuthStore } from '../../../core/auth/auth-store';
import { ErrorBanner } from '../../../ui/error-banner';
import { laboratoryTime } from '@shared/types/lab-time';
import { stateLabel } from '../../studies/study-text';
import { WorklistStore } from './worklist-store';

interface Section {
  key: keyof Worklist;
  title: string;
  empty: string;
  items: StudySummary[];
  /** Where a study's link opens: its review (what awaits a signature) or its Setup, Specimens and Findings. */
  opens: 'review' | 'study';
}

/** The worklist on the home page: what waits for the signed-in user, each study one click away. */
@Component({
  selector: 'app-worklist-sections',
  templateUrl: './worklist-sections.html',
  styleUrl: './worklist-sections.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  providers: [WorklistStore],
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, RouterLink, ErrorBanner],
})
export class WorklistSections {
  protected readonly store = inject(WorklistStore);
  private readonly auth = inject(AuthStore);
  protected readonly canCreate = computed(() => this.auth.hasAnyRole(['technologist', 'director']));
  protected readonly timeZone = computed(() => this.auth.user()?.laboratory.timeZone ?? 'UTC');
  protected readonly state = stateLabel;

  protected readonly sections = computed<Section[]>(() => {
    const w = this.store.worklist();
    if (!w) return [];
    const sections: Section[] = [];
    if (this.canCreate()) {
      sections.push({ key: 'returned', title: 'Returned to me', empty: 'No study is waiting for your changes.', items: w.returned, opens: 'study' });
      sections.push({ key: 'drafts', title: 'My drafts', empty: 'No drafts. Start a new study when a method needs verifying.', items: w.drafts, opens: 'study' });
    }
    if (this.auth.hasAnyRole(['director'])) {
      sections.push({ key: 'awaitingSignature', title: 'Awaiting my signature', empty: 'Nothing is waiting for your sign-off.', items: w.awaitingSignature, opens: 'review' });
    }
    sections.push({ key: 'recentlySigned', title: 'Recently signed', empty: 'No study has been signed recently.', items: w.recentlySigned, opens: 'study' });
    return sections;
  });

  constructor() {
    this.store.load();
  }

  protected link(section: Section, study: StudySummary): (string | number)[] {
    return section.opens === 'review' ? ['/studies', study.id, 'review'] : ['/studies', study.id];
  }

  protected when(study: StudySummary): string {
    return laboratoryTime(study.updatedAt, this.timeZone(), { zone: false });
  }
}
