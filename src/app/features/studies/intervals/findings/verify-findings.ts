import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { ChartData } from 'chart.js';
import type { Analysis, Study } from '@shared/schemas';
import { ErrorBanner } from '../../../../ui/error-banner';
import { FindingsChart } from '../../findings/charts/findings-chart';
import { formatP } from '../../findings/comparison/number-format';
import { analysedValues, stripData } from './interval-charts';
import { valueFormat } from './interval-format';
import { asVerify } from './interval-result';
import { INTERVAL_LAYOUT } from '../interval-layout';
import { savedRows } from './saved-rows';
import { acceptanceWords, outsideWords, powerWords } from './interval-wording';

/** The Findings of verifying a stated reference interval: the count outside, the decision in words, its power, and a strip plot. */
@Component({
  selector: 'app-verify-findings',
  styleUrl: './interval-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ErrorBanner, FindingsChart],
  template: `
    @if (result(); as r) {
      <section class="panel" aria-labelledby="verify-heading" data-testid="verify-panel">
        <h2 id="verify-heading">Transference of the stated interval</h2>
        <p class="verdict" [class.accepted]="r.accepted" [class.refused]="!r.accepted" data-testid="verify-acceptance">{{ acceptance() }}</p>
        <p data-testid="verify-outside">{{ outside() }}</p>
        @if (!r.accepted) {
          <p data-testid="verify-advice"><strong>{{ r.advice }}</strong></p>
        }
        <table>
          <tbody>
            <tr><th scope="row">Individuals analysed</th><td class="num" data-testid="verify-n">{{ r.n }}</td></tr>
            <tr><th scope="row">Excluded with a reason</th><td class="num">{{ r.excludedCount }}</td></tr>
            <tr><th scope="row">Outside the stated limits</th><td class="num">{{ r.outside }} ({{ r.below }} below, {{ r.above }} above)</td></tr>
            <tr><th scope="row">Allowed outside (10%)</th><td class="num">{{ r.allowedOutside }}</td></tr>
            <tr><th scope="row">Probability of this many or more outside if the interval fits (5% expected outside)</th><td class="num" data-testid="verify-probability">{{ probability() }}</td></tr>
            <tr><th scope="row">Source of the stated interval</th><td data-testid="verify-source">{{ source() }}</td></tr>
          </tbody>
        </table>
        <p class="small" data-testid="verify-power">{{ power() }}</p>
        @if (r.warnings.length > 0) {
          <h3>Warnings</h3>
          <ul class="warnings" data-testid="warnings">
            @for (w of r.warnings; track $index) { <li>{{ w }}</li> }
          </ul>
        }
      </section>
      @if (strip(); as s) {
        <app-findings-chart type="scatter" [data]="s.data" [markers]="s.markers" [xAxis]="s.axes.x" [yAxis]="s.axes.y" heading="Values against the stated limits" caption="Each individual at its row; shaded: the stated interval; diamonds: outside it. Hover a point to name the individual." [xTitle]="xTitle()" yTitle="Row" testId="plot-strip" />
      } @else {
        <p class="muted" data-testid="plots-stale">The rows changed after this analysis, so the values are not drawn; run the analysis again to plot them.</p>
      }
    } @else {
      <app-error-banner message="These results are not those of a reference-interval verification; Parallax cannot show them here." />
    }
  `,
})
export class VerifyFindings {
  readonly study = input.required<Study>();
  readonly analysis = input.required<Analysis>();
  readonly results = input.required<unknown>();

  private readonly rows = savedRows(this.study, this.analysis, INTERVAL_LAYOUT);
  protected readonly result = computed(() => asVerify(this.results()));
  /** Measured values and stated limits are written as reported: the study's decimals, none added. */
  private readonly format = computed(() => valueFormat(this.study(), 0));
  protected readonly acceptance = computed(() => acceptanceWords(this.result()!));
  protected readonly outside = computed(() => outsideWords(this.result()!, this.study().settings.decimals));
  protected readonly power = computed(() => powerWords(this.result()!.passRiskAt10Percent));
  protected readonly probability = computed(() => formatP(this.result()!.probability));
  /**
   * Where the stated interval comes from: a record-only setting, so the study's own (as Setup holds it now; the
   * server adds the same to the results it serves), else the results' copy.
   */
  protected readonly source = computed(() => this.study().settings.statedSource.trim() || this.result()?.stated.source?.trim() || '—');
  protected readonly xTitle = computed(() => (this.format().unit ? `Value (${this.format().unit})` : 'Value'));
  protected readonly strip = computed(() => {
    const r = this.result();
    if (!r || !this.rows.current()) return null;
    const s = stripData(analysedValues(this.rows.store.rows()), r.stated, this.format().label, 10 ** -this.study().settings.decimals);
    return { data: { datasets: s.datasets } as ChartData, markers: s.markers, axes: s.axes };
  });
}
