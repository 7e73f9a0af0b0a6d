import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { catchError, filter, map, of, startWith } from 'rxjs';
import { STUDY_KINDS, type DueItem, type Release, type StudyKind } from '@shared/schemas';
import { AuthStore } from '../../../core/auth/auth-store';
import { ApiError } from '../../../core/http/api-error';
import { Notices } from '../../../core/notify/notices';
import { ErrorBanner } from '../../../ui/error-banner';
import type { CreateReleaseData } from '../create-release/create-release-dialog';
import { ReleaseApi } from '../release-api';
import { dueIcon } from '../release-words';
import { StartStudyButton } from '../start-study-button';

interface Loaded {
  items: DueItem[];
  loading: boolean;
  error: string | null;
}

/**
 * The worklist's "Due" section: re-verifications that are overdue or fall due soon, each with its date in words and the
 * release that set it. A technologist or director starts a study (or a new release) from an item, which links the two.
 */
@Component({
  selector: 'app-due-section',
  templateUrl: './due-section.html',
  styleUrl: './due-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, RouterLink, ErrorBanner, StartStudyButton],
})
export class DueSection {
  private readonly api = inject(ReleaseApi);
  private readonly dialogs = inject(MatDialog);
  private readonly router = inject(Router);
  private readonly notices = inject(Notices);
  protected readonly canStart = inject(AuthStore).hasAnyRole(['technologist', 'director']);
  /** The kinds of study that re-verify an item (its rule's); every kind when the rule names none. */
  protected kindsOf(item: DueItem): readonly StudyKind[] {
    return item.kinds.length ? item.kinds : STUDY_KINDS;
  }
  protected readonly busy = signal<number | null>(null);
  protected readonly problem = signal<string | null>(null);

  private readonly loaded = toSignal(
    this.api.due({ status: 'pending' }).pipe(
      map((items): Loaded => ({ items, loading: false, error: null })),
      catchError((err: ApiError) => of<Loaded>({ items: [], loading: false, error: `What is due could not be read: ${err.message}` })),
      startWith<Loaded>({ items: [], loading: true, error: null }),
    ),
    { initialValue: { items: [], loading: true, error: null } as Loaded },
  );
  protected readonly loading = computed(() => this.loaded().loading);
  protected readonly error = computed(() => this.loaded().error);
  /** Overdue first, then due soon, each by date. */
  protected readonly items = computed(() =>
    this.loaded()
      .items.filter((d) => d.status === 'overdue' || d.status === 'due-soon')
      .sort((a, b) => (a.status === b.status ? a.dueDate.localeCompare(b.dueDate) : a.status === 'overdue' ? -1 : 1)),
  );
  /** The server's words, as of the laboratory's today (the reminder e-mail says the same). */
  protected readonly words = (item: DueItem): string => item.dueWords;
  protected readonly icon = dueIcon;

  /** Starts a draft study from the item (the server links the two) and opens its Setup. */
  protected startStudy(item: DueItem, kind: StudyKind): void {
    if (this.busy() !== null) return;
    this.busy.set(item.id);
    this.problem.set(null);
    this.api.startStudy(item.id, { kind }).subscribe({
      next: (started) => {
        this.busy.set(null);
        const study = started.startedStudy;
        if (!study) {
          this.problem.set('The study was started, but the answer did not name it; find it under Studies.');
          return;
        }
        this.notices.post(`Study ${study.id} is a new draft for “${item.label}”. Fill in its Setup.`);
        void this.router.navigate(['/studies', study.id, 'setup']);
      },
      error: (err: ApiError) => {
        this.busy.set(null);
        this.problem.set(`The study could not be started: ${err.message}`);
      },
    });
  }

  /** Opens the new-release dialog filled in from the item; the release it creates is linked to the item. */
  protected async startRelease(item: DueItem): Promise<void> {
    const { CreateReleaseDialog } = await import('../create-release/create-release-dialog');
    const data: CreateReleaseData = {
      dueItemId: item.id,
      dueLabel: item.label,
      analyteId: item.analyte.id,
      instrumentId: item.instrument.id,
      title: `${item.label}: ${item.analyte.name} on ${item.instrument.name}`,
    };
    this.dialogs
      .open<InstanceType<typeof CreateReleaseDialog>, CreateReleaseData, Release>(CreateReleaseDialog, { data, width: '760px', maxWidth: '95vw' })
      .afterClosed()
      .pipe(filter((r): r is Release => !!r))
      .subscribe((release) => void this.router.navigate(['/releases', release.id]));
  }
}
