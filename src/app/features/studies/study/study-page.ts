import { ChangeDetectionStrategy, Component, computed, effect, inject, input, untracked } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTabsModule } from '@angular/material/tabs';
import { RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { ErrorBanner } from '../../../ui/error-banner';
import { SignoffBar } from './signoff-bar/signoff-bar';
import { PrintLayout } from '../print-layout';
import { AnalysisStore } from '../findings/analysis-store';
import { SpecimensStore } from '../specimens/specimens-store';
import { hasKindView } from '../kinds';
import { FINDINGS_LABELS, kindLabel, stateLabel } from '../study-text';
import { StudyRelease } from './study-release';
import { StudyStore } from './study-store';

/** One study: its heading and the Setup, Specimens and Findings tabs (each a child route). */
@Component({
  selector: 'app-study-page',
  templateUrl: './study-page.html',
  styleUrl: './study-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  providers: [StudyStore, SpecimensStore, AnalysisStore],
  imports: [MatTabsModule, MatIconModule, MatProgressBarModule, RouterLink, RouterLinkActive, RouterOutlet, ErrorBanner, PrintLayout, SignoffBar, StudyRelease],
})
export class StudyPage {
  /** The :id of the route. */
  readonly id = input.required<string>();
  protected readonly store = inject(StudyStore);

  protected readonly study = this.store.study;
  protected readonly tabs = [
    { path: 'setup', label: 'Setup', icon: 'tune' },
    { path: 'specimens', label: 'Specimens', icon: 'table_rows' },
    { path: 'findings', label: 'Findings', icon: 'insights' },
    { path: 'history', label: 'History', icon: 'history' },
  ];
  protected readonly supported = computed(() => {
    const s = this.study();
    return !s || hasKindView(s.kind);
  });
  protected readonly kind = computed(() => (this.study() ? kindLabel(this.study()!) : ''));
  protected readonly state = computed(() => (this.study() ? stateLabel(this.study()!) : ''));
  protected readonly findings = computed(() => (this.study() ? FINDINGS_LABELS[this.study()!.findings] : ''));
  protected readonly canEdit = this.store.editable;

  constructor() {
    effect(() => {
      const id = Number(this.id());
      untracked(() => this.store.load(id));
    });
  }
}
