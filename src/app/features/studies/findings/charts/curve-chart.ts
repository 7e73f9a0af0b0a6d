import { ChangeDetectionStrategy, Component, computed, input, viewChild } from '@angular/core';
import { BaseChartDirective, provideCharts } from 'ng2-charts';
import { CHART_SETUP } from './chart-setup';
import { curveData, curveOptions, type Curves } from './curves';
import { fitChartOnPrint } from './print-fit';

/**
 * A plot of curves (a probability or a width against a number), drawn as the Findings plots are (chart.js through
 * ng2-charts, the same parts and markers): a titled figure with its caption, and under it a legend (HTML) that draws
 * each curve's dash and point shape as the plot does, so no curve is told apart by colour alone, then each line at a
 * set value with its words.
 */
@Component({
  selector: 'app-curve-chart',
  changeDetection: ChangeDetectionStrategy.OnPush,
  providers: [provideCharts(CHART_SETUP)],
  imports: [BaseChartDirective],
  template: `
    <figure class="plot" [attr.data-testid]="testId()">
      <figcaption>
        <strong>{{ heading() }}</strong>
        @if (caption()) { <span class="muted">{{ caption() }}</span> }
      </figcaption>
      <div class="canvas">
        <canvas baseChart type="scatter" [data]="data()" [options]="options()" [attr.aria-label]="curves().summary" role="img"></canvas>
      </div>
      <ul class="legend" data-testid="plot-legend">
        @for (s of curves().series; track $index) {
          <li>
            <svg width="34" height="14" viewBox="0 0 34 14" aria-hidden="true">
              <path d="M1 7 H33" [attr.stroke]="s.color" stroke-width="2" [attr.stroke-dasharray]="dash(s.dash)" />
              @switch (s.marker) {
                @case ('triangle') { <path d="M17 2.5 L21.5 10.5 L12.5 10.5 Z" [attr.fill]="s.color" /> }
                @case ('rect') { <rect x="13" y="3" width="8" height="8" [attr.fill]="s.color" /> }
                @case ('rectRot') { <path d="M17 1.5 L22.5 7 L17 12.5 L11.5 7 Z" [attr.fill]="s.color" /> }
                @case ('crossRot') { <path d="M13.5 3.5 L20.5 10.5 M13.5 10.5 L20.5 3.5" [attr.stroke]="s.color" stroke-width="2" /> }
                @case ('star') { <path d="M17 2 V12 M12 7 H22 M13.5 3.5 L20.5 10.5 M13.5 10.5 L20.5 3.5" [attr.stroke]="s.color" stroke-width="1.5" /> }
                @default { <circle cx="17" cy="7" r="4" [attr.fill]="s.color" /> }
              }
            </svg>
            <span>{{ s.label }}</span>
          </li>
        }
        @for (l of labelledLines(); track $index) {
          <li>
            <svg width="34" height="14" viewBox="0 0 34 14" aria-hidden="true">
              <path d="M1 7 H33" [attr.stroke]="l.color" [attr.stroke-width]="l.width ?? 1.5" [attr.stroke-dasharray]="dash(l.dash)" />
            </svg>
            <span>{{ l.label }}</span>
          </li>
        }
      </ul>
    </figure>
  `,
  styles: `
    .plot { margin: 0; padding: 12px; border: 1px solid var(--mat-sys-outline-variant); border-radius: 12px; background: var(--mat-sys-surface); break-inside: avoid; }
    figcaption { display: flex; flex-direction: column; gap: 2px; margin-bottom: 8px; font: var(--mat-sys-body-medium); }
    .canvas { position: relative; height: 320px; }
    .legend { list-style: none; display: flex; flex-wrap: wrap; gap: 4px 16px; margin: 8px 0 0; padding: 0; font: var(--mat-sys-body-small); color: var(--mat-sys-on-surface); }
    .legend li { display: flex; align-items: center; gap: 6px; }
    .legend svg { flex: none; }
    @media print {
      .canvas { height: auto; }
      canvas { max-width: 100% !important; height: auto !important; }
    }
  `,
})
export class CurveChart {
  readonly curves = input.required<Curves>();
  readonly heading = input.required<string>();
  readonly caption = input('');
  readonly testId = input('plot');

  protected readonly data = computed(() => curveData(this.curves()));
  protected readonly options = computed(() => curveOptions(this.curves()));
  protected readonly labelledLines = computed(() => this.curves().lines.filter((l) => !!l.label));
  protected dash(d: number[] | undefined): string | null {
    return d && d.length ? d.join(' ') : null;
  }
  private readonly chart = viewChild(BaseChartDirective);

  constructor() {
    fitChartOnPrint(this.chart);
  }
}
