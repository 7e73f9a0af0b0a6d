import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, input, viewChild } from '@angular/core';
import type { ChartData, ChartOptions, ChartType } from 'chart.js';
import { BaseChartDirective, provideCharts } from 'ng2-charts';
import { CHART_SETUP } from './chart-setup';
import { Markers, labelPadding, markerRange } from './markers-plugin';

/** One plot of the Findings: a titled figure with its caption, axes named with their units. */
@Component({
  selector: 'app-findings-chart',
  changeDetection: ChangeDetectionStrategy.OnPush,
  providers: [provideCharts(CHART_SETUP)],
  imports: [BaseChartDirective],
  template: `
    <figure class="plot" [attr.data-testid]="testId()">
      <figcaption>
        <strong>{{ heading() }}</strong>
        @if (caption()) { <span class="muted">{{ caption() }}</span> }
      </figcaption>
      <div class="canvas"><canvas baseChart [type]="type()" [data]="data()" [options]="options()" [attr.aria-label]="heading()" role="img"></canvas></div>
    </figure>
  `,
  styles: `
    .plot { margin: 0; padding: 12px; border: 1px solid var(--mat-sys-outline-variant); border-radius: 12px; background: var(--mat-sys-surface); break-inside: avoid; }
    figcaption { display: flex; flex-direction: column; gap: 2px; margin-bottom: 8px; font: var(--mat-sys-body-medium); }
    .canvas { position: relative; height: 300px; }
    @media print {
      .canvas { height: auto; }
      canvas { max-width: 100% !important; height: auto !important; }
    }
  `,
})
export class FindingsChart {
  readonly type = input.required<ChartType>();
  readonly data = input.required<ChartData>();
  readonly heading = input.required<string>();
  readonly caption = input('');
  readonly xTitle = input('');
  readonly yTitle = input('');
  readonly markers = input<Markers>({ lines: [], bands: [] });
  /** Bars that touch, as a histogram's do. */
  readonly histogram = input(false);
  readonly testId = input('plot');
  private readonly chart = viewChild(BaseChartDirective);

  constructor() {
    // The printed page is narrower than the screen: redraw the canvas to the paper's width and back.
    const fit = (): void => this.chart()?.chart?.resize();
    window.addEventListener('beforeprint', fit);
    window.addEventListener('afterprint', fit);
    inject(DestroyRef).onDestroy(() => {
      window.removeEventListener('beforeprint', fit);
      window.removeEventListener('afterprint', fit);
    });
  }

  /** The scale reaches every marker (a limit of agreement may lie beyond every point). */
  private range(axis: 'x' | 'y'): { suggestedMin?: number; suggestedMax?: number } {
    const r = markerRange(this.markers(), axis);
    if (!r) return {};
    const pad = (r[1] - r[0]) * 0.05 || Math.abs(r[0]) * 0.05 || 0.1;
    return { suggestedMin: r[0] - pad, suggestedMax: r[1] + pad };
  }

  protected readonly options = computed<ChartOptions>(() => ({
    responsive: true,
    maintainAspectRatio: false,
    animation: false,
    layout: { padding: labelPadding(this.markers()) },
    scales: {
      x: { type: 'linear', title: { display: !!this.xTitle(), text: this.xTitle() }, offset: this.histogram(), ...this.range('x') },
      y: { type: 'linear', title: { display: !!this.yTitle(), text: this.yTitle() }, beginAtZero: this.histogram(), ...this.range('y') },
    },
    datasets: { bar: { barPercentage: 1, categoryPercentage: 1, grouped: false } },
    plugins: {
      legend: { display: !this.histogram(), position: 'bottom', labels: { boxWidth: 12 } },
      parallaxMarkers: this.markers(),
    },
  }));
}
