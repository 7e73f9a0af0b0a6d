import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { Analysis, Study } from '@shared/schemas';
import { Notices } from '../../../../core/notify/notices';
import { ErrorBanner } from '../../../../ui/error-banner';
import { levelLabel } from '../../findings/comparison/number-format';
import type { Exclusion } from '../../findings/comparison/outlier-list/outlier-list';
import { StudyStore } from '../../study/study-store';
import { percentileWords } from '../setup/percentile-choices';
import { valueFormat } from './interval-format';
import { IntervalOutliers } from './interval-outliers';
import { IntervalPlots } from './interval-plots';
import { asEstablish, intervalStepWords } from './interval-result';
import { METHOD_WORDS } from './interval-wording';
import { LimitsTable } from './limits-table';
import { INTERVAL_LAYOUT } from '../interval-layout';
import { savedRows } from './saved-rows';
import { PartitionPanel } from './partition-panel';

/** The Findings of establishing a reference interval: the limits, the partitions, the outliers and warnings, the histograms. */
@Component({
  selector: 'app-establish-findings',
  styleUrl: './interval-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule, ErrorBanner, LimitsTable, PartitionPanel, IntervalOutliers, IntervalPlots],
  template: `
    @if (result(); as r) {
      <section class="panel" aria-labelledby="limits-heading" data-testid="interval-limits">
        <h2 id="limits-heading">Reference limits: {{ percentiles() }}</h2>
        <p data-testid="interval-counts">n = {{ r.n }} analysed of {{ r.nTotal }} entered; {{ r.excludedCount }} excluded with a reason.</p>
        @if (steps().rule; as rule) {
          <p class="resolution-rule" data-testid="resolution-rule"><mat-icon aria-hidden="true">straighten</mat-icon><span>{{ rule }}</span></p>
        }
        <app-limits-table [lower]="r.lower" [upper]="r.upper" [lowerNote]="steps().notes['lower'] ?? ''" [upperNote]="steps().notes['upper'] ?? ''" [decimals]="format().decimals" [unit]="format().unit" [confidence]="r.settings.level" />
        <p class="small" data-testid="interval-method">{{ methodText() }}@if (r.boxCoxLambda !== null) { Box–Cox λ = {{ r.boxCoxLambda.toFixed(2) }}.}</p>
        <p class="small">{{ level() }} CIs; the bootstrap used {{ r.settings.resamples.toLocaleString('en') }} resamples with seed {{ r.settings.seed }}.</p>
        @if (r.warnings.length > 0) {
          <h3>Warnings</h3>
          <ul class="warnings" data-testid="warnings">
            @for (w of r.warnings; track $index) { <li>{{ w }}</li> }
          </ul>
        }
      </section>
      @if (r.partitions.length > 0) {
        <app-partition-panel [partitions]="r.partitions" [stepNotes]="steps().notes" [decimals]="format().decimals" [unit]="format().unit" [confidence]="r.settings.level" />
      }
      <app-interval-outliers [result]="r" [rows]="specimens.rows()" [decimals]="format().decimals" [canExclude]="current() && studyStore.editable()" (excluded)="exclude($event)" />
      <app-interval-plots [result]="r" [rows]="current() ? specimens.rows() : null" [unit]="format().unit" [label]="format().label" />
    } @else {
      <app-error-banner message="These results are not those of a reference-interval establishment; Parallax cannot show them here." />
    }
  `,
})
export class EstablishFindings {
  readonly study = input.required<Study>();
  readonly analysis = input.required<Analysis>();
  readonly results = input.required<unknown>();

  private readonly rows = savedRows(this.study, this.analysis, INTERVAL_LAYOUT);
  protected readonly specimens = this.rows.store;
  /** The analysed rows are the saved rows while the findings are current and nothing on screen is unsaved. */
  protected readonly current = this.rows.current;
  protected readonly studyStore = inject(StudyStore);
  private readonly notices = inject(Notices);
  protected readonly result = computed(() => asEstablish(this.results()));
  protected readonly format = computed(() => valueFormat(this.study()));
  /** What the reporting step allows: the rule once above the limits, and the words beside each limited limit. */
  protected readonly steps = computed(() => intervalStepWords(this.result()!, this.format().unit));
  protected readonly percentiles = computed(() => percentileWords(this.result()!.percentiles));
  protected readonly level = computed(() => levelLabel(this.result()!.settings.level));
  protected readonly methodText = computed(() => {
    const r = this.result()!;
    return `Method: ${METHOD_WORDS[r.method] ?? r.method} Chosen in Setup; n = ${r.n} analysed.`;
  });

  protected exclude(change: Exclusion): void {
    this.specimens.exclude(change.position - 1, change.reason);
    this.notices.post(`Row ${change.position} is excluded with its reason. Run the analysis again to update the findings.`);
  }
}
