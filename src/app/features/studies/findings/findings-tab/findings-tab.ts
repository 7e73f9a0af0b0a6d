import { DecimalPipe, NgComponentOutlet } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, Type, computed, effect, inject, signal, untracked } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { CAUTION } from '@shared/text/caution';
import { ErrorBanner } from '../../../../ui/error-banner';
import { ActionBanner } from '../../action-banner';
import { SpecimensStore } from '../../specimens/specimens-store';
import { kindView } from '../../kinds';
import { StudyStore } from '../../study/study-store';
import { AnalysisStore } from '../analysis-store';
import { failureText, runStateText } from './run-state';

/**
 * The Findings tab: run the analysis and follow it, say when findings are out of date or failed, and
 * show the kind's own findings panel, always under the decision-support caution.
 */
@Component({
  selector: 'app-findings-tab',
  templateUrl: './findings-tab.html',
  styleUrl: './findings-tab.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [NgComponentOutlet, DecimalPipe, MatButtonModule, MatIconModule, MatProgressBarModule, ErrorBanner, ActionBanner],
})
export class FindingsTab {
  protected readonly study = inject(StudyStore);
  protected readonly analyses = inject(AnalysisStore);
  private readonly specimens = inject(SpecimensStore);
  protected readonly caution = CAUTION;
  protected readonly staleText =
    'The rows or settings changed after these findings were made; they describe the earlier data. Run the analysis again to bring them up to date.';
  protected readonly panel = signal<Type<unknown> | null>(null);
  private readonly now = signal(Date.now());

  protected readonly analysis = this.analyses.analysis;
  protected readonly runText = computed(() => (this.analysis() ? runStateText(this.analysis()!, this.now()) : ''));
  protected readonly failure = computed(() => (this.analysis()?.state === 'failed' ? failureText(this.analysis()!) : null));
  protected readonly outOfDate = computed(() => {
    const a = this.analysis();
    return this.study.study()?.findings === 'out-of-date' || (a?.state === 'done' && !a.current);
  });
  protected readonly unsavedRows = computed(() => this.specimens.status() !== 'saved' && this.specimens.version() > 0);
  protected readonly canRun = computed(() => this.study.editable() && !this.analyses.working() && !this.unsavedRows());
  protected readonly results = computed(() => (this.analysis()?.state === 'done' ? this.analysis()!.results : null));
  /** False when the finished findings say their engine drew no resamples (a kind computed in closed form, such as precision). */
  protected readonly resampled = computed(() => (this.results() as { engine?: { resamples?: number } } | null)?.engine?.resamples !== 0);

  constructor() {
    effect(() => {
      const study = this.study.study();
      if (!study) return;
      untracked(() => {
        const view = kindView(study.kind);
        // The rows are read with the kind's layout before its panel opens, so a panel may take them as loaded.
        this.specimens.ensureLoaded(study.id, view.layout);
        if (!this.panel()) void view.findings().then((component) => this.panel.set(component));
        const id = study.latestAnalysisId;
        if (id !== null && !this.analyses.analysis() && !this.analyses.working()) this.analyses.follow(id);
      });
    });
    const tick = setInterval(() => this.analyses.working() && this.now.set(Date.now()), 1000);
    inject(DestroyRef).onDestroy(() => clearInterval(tick));
  }

  protected run(): void {
    const id = this.study.study()?.id;
    if (id !== undefined) this.analyses.run(id);
  }
}
