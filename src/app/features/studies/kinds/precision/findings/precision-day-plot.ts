import { ChangeDetectionStrategy, Component, computed, input, viewChild } from '@angular/core';
import type { ChartData, ChartOptions } from 'chart.js';
import { BaseChartDirective, provideCharts } from 'ng2-charts';
import { legendEntries } from '../../../findings/charts/chart-options';
import { CHART_SETUP } from '../../../findings/charts/chart-setup';
import { dayPlotOptions, type DayPlot } from './precision-chart';
import { fitChartOnPrint } from '../../../findings/charts/print-fit';

/**
 * One material's results by day, drawn as the other Findings plots are (chart.js through ng2-charts, the same
 * parts, palette and markers): a titled figure with its caption, the plot described in words as the canvas's
 * accessible label and under it, and a legend (HTML) naming the results, the flagged replicates, the day means
 * and the grand mean with its value. Its own component because its x axis names days, not numbers.
 */
@Component({
  selector: 'app-precision-day-plot',
  changeDetection: ChangeDetectionStrategy.OnPush,
  providers: [provideCharts(CHART_SETUP)],
  imports: [BaseChartDirective],
  template: `
    <figure class="plot" [attr.data-testid]="testId()">
      <figcaption>
        <strong>{{ heading() }}</strong>
        <span class="muted">{{ caption }}</span>
      </figcaption>
      <div class="canvas">
        <canvas baseChart type="scatter" [data]="data()" [options]="options()" [attr.aria-label]="plot().summary" role="img"></canvas>
      </div>
      <ul class="legend" data-testid="plot-legend">
        @for (e of legend(); track $index) {
          <li>
            <svg width="28" height="12" viewBox="0 0 28 12" aria-hidden="true">
              @switch (e.kind) {
                @case ('point') { <circle cx="14" cy="6" r="4" [attr.fill]="e.fill" [attr.stroke]="e.color" stroke-width="1" /> }
                @case ('diamond') { <path d="M14 0.5 L19.5 6 L14 11.5 L8.5 6 Z" [attr.fill]="e.fill" [attr.stroke]="e.color" stroke-width="1.5" /> }
                @default { <path d="M4 6 H24" [attr.stroke]="e.color" [attr.stroke-width]="e.width ?? 1.5" [attr.stroke-dasharray]="dash(e.dash)" /> }
              }
            </svg>
            <span>{{ e.text }}</span>
          </li>
        }
      </ul>
      <p class="summary" data-testid="plot-summary">{{ plot().summary }}</p>
    </figure>
  `,
  styles: `
    .plot { margin: 0; padding: 12px; border: 1px solid var(--mat-sys-outline-variant); border-radius: 12px; background: var(--mat-sys-surface); break-inside: avoid; }
    figcaption { display: flex; flex-direction: column; gap: 2px; margin-bottom: 8px; font: var(--mat-sys-body-medium); }
    .canvas { position: relative; height: 300px; }
    .legend { list-style: none; display: flex; flex-wrap: wrap; gap: 4px 16px; margin: 8px 0 0; padding: 0; font: var(--mat-sys-body-small); color: var(--mat-sys-on-surface); }
    .legend li { display: flex; align-items: center; gap: 6px; }
    .legend svg { flex: none; }
    .summary { margin: 8px 0 0; font: var(--mat-sys-body-small); color: var(--mat-sys-on-surface-variant); }
    @media print {
      .canvas { height: auto; }
      canvas { max-width: 100% !important; height: auto !important; }
    }
  `,
})
export class PrecisionDayPlot {
  readonly plot = input.required<DayPlot>();
  readonly heading = input.required<string>();
  /** The results' axis title, with the unit. */
  readonly yTitle = input('Result');
  readonly testId = input('plot-days');

  protected readonly caption =
    'Each day a column: its results as dots (diamonds: flagged replicates), its mean as a short bar; the dashed line is the grand mean. A day far from the line, or widely spread, stands out.';
  protected readonly data = computed(() => ({ datasets: this.plot().datasets }) as ChartData<'scatter'>);
  protected readonly options = computed(() => dayPlotOptions(this.plot(), this.yTitle()) as ChartOptions<'scatter'>);
  protected readonly legend = computed(() => legendEntries(this.plot().datasets as never, this.plot().markers, false));
  protected dash(d: number[] | undefined): string | null {
    return d && d.length ? d.join(' ') : null;
  }
  private readonly chart = viewChild(BaseChartDirective);

  constructor() {
    fitChartOnPrint(this.chart);
  }
}
