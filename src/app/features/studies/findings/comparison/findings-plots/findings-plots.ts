import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { ChartData } from 'chart.js';
import { differenceDatasets, differenceMarkers } from '../../charts/difference-data';
import { FindingsChart } from '../../charts/findings-chart';
import { biasHistogram, nullHistogram, tailShare } from '../../charts/histogram-data';
import type { PlotPoint } from '../../charts/plot-points';
import { scatterDatasets } from '../../charts/scatter-data';
import { ComparisonFindingsResult, Units, withUnit } from '../comparison-result';
import { formatCi, formatNumber, formatP, levelLabel } from '../number-format';

/** (d) The plots: comparison scatter, difference plot, the shifted-null distribution and the bias distribution. */
@Component({
  selector: 'app-findings-plots',
  templateUrl: './findings-plots.html',
  styleUrl: './findings-plots.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [FindingsChart],
})
export class FindingsPlots {
  readonly result = input.required<ComparisonFindingsResult>();
  readonly units = input.required<Units>();
  /** The pairs to draw; null when the rows changed since the analysis. */
  readonly points = input<PlotPoint[] | null>(null);

  private readonly label = (v: number): string => withUnit(formatNumber(v, this.units().differenceDecimals), this.units().difference);
  protected readonly axisX = computed(() => withUnit('Comparative method (x),', this.units().unit));
  protected readonly axisY = computed(() => withUnit('Candidate method (y),', this.units().unit));
  protected readonly axisMean = computed(() => withUnit('Mean of the pair,', this.units().unit));
  protected readonly axisDifference = computed(() => `Difference y − x (${this.units().difference})`);
  protected readonly axisBias = computed(() => `Median bias (${this.units().difference})`);

  protected readonly scatter = computed<ChartData | null>(() => {
    const p = this.points();
    return p ? ({ datasets: scatterDatasets(p, this.result().regression) } as ChartData) : null;
  });
  protected readonly difference = computed(() => {
    const p = this.points();
    return p ? { data: { datasets: differenceDatasets(p) } as ChartData, markers: differenceMarkers(this.result(), this.label) } : null;
  });
  protected readonly nullPlot = computed(() => {
    const plot = this.result().plots.medianNull;
    if (!plot) return null;
    const h = nullHistogram(plot, this.label);
    const p = formatP(this.result().biasTests.median?.pValue);
    return {
      data: { datasets: [{ type: 'bar', label: 'Resamples', data: h.bars, backgroundColor: h.colors }] } as ChartData,
      markers: h.markers,
      caption: `Resampled median bias of the differences shifted to a median of 0. Shaded: at or beyond ±${this.label(Math.abs(plot.observed - plot.nullValue))}, ${(100 * tailShare(plot)).toFixed(1)} % of resamples; p ${p.startsWith('<') ? p : `= ${p}`}.`,
    };
  });
  protected readonly biasPlot = computed(() => {
    const r = this.result();
    if (!r.plots.medianBias) return null;
    const h = biasHistogram(r.plots.medianBias.bins, r.bias.median.estimate, r.bias.median.ci, this.label);
    return {
      data: { datasets: [{ type: 'bar', label: 'Resamples', data: h.bars, backgroundColor: h.colors }] } as ChartData,
      markers: h.markers,
      caption: `Median bias ${this.label(r.bias.median.estimate ?? Number.NaN)}; ${levelLabel(r.settings.level)} CI ${formatCi(r.bias.median.ci, this.units().differenceDecimals)} (coloured bars, dashed lines). A lumpy shape means few distinct values near the median.`,
    };
  });
}
