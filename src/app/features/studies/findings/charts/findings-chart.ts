import { ChangeDetectionStrategy, Component, computed, input, output, signal, viewChild } from '@angular/core';
import type { ActiveElement, Chart, ChartData, ChartEvent, ChartOptions, ChartType, TooltipModel } from 'chart.js';
import { BaseChartDirective, provideCharts } from 'ng2-charts';
import type { PlotAxis } from '@shared/types/plot-axes';
import { CHART_SETUP } from './chart-setup';
import { keyOf, legendEntries, linearScale, tipOf } from './chart-options';
import type { Markers } from './markers-plugin';
import { fitChartOnPrint } from './print-fit';

interface Tip {
  title: string;
  lines: string[];
  left: number;
  top: number;
  flip: boolean;
}

/**
 * One plot of the Findings: a titled figure with its caption, axes named with their units and padded so no
 * point is cut, a legend under it (HTML) that names every line with its value, and a tooltip (HTML, so it can be read,
 * copied and tested) naming what is under the pointer. A click on a specimen's point emits its grid position.
 */
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
      <div class="canvas" (mouseleave)="tip.set(null)">
        <canvas baseChart [type]="type()" [data]="data()" [options]="options()" [attr.aria-label]="heading()" role="img"></canvas>
        @if (tip(); as t) {
          <div class="tip" role="tooltip" data-testid="plot-tip" [class.flip]="t.flip" [style.left.px]="t.left" [style.top.px]="t.top">
            <strong>{{ t.title }}</strong>
            @for (line of t.lines; track $index) { <span>{{ line }}</span> }
          </div>
        }
      </div>
      @if (legend().length) {
        <ul class="legend" data-testid="plot-legend">
          @for (e of legend(); track $index) {
            <li>
              <svg width="28" height="12" viewBox="0 0 28 12" aria-hidden="true">
                @switch (e.kind) {
                  @case ('point') { <circle cx="14" cy="6" r="4" [attr.fill]="e.fill" [attr.stroke]="e.color" stroke-width="1" /> }
                  @case ('ring') { <circle cx="14" cy="6" r="4.5" fill="none" [attr.stroke]="e.color" stroke-width="2" /> }
                  @case ('cross') { <path d="M10 2 L18 10 M10 10 L18 2" [attr.stroke]="e.color" stroke-width="2" /> }
                  @case ('diamond') { <path d="M14 0.5 L19.5 6 L14 11.5 L8.5 6 Z" [attr.fill]="e.fill" [attr.stroke]="e.color" stroke-width="1.5" /> }
                  @case ('rect') { <rect x="2" y="1" width="24" height="10" [attr.fill]="e.fill" /> }
                  @case ('area') {
                    <rect x="2" y="1" width="24" height="10" [attr.fill]="e.fill" />
                    <path d="M2 1.5 H26 M2 10.5 H26" [attr.stroke]="e.color" stroke-width="1" [attr.stroke-dasharray]="dash(e.dash)" />
                  }
                  @case ('triangle') {
                    <path d="M14 2 V12" [attr.stroke]="e.color" stroke-width="1" [attr.stroke-dasharray]="dash(e.dash)" />
                    <path d="M14 4 L19 12 L9 12 Z" [attr.fill]="e.color" />
                  }
                  @default { <path d="M1 6 H27" [attr.stroke]="e.color" [attr.stroke-width]="e.width ?? 1.5" [attr.stroke-dasharray]="dash(e.dash)" /> }
                }
              </svg>
              <span>{{ e.text }}</span>
            </li>
          }
        </ul>
      }
    </figure>
  `,
  styles: `
    .plot { margin: 0; padding: 12px; border: 1px solid var(--mat-sys-outline-variant); border-radius: 12px; background: var(--mat-sys-surface); break-inside: avoid; }
    figcaption { display: flex; flex-direction: column; gap: 2px; margin-bottom: 8px; font: var(--mat-sys-body-medium); }
    .canvas { position: relative; height: 320px; }
    .tip {
      position: absolute; z-index: 2; pointer-events: none; display: flex; flex-direction: column; gap: 1px;
      transform: translate(12px, -50%); padding: 6px 10px; border-radius: 6px; white-space: nowrap;
      background: #1d2731; color: #fff; font: var(--mat-sys-body-small); box-shadow: 0 2px 6px rgba(0, 0, 0, 0.25);
    }
    .tip.flip { transform: translate(calc(-100% - 12px), -50%); }
    .tip strong { font-weight: 600; }
    .legend { list-style: none; display: flex; flex-wrap: wrap; gap: 4px 16px; margin: 8px 0 0; padding: 0; font: var(--mat-sys-body-small); color: var(--mat-sys-on-surface); }
    .legend li { display: flex; align-items: center; gap: 6px; }
    .legend svg { flex: none; }
    @media print {
      .canvas { height: auto; }
      canvas { max-width: 100% !important; height: auto !important; }
      .tip { display: none; }
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
  /** The axes, computed with the data (padded, nice ticks); chart.js chooses its own when none is given. */
  readonly xAxis = input<PlotAxis | null>(null);
  readonly yAxis = input<PlotAxis | null>(null);
  /** Bars that touch, as a histogram's do; their dataset is not named in the legend. */
  readonly histogram = input(false);
  readonly testId = input('plot');
  /** The grid position of the specimen whose point was clicked. */
  readonly picked = output<number>();
  protected readonly tip = signal<Tip | null>(null);
  /** The legend under the plot (HTML): every dataset and every labelled marker, with its value. */
  protected readonly legend = computed(() => legendEntries(this.data().datasets as never, this.markers(), this.histogram()));
  protected dash(d: number[] | undefined): string | null {
    return d && d.length ? d.join(' ') : null;
  }
  private readonly chart = viewChild(BaseChartDirective);

  constructor() {
    fitChartOnPrint(this.chart);
  }

  private showTip(chart: Chart, tooltip: TooltipModel<ChartType>): void {
    const item = tooltip.dataPoints?.[0];
    const lines = item ? tipOf(item.raw) : null;
    if (tooltip.opacity === 0 || !lines) {
      if (this.tip() !== null) this.tip.set(null);
      return;
    }
    const [title, ...rest] = lines;
    const flip = tooltip.caretX > chart.width * 0.6;
    this.tip.set({ title, lines: rest, left: tooltip.caretX, top: tooltip.caretY, flip });
  }

  protected readonly options = computed<ChartOptions>(() => {
    const markers = this.markers();
    const histogram = this.histogram();
    return {
      responsive: true,
      maintainAspectRatio: false,
      animation: false,
      interaction: { mode: 'nearest', intersect: true },
      onClick: (_e: ChartEvent, elements: ActiveElement[], chart: Chart) => {
        const key = keyOf(chart, elements);
        if (key !== null) this.picked.emit(key);
      },
      onHover: (e: ChartEvent, elements: ActiveElement[], chart: Chart) => {
        const target = e.native?.target as HTMLElement | undefined;
        if (target) target.style.cursor = keyOf(chart, elements) !== null ? 'pointer' : 'default';
      },
      scales: {
        x: linearScale(this.xAxis(), this.xTitle(), histogram && !this.xAxis()),
        y: { ...linearScale(this.yAxis(), this.yTitle()), beginAtZero: histogram },
      },
      datasets: { bar: { barPercentage: 1, categoryPercentage: 1, grouped: false } },
      plugins: {
        legend: { display: false },
        tooltip: {
          enabled: false,
          filter: (item) => tipOf(item.raw) !== null,
          external: ({ chart, tooltip }) => this.showTip(chart, tooltip),
        },
        parallaxMarkers: markers,
      },
    } as ChartOptions;
  });
}
