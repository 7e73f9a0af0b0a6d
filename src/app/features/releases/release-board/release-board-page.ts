import { ChangeDetectionStrategy, Component, computed, effect, inject, input, numberAttribute, untracked, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { Observable, filter } from 'rxjs';
import { CHANGE_TYPE_LABELS, type BoardRequirement, type ComponentStudy, type DueItem, type Release, type StudyKind } from '@shared/schemas';
import { AuthStore } from '../../../core/auth/auth-store';
import { Notices } from '../../../core/notify/notices';
import { ConfirmData, ConfirmDialog } from '../../../ui/confirm-dialog/confirm-dialog';
import { ErrorBanner } from '../../../ui/error-banner';
import { ZonedPipe, labZone } from '../../../ui/lab-time';
import { EditReleaseData, EditReleaseDialog } from '../dialogs/edit-release-dialog';
import { LinkStudyData, LinkStudyDialog } from '../dialogs/link-study-dialog';
import { ReleaseReasonData, ReleaseReasonDialog } from '../dialogs/release-reason-dialog';
import { ReleaseApi } from '../release-api';
import { DecisionCaution } from '../../archive/decision-caution';
import { ReleaseStateChip } from '../release-state-chip';
import { dueIcon, metWords } from '../release-words';
import { SignPanel } from '../sign-panel/sign-panel';
import { ReleaseBoardStore } from './release-board-store';
import { ReleaseHistory } from './release-history';
import { ReleaseIntegrity } from './release-integrity';
import { RequirementCard } from './requirement-card';

const DIALOG = { width: '600px', maxWidth: '95vw' };

/**
 * A release's board: what the change is, one card per requirement with its study (or "missing"), the director's
 * signature panel, the signatures, the PDF, the re-verifications it set due, the integrity re-check and the history.
 */
@Component({
  selector: 'app-release-board-page',
  templateUrl: './release-board-page.html',
  styleUrl: './release-board-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  providers: [ReleaseBoardStore],
  imports: [
    MatButtonModule, MatIconModule, MatProgressBarModule, RouterLink, ErrorBanner, ZonedPipe, DecisionCaution, ReleaseStateChip,
    RequirementCard, SignPanel, ReleaseIntegrity, ReleaseHistory,
  ],
})
export class ReleaseBoardPage {
  /** The route's :id. */
  readonly id = input.required({ transform: numberAttribute });
  protected readonly store = inject(ReleaseBoardStore);
  private readonly api = inject(ReleaseApi);
  private readonly auth = inject(AuthStore);
  private readonly dialogs = inject(MatDialog);
  private readonly router = inject(Router);
  private readonly notices = inject(Notices);
  private readonly history = viewChild(ReleaseHistory);
  protected readonly zone = labZone();
  protected readonly release = this.store.release;

  protected readonly director = computed(() => this.auth.hasAnyRole(['director']));
  private readonly worker = computed(() => this.auth.hasAnyRole(['technologist', 'director']));
  protected readonly isOpen = computed(() => this.release()?.state === 'open');
  /** Studies are linked and requirements waived while the release is open or waiting for review (after an amendment). */
  private readonly stillOpen = computed(() => ['open', 'needs-review'].includes(this.release()?.state ?? ''));
  /** Editing and unlinking only while open. */
  protected readonly canWork = computed(() => this.worker() && this.isOpen());
  protected readonly canLink = computed(() => this.worker() && this.stillOpen());
  protected readonly canWaive = computed(() => this.director() && this.stillOpen());
  protected readonly canCheck = computed(() => this.auth.hasAnyRole(['director', 'quality']));
  /** The sign panel: a director, on a release not yet decided (or one whose component changed). */
  protected readonly showSign = computed(() => this.director() && ['open', 'needs-review'].includes(this.release()?.state ?? ''));
  protected readonly signed = computed(() => (this.release()?.signatures.length ?? 0) > 0);
  protected readonly changeLabel = computed(() => (this.release() ? CHANGE_TYPE_LABELS[this.release()!.changeType] : ''));
  protected readonly met = computed(() => (this.release() ? metWords(this.release()!.met, this.release()!.required) : ''));
  protected readonly stamp = computed(() => (this.release() ? `${this.release()!.version}:${this.release()!.state}` : ''));
  protected readonly pdfUrl = computed(() => (this.release() ? this.api.pdfUrl(this.release()!.id) : ''));
  protected readonly dueWords = (item: DueItem): string => item.dueWords;
  protected readonly dueIcon = dueIcon;

  constructor() {
    effect(() => {
      const id = this.id();
      untracked(() => this.store.open(id));
    });
  }

  /** Starts a draft study for the requirement and opens its Setup. */
  protected start(release: Release, requirement: BoardRequirement, kind: StudyKind): void {
    this.store.change(this.api.link(release.id, { requirement: requirement.key, start: { kind } }), (next) => {
      const study = next.requirements.find((r) => r.key === requirement.key)?.study;
      if (study) {
        this.notices.post(`Study ${study.id} is a new draft for “${requirement.label}”. Fill in its Setup.`);
        void this.router.navigate(['/studies', study.id, 'setup']);
      }
    });
  }

  protected link(release: Release, requirement: BoardRequirement): void {
    const data: LinkStudyData = {
      releaseId: release.id,
      analyte: release.analyte,
      requirement,
      linkedIds: release.requirements.flatMap((r) => r.linked.map((s) => s.id)),
    };
    this.afterDialog(this.dialogs.open<LinkStudyDialog, LinkStudyData, Release>(LinkStudyDialog, { ...DIALOG, data }).afterClosed(), 'The study is linked.');
  }

  protected unlink(release: Release, requirement: BoardRequirement, study: ComponentStudy): void {
    const data: ConfirmData = {
      title: `Unlink study ${study.id}?`,
      text: `“${study.title}” will no longer count for “${requirement.label}”. The study itself does not change.`,
      action: 'Unlink',
    };
    this.dialogs
      .open<ConfirmDialog, ConfirmData, boolean>(ConfirmDialog, { data })
      .afterClosed()
      .pipe(filter((yes) => yes === true))
      .subscribe(() => this.store.change(this.api.unlink(release.id, study.id), () => this.notices.post('The study is unlinked.')));
  }

  protected waive(release: Release, requirement: BoardRequirement): void {
    const data: ReleaseReasonData = { step: 'waive', releaseId: release.id, requirement };
    this.afterDialog(
      this.dialogs.open<ReleaseReasonDialog, ReleaseReasonData, Release>(ReleaseReasonDialog, { ...DIALOG, data }).afterClosed(),
      `“${requirement.label}” is waived.`,
    );
  }

  protected edit(release: Release): void {
    const data: EditReleaseData = { release, editRequirements: release.changeType === 'custom' && this.director() };
    this.afterDialog(this.dialogs.open<EditReleaseDialog, EditReleaseData, Release>(EditReleaseDialog, { width: '760px', maxWidth: '95vw', data }).afterClosed(), 'Saved.');
  }

  protected moveDue(item: DueItem): void {
    this.dialogs
      .open<ReleaseReasonDialog, ReleaseReasonData, DueItem>(ReleaseReasonDialog, { ...DIALOG, data: { step: 'move-due', item } })
      .afterClosed()
      .pipe(filter((moved): moved is DueItem => !!moved))
      .subscribe((moved) => {
        this.notices.post(`“${moved.label}” is now due ${moved.dueDate}.`);
        this.store.refresh();
        this.history()?.reload();
      });
  }

  protected signedRelease(release: Release): void {
    this.store.adopt(release);
    this.notices.post(`Signed: ${release.signatures.at(-1)?.meaningWords ?? 'the release is decided'}.`);
  }

  protected rechecked(): void {
    this.history()?.reload();
  }

  private afterDialog(closed: Observable<Release | undefined>, notice: string): void {
    closed.pipe(filter((r): r is Release => !!r)).subscribe((release) => {
      this.store.adopt(release);
      this.notices.post(notice);
    });
  }
}
