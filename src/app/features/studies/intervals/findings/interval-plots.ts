import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { ChartData } from 'chart.js';
import { binStep, stepDecimals } from '@shared/types/plot-axes';
import { FindingsChart } from '../../findings/charts/findings-chart';
import { formatNumber } from '../../findings/comparison/number-format';
import type { GridRow } from '../../specimens/specimen-layout';
import { type PlacedValue, analysedValues, valueHistogram } from './interval-charts';
import type { EstablishResult } from './interval-result';
import { PARTITION_FIELD_WORDS } from './interval-wording';

/**
 * Histograms of the reference values with the limits and their CIs: all values, then each subgroup when
 * partitioned. Bins lie at half-steps of the reporting step (as in the PDF); hovering a bar names its range,
 * its count and the individuals in it.
 */
@Component({
  selector: 'app-interval-plots',
  styleUrl: './interval-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [FindingsChart],
  template: `
    <section aria-labelledby="interval-plots-heading" data-testid="plots">
      <h2 id="interval-plots-heading">Plots</h2>
      @if (!rows()) {
        <p class="muted" data-testid="plots-stale">The rows changed after this analysis, so the values are not drawn; run the analysis again to plot them.</p>
      } @else {
        <div class="plots">
          @for (p of plots(); track p.testId) {
            <app-findings-chart type="bar" [data]="p.data" [markers]="p.markers" [xAxis]="p.axes.x" [yAxis]="p.axes.y" [histogram]="true" [heading]="p.heading" [caption]="caption" [xTitle]="xTitle()" yTitle="Individuals" [testId]="p.testId" />
          }
        </div>
      }
    </section>
  `,
})
export class IntervalPlots {
  readonly result = input.required<EstablishResult>();
  /** The grid rows, or null when they changed since the analysis. */
  readonly rows = input<readonly GridRow[] | null>(null);
  readonly unit = input('');
  readonly label = input.required<(v: number) => string>();

  protected readonly caption = 'Solid lines: the limits. Shaded: their bootstrap CIs; dashed: their rank-based CIs. Light bars lie beyond a limit.';
  protected readonly xTitle = computed(() => (this.unit() ? `Value (${this.unit()})` : 'Value'));
  protected readonly plots = computed(() => {
    const rows = this.rows();
    const r = this.result();
    if (!rows) return [];
    const all = analysedValues(rows);
    // The reporting step the engine used (older results carry none); the bins' own step follows from it and the values, as in the PDF.
    const resolution = r.resolution?.increment ?? null;
    const words = { value: (v: number) => formatNumber(v, stepDecimals(binStep(all.map((v) => v.value), resolution))), unit: this.unit() };
    const plot = (values: PlacedValue[], lower: EstablishResult['lower'], upper: EstablishResult['upper'], heading: string, testId: string) => {
      const h = valueHistogram(values, lower, upper, this.label(), resolution, words);
      return { heading, testId, markers: h.markers, axes: h.axes, data: { datasets: [{ type: 'bar', label: 'Individuals', data: h.bars, backgroundColor: h.colors }] } as ChartData };
    };
    const whole = plot(all, r.lower, r.upper, `All reference values (n = ${r.n})`, 'plot-values');
    const groups = r.partitions
      .filter((p) => p.recommended && p.intervals)
      .flatMap((p) => p.intervals!.map((i) => plot(
        analysedValues(rows, { field: p.field, group: i.group }), i.lower, i.upper,
        `${PARTITION_FIELD_WORDS[p.field] ?? p.field} ${i.group} (n = ${i.n})`, `plot-values-${p.field}-${i.group}`,
      )));
    return [whole, ...groups];
  });
}
