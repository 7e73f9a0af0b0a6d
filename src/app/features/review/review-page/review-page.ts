import { DecimalPipe, NgComponentOutlet } from '@angular/common';
import { ChangeDetectionStrategy, Component, Type, computed, effect, inject, input, signal, untracked, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { filter } from 'rxjs';
import type { Study } from '@shared/schemas';
import { AuthStore } from '../../../core/auth/auth-store';
import { Notices } from '../../../core/notify/notices';
import { ErrorBanner } from '../../../ui/error-banner';
import { SignatureList } from '../../archive/signature-list/signature-list';
import { StudyHistory } from '../../archive/study-history';
import { EstimateTables } from '../../studies/findings/comparison/estimate-tables/estimate-tables';
import { FindingsPlots } from '../../studies/findings/comparison/findings-plots/findings-plots';
import { OutlierList } from '../../studies/findings/comparison/outlier-list/outlier-list';
import { SensitivityPanel } from '../../studies/findings/comparison/sensitivity-panel/sensitivity-panel';
import { VerdictPanel } from '../../studies/findings/comparison/verdict-panel/verdict-panel';
import { PrintLayout } from '../../studies/print-layout';
import { SpecimensStore } from '../../studies/specimens/specimens-store';
import { hasKindView, kindView } from '../../studies/kinds';
import { kindLabel, stateLabel } from '../../studies/study-text';
import { StudyRelease } from '../../studies/study/study-release';
import { StudyStore } from '../../studies/study/study-store';
import { ReasonData, ReasonDialog } from '../../signoff/dialogs/reason-dialog';
import { SignatureData, SignatureDialog } from '../../signoff/dialogs/signature-dialog';
import { ExclusionReasons } from '../exclusions/exclusion-reasons';
import { exclusionRows } from '../exclusions/exclusion-rows';
import { ExclusionsTable } from '../exclusions/exclusions-table';
import { mayDecide } from '../../signoff/next-step';
import { PlanCriteria } from '../plan/plan-criteria';
import { ReviewCaution } from '../review-caution';
import { SignatureBlock } from '../signature-block/signature-block';
import { SubmissionNote } from '../submission-note';
import { reportUrl } from '../../signoff/signoff-api';
import { comparisonView } from './comparison-view';
import { ReadOnlyStudyStore } from './read-only-study-store';
import { ReviewStore } from './review-store';

/**
 * The director's review of one study: verdict, caution, plan and what moved after its approval,
 * findings, exclusions, history and signatures; then Return or Sign while it awaits sign-off.
 */
@Component({
  selector: 'app-review-page',
  templateUrl: './review-page.html',
  styleUrl: './review-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  providers: [{ provide: StudyStore, useClass: ReadOnlyStudyStore }, SpecimensStore, ReviewStore],
  imports: [
    NgComponentOutlet, DecimalPipe, MatButtonModule, MatIconModule, MatProgressBarModule, RouterLink, ErrorBanner, PrintLayout, ReviewCaution,
    VerdictPanel, SensitivityPanel, EstimateTables, OutlierList, FindingsPlots, PlanCriteria, ExclusionsTable, ExclusionReasons, SignatureBlock,
    SignatureList, StudyHistory, StudyRelease, SubmissionNote,
  ],
})
export class ReviewPage {
  /** The :id of the route. */
  readonly id = input.required<string>();
  protected readonly store = inject(ReviewStore);
  protected readonly specimens = inject(SpecimensStore);
  private readonly auth = inject(AuthStore);
  private readonly dialogs = inject(MatDialog);
  private readonly notices = inject(Notices);
  private readonly history = viewChild(StudyHistory);

  protected readonly study = this.store.study;
  protected readonly kind = computed(() => (this.study() ? kindLabel(this.study()!) : ''));
  protected readonly state = computed(() => (this.study() ? stateLabel(this.study()!) : ''));
  /** False when the findings say their engine drew no resamples (a kind computed in closed form, such as precision). */
  protected resampled(a: { results: unknown }): boolean {
    return (a.results as { engine?: { resamples?: number } } | null)?.engine?.resamples !== 0;
  }
  protected readonly decide = computed(() => !!this.study() && mayDecide(this.study()!, this.auth.roles()));
  protected readonly pdf = computed(() => (this.study() ? reportUrl(this.study()!.id) : ''));
  /** How the study's kind shows its findings here: the review's comparison panels, or its own Findings panel. */
  private readonly reviewPanel = computed(() => {
    const s = this.study();
    return s && hasKindView(s.kind) ? kindView(s.kind).reviewPanel : null;
  });
  protected readonly comparison = computed(() => {
    const s = this.study();
    const ready = this.specimens.version() > 0 && !this.specimens.loading();
    return s && this.reviewPanel() === 'comparison-view' ? comparisonView(s, this.store.analysis(), this.specimens.rows(), ready) : null;
  });
  protected readonly exclusions = computed(() => exclusionRows(this.specimens.rows(), this.specimens.layout));
  /** The kind's own Findings panel, for a kind whose view asks for it (reviewPanel 'own-panel'). */
  protected readonly panel = signal<Type<unknown> | null>(null);
  protected readonly viewable = computed(() => !!this.study() && hasKindView(this.study()!.kind));
  protected readonly stale = computed(() => {
    const a = this.store.analysis();
    return !!a && a.state === 'done' && !a.current;
  });

  constructor() {
    effect(() => {
      const id = Number(this.id());
      untracked(() => this.store.load(id));
    });
    effect(() => {
      const s = this.study();
      if (!s || this.reviewPanel() !== 'own-panel') return;
      untracked(() => void kindView(s.kind).findings().then((c) => this.panel.set(c)));
    });
  }

  protected openSign(study: Study): void {
    const data: SignatureData = { kind: 'signoff', studyId: study.id, title: study.title };
    this.dialogs
      .open<SignatureDialog, SignatureData, Study>(SignatureDialog, { data, width: '600px', maxWidth: '95vw', autoFocus: 'first-tabbable' })
      .afterClosed()
      .pipe(filter((s): s is Study => !!s))
      .subscribe((signed) => this.moved(signed, 'Signed. The signature, the content hash and the signed PDF are recorded.'));
  }

  protected openReturn(study: Study): void {
    const data: ReasonData = { step: 'return', studyId: study.id, title: study.title };
    this.dialogs
      .open<ReasonDialog, ReasonData, Study>(ReasonDialog, { data, width: '560px', maxWidth: '95vw' })
      .afterClosed()
      .pipe(filter((s): s is Study => !!s))
      .subscribe((returned) => this.moved(returned, 'Returned to draft. The technologist sees your comment on the study and by e-mail.'));
  }

  /** In-page link: the shell scrolls inside its content pane, so the heading is brought into view directly. */
  protected jumpToPlan(event: Event): void {
    event.preventDefault();
    document.getElementById('plan-title')?.scrollIntoView({ behavior: 'smooth', block: 'start' });
  }

  private moved(study: Study, notice: string): void {
    this.store.adopt(study);
    this.history()?.reload();
    this.notices.post(notice);
  }
}
