import { ChangeDetectionStrategy, Component, computed, input, model } from '@angular/core';
import type { ChartData } from 'chart.js';
import { allowableArea, decisionLevelMarks, differenceAxes, differenceDatasets, differenceMarkers } from '../../charts/difference-data';
import { FindingsChart } from '../../charts/findings-chart';
import { type BinWords, biasHistogram, histogramAxes, nullHistogram, rangeWords, tailShare } from '../../charts/histogram-data';
import type { PlotPoint } from '../../charts/plot-points';
import { scatterAxis, scatterBand, scatterDatasets } from '../../charts/scatter-data';
import { ComparisonFindingsResult, Units, withUnit } from '../comparison-result';
import { formatCi, formatNumber, formatP, levelLabel } from '../number-format';
import { type PairFormat, pairTip } from '../pairs-table/pair-rows';

/**
 * (d) The plots: comparison scatter, difference plot (with the allowable-bias band and the decision levels),
 * the shifted-null distribution and the bias distribution. Hovering a point names the specimen; clicking it
 * selects the specimen (and its row in the table of pairs); the selected specimen is ringed on both plots.
 */
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
  /** How a pair's results and differences are written (as in the table of pairs). */
  readonly format = input<PairFormat | null>(null);
  /** Each pair's flags in words, by grid position, for its tooltip. */
  readonly flags = input<ReadonlyMap<number, string[]>>(new Map());
  /** The grid position of the selected specimen. */
  readonly selected = model<number | null>(null);

  private readonly label = (v: number): string => withUnit(formatNumber(v, this.units().differenceDecimals), this.units().difference);
  private readonly value = (v: number): string => formatNumber(v, Math.max(0, this.units().decimals - 1));
  private readonly level = computed(() => levelLabel(this.result().settings.level));
  private readonly type = computed(() => this.result().differenceType);
  private readonly tip = computed(() => {
    const f = this.format();
    const flags = this.flags();
    return f ? (p: PlotPoint) => pairTip(p, f, flags.get(p.position) ?? []) : undefined;
  });
  private readonly binWords = computed<BinWords>(() => ({
    range: (from, to) => rangeWords(this.label(from), this.label(to)),
    count: (n) => `${n.toLocaleString('en')} ${n === 1 ? 'resample' : 'resamples'}`,
  }));
  protected readonly axisX = computed(() => withUnit('Comparative method (x),', this.units().unit));
  protected readonly axisY = computed(() => withUnit('Candidate method (y),', this.units().unit));
  protected readonly axisMean = computed(() => withUnit(this.type() === 'percent-x' ? 'Comparative method (x),' : 'Mean of the pair,', this.units().unit));
  protected readonly axisDifference = computed(() => `Difference y − x (${this.units().difference})`);
  protected readonly axisBias = computed(() => `Median bias (${this.units().difference})`);

  // The axes and markers depend on the pairs and the results only, so selecting a specimen changes the datasets
  // alone and the charts are updated, not drawn anew.
  private readonly scatterFrame = computed(() => {
    const p = this.points();
    return p ? scatterAxis(p, this.result().resolution?.increment) : null;
  });
  protected readonly scatter = computed(() => {
    const p = this.points();
    const axis = this.scatterFrame();
    if (!p || !axis) return null;
    return { data: { datasets: scatterDatasets(p, this.result().regression, { tip: this.tip(), selected: this.selected(), axis }) } as ChartData, axis, markers: this.scatterMarkers() };
  });
  private readonly scatterMarkers = computed(() => {
    const band = scatterBand(this.result().regression, this.result().settings.level);
    return { lines: [], bands: [], areas: band ? [band] : [] };
  });
  protected readonly scatterCaption = computed(() =>
    `Dashed grey: identity y = x. Solid: the regression line${this.scatterMarkers().areas.length ? `; shaded between dotted edges: its ${levelLabel(this.result().settings.level)} confidence band` : ''}.`);
  protected readonly differenceCaption = computed(() => {
    const r = this.result();
    const goal = r.settings.allowableBias !== null || r.settings.allowableBiasPercent !== null;
    return [
      'Solid: the mean bias; dashed: the limits of agreement; the shaded bands are their confidence intervals.',
      goal ? 'Dotted edges: the allowable bias as stated in Setup.' : 'No allowable bias is stated, so none is drawn.',
      r.decisionLevels.length ? 'Triangles on the x axis: the decision levels.' : '',
    ].filter(Boolean).join(' ');
  });
  private readonly differenceFrame = computed(() => {
    const p = this.points();
    if (!p) return null;
    const r = this.result();
    const type = this.type();
    const markers = differenceMarkers(r, this.label, this.level());
    const levels = r.decisionLevels.map((d) => d.level);
    const goal = { absolute: r.settings.allowableBias, percent: r.settings.allowableBiasPercent };
    const axes = differenceAxes(p, markers, type, levels, goal, {
      x: r.resolution?.increment, y: type === 'absolute' ? r.resolution?.differenceIncrement : null,
    });
    const area = allowableArea(axes.x, goal, type, (v) => withUnit(formatNumber(v, this.units().decimals), this.units().unit));
    markers.areas = area ? [area] : [];
    markers.lines.push(...decisionLevelMarks(levels, (v) => this.value(v)).map((l, k) => (k === 0 && l.label ? { ...l, label: withUnit(l.label, this.units().unit) } : l)));
    return { markers, axes };
  });
  protected readonly difference = computed(() => {
    const p = this.points();
    const frame = this.differenceFrame();
    if (!p || !frame) return null;
    return { data: { datasets: differenceDatasets(p, { type: this.type(), tip: this.tip(), selected: this.selected() }) } as ChartData, ...frame };
  });
  protected readonly nullPlot = computed(() => {
    const plot = this.result().plots.medianNull;
    if (!plot) return null;
    const h = nullHistogram(plot, this.label, this.binWords());
    const p = formatP(this.result().biasTests.median?.pValue);
    return {
      data: { datasets: [{ type: 'bar', label: 'Resamples', data: h.bars, backgroundColor: h.colors }] } as ChartData,
      markers: h.markers,
      axes: histogramAxes(plot.bins, h.markers),
      caption: `Resampled median bias of the differences shifted to a median of 0. Light bars and shading: at or beyond ±${this.label(Math.abs(plot.observed - plot.nullValue))}, ${(100 * tailShare(plot)).toFixed(1)} % of resamples; p ${p.startsWith('<') ? p : `= ${p}`}.`,
    };
  });
  protected readonly biasPlot = computed(() => {
    const r = this.result();
    if (!r.plots.medianBias) return null;
    const h = biasHistogram(r.plots.medianBias.bins, r.bias.median.estimate, r.bias.median.ci, this.label, this.binWords(), this.level());
    return {
      data: { datasets: [{ type: 'bar', label: 'Resamples', data: h.bars, backgroundColor: h.colors }] } as ChartData,
      markers: h.markers,
      axes: histogramAxes(r.plots.medianBias.bins, h.markers),
      caption: `Median bias ${this.label(r.bias.median.estimate ?? Number.NaN)}; ${levelLabel(r.settings.level)} CI ${formatCi(r.bias.median.ci, this.units().differenceDecimals)} (dark bars, dashed lines). A lumpy shape means few distinct values near the median.`,
    };
  });
}
