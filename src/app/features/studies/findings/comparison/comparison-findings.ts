import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked } from '@angular/core';
import type { Analysis, Study } from '@shared/schemas';
import { Notices } from '../../../../core/notify/notices';
import { ErrorBanner } from '../../../../ui/error-banner';
import { COMPARISON_LAYOUT } from '../../specimens/specimen-layout';
import { SpecimensStore } from '../../specimens/specimens-store';
import { StudyStore } from '../../study/study-store';
import { plotPoints } from '../charts/plot-points';
import { asComparison, unitsOf } from './comparison-result';
import { EstimateTables } from './estimate-tables/estimate-tables';
import { FindingsPlots } from './findings-plots/findings-plots';
import { Exclusion, OutlierList } from './outlier-list/outlier-list';
import { pairFlags, pairFormat, pairRows } from './pairs-table/pair-rows';
import { PairsTable } from './pairs-table/pairs-table';
import { SensitivityPanel } from './sensitivity-panel/sensitivity-panel';
import { VerdictPanel } from './verdict-panel/verdict-panel';

/**
 * The Findings of a method comparison, in order: verdict, sensitivity, tables, outliers and warnings, plots, and
 * the table of pairs (a point clicked on a plot and a row chosen in the table are one selected specimen). The
 * plots and the table are drawn after the verdict is on screen: when scrolled into view, or 0.4 s later.
 */
@Component({
  selector: 'app-comparison-findings',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ErrorBanner, VerdictPanel, SensitivityPanel, EstimateTables, OutlierList, FindingsPlots, PairsTable],
  template: `
    @if (result(); as r) {
      <app-verdict-panel [result]="r" [units]="units()!" [source]="study().settings.allowableBiasSource" />
      <app-sensitivity-panel [result]="r" [units]="units()!" />
      <app-estimate-tables [result]="r" [units]="units()!" />
      <app-outlier-list [result]="r" [rows]="specimens.rows()" [canExclude]="current() && studyStore.editable()" (excluded)="exclude($event)" />
      <!-- The verdict and the tables are drawn first; the plots and the table of pairs (120 rows and more) follow as soon
           as they are scrolled into view, or 0.4 s later, so the findings appear a moment after the click. -->
      @defer (on viewport; on timer(400ms)) {
        <app-findings-plots [result]="r" [units]="units()!" [points]="points()" [format]="format()" [flags]="flags()" [(selected)]="selected" />
        <app-pairs-table [rows]="pairs()" [format]="format()!" [(selected)]="selected" />
      } @placeholder {
        <p class="muted" data-testid="plots-drawing">Drawing the plots and the table of pairs…</p>
      }
    } @else {
      <app-error-banner message="These results are not those of a method comparison; Parallax cannot show them here." />
    }
  `,
})
export class ComparisonFindings {
  readonly study = input.required<Study>();
  readonly analysis = input.required<Analysis>();
  readonly results = input.required<unknown>();

  protected readonly specimens = inject(SpecimensStore);
  protected readonly studyStore = inject(StudyStore);
  private readonly notices = inject(Notices);
  protected readonly result = computed(() => asComparison(this.results()));
  protected readonly units = computed(() => (this.result() ? unitsOf(this.study(), this.result()!) : null));
  /** The analysed rows are the saved rows while the findings are current and nothing on screen is unsaved. */
  protected readonly current = computed(
    () => this.analysis().current && this.study().findings !== 'out-of-date' && this.specimens.status() === 'saved' && !this.specimens.loading(),
  );
  protected readonly points = computed(() =>
    this.current() && this.result() ? plotPoints(this.specimens.rows(), this.result()!.differenceType) : null,
  );
  /** How pairs are written in the table and in the points' tooltips: as reported, in the study's decimals. */
  protected readonly format = computed(() => (this.result() ? pairFormat(this.study().settings, this.units()!.unit, this.result()!.differenceType) : null));
  protected readonly pairs = computed(() => {
    const points = this.points();
    return points && this.result() ? pairRows(points, this.specimens.rows(), this.result()!) : null;
  });
  protected readonly flags = computed(() => new Map((this.pairs() ?? []).map((p) => [p.position, pairFlags(p)])));
  /** The grid position of the specimen selected on a plot or in the table of pairs. */
  protected readonly selected = signal<number | null>(null);

  constructor() {
    effect(() => {
      const study = this.study();
      untracked(() => this.specimens.ensureLoaded(study.id, COMPARISON_LAYOUT));
    });
  }

  protected exclude(change: Exclusion): void {
    this.specimens.exclude(change.position - 1, change.reason);
    this.notices.post(`Row ${change.position} is excluded with its reason. Run the analysis again to update the findings.`);
  }
}
