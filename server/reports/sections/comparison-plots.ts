import { num } from '../format';
import type { Layout } from '../layout';
import { type DifferenceInput, differenceLegend, differencePlot } from '../plots/difference-plot';
import { dataWidth, LEGEND_ROW } from '../plots/frame';
import { legendRows } from '../plots/marks';
import { histogramPlot } from '../plots/histogram-plot';
import { plotRow } from '../plots/plot-box';
import { type ScatterInput, scatterLegend, scatterPlot } from '../plots/scatter-plot';
import type { ComparisonFindings, StudyReport } from '../report-model';
import { COLOR } from '../theme';
import { REGRESSION_WORDS } from '../words';
import { decimalsOf, differenceUnit, type Pair } from './comparison-data';

const NONE = { estimate: null, ci: null };
/** The gap between the two plots of a row (plotRow's). */
const PLOT_GAP = 18;
const label = (name: string, unit: string): string => (unit ? `${name} (${unit})` : name);
const withUnit = (text: string, unit: string): string => (unit ? `${text} ${unit}` : text);

/**
 * The four plots, drawn as vector paths: scatter, difference (with the allowable bias as stated and the
 * decision levels), and the two bootstrap distributions. Numbers in the legends carry the tables' decimals.
 */
export function comparisonPlots(layout: Layout, report: StudyReport, results: ComparisonFindings, pairs: Pair[]): void {
  const unit = report.analyte.unit;
  const dUnit = differenceUnit(report, results);
  const included = pairs.filter((p) => !p.row.excluded);
  const excluded = pairs.filter((p) => p.row.excluded);
  const d = decimalsOf(report);
  const type = results.differenceType ?? report.settings.differenceType;
  const percent = type !== 'absolute';
  const dDecimals = percent ? 2 : d.stat;
  const step = results.resolution?.increment ?? null;
  if (!pairs.length) layout.heading('Plots', 285);
  if (pairs.length) {
    const reg = results.regression;
    const line = reg?.slope?.estimate != null && reg.intercept?.estimate != null
      ? { slope: reg.slope.estimate, intercept: reg.intercept.estimate, label: REGRESSION_WORDS[reg.method] ?? reg.method }
      : null;
    const bandPoints = reg?.band && reg.band.length > 1 && reg.band.every((p) => p.ci) ? reg.band.map((p) => ({ x: p.x, lower: p.ci![0], upper: p.ci![1] })) : null;
    const band = bandPoints ? { points: bandPoints, label: `${Math.round(100 * (results.settings?.level ?? 0.95))}% CI of the line` } : null;
    const scatter: ScatterInput = {
      included: included.map((p) => [p.x, p.y]), excluded: excluded.map((p) => [p.x, p.y]), line, band,
      xLabel: label('Comparative x', unit), yLabel: label('Candidate y', unit), resolution: step,
    };
    const difference: DifferenceInput = {
      included: included.map((p) => [p.at, p.difference]), excluded: excluded.map((p) => [p.at, p.difference]),
      bias: results.bias?.mean ?? NONE, lower: results.limitsOfAgreement?.lower ?? NONE, upper: results.limitsOfAgreement?.upper ?? NONE,
      xLabel: label(results.differenceType === 'percent-x' ? 'Comparative x' : 'Mean of the pair', unit),
      yLabel: label('Difference y − x', dUnit),
      type,
      goal: {
        absolute: results.settings?.allowableBias ?? report.settings.allowableBiasAbsolute ?? null,
        percent: results.settings?.allowableBiasPercent ?? report.settings.allowableBiasPercent ?? null,
      },
      levels: (results.decisionLevels ?? []).map((l) => l.level),
      format: { difference: (v) => withUnit(num(v, dDecimals), dUnit), value: (v) => withUnit(num(v, d.value), unit), goal: (v) => withUnit(num(v, d.stat), unit) },
      resolution: { x: step, y: percent ? null : results.resolution?.differenceIncrement ?? step },
    };
    // Both plots leave room for as many legend rows as the longer legend, so their axes line up; past five rows the
    // plots grow by the rows they add, so a long legend (long labels broken over rows) does not squeeze the data.
    const width = (layout.width - PLOT_GAP) / 2;
    const rows = Math.max(...[scatterLegend(scatter), differenceLegend(difference)].map((items) => legendRows(layout.doc, items, dataWidth({ width })).length));
    const height = Math.max(270, 215 + rows * LEGEND_ROW);
    layout.heading('Plots', height + 15);
    const [left, right] = plotRow(layout, 2, height, PLOT_GAP);
    scatterPlot(layout.doc, left, { ...scatter, legendRows: rows });
    differencePlot(layout.doc, right, { ...difference, legendRows: rows });
  }
  const nullPlot = results.plots?.medianNull;
  const boot = results.plots?.medianBias;
  if (!nullPlot && !boot) return;
  const [left, right] = plotRow(layout, 2, 195);
  if (nullPlot) {
    histogramPlot(layout.doc, left, {
      title: 'Median bias: bootstrap null distribution', xLabel: label('Median of centred resamples', dUnit), bins: nullPlot.bins,
      markers: [
        { value: nullPlot.lowerCutoff, color: COLOR.warm, dash: true }, { value: nullPlot.upperCutoff, color: COLOR.warm, dash: true },
        { value: nullPlot.observed, color: COLOR.ink },
      ],
      bands: [{ span: [-Infinity, nullPlot.lowerCutoff], color: COLOR.warm }, { span: [nullPlot.upperCutoff, Infinity], color: COLOR.warm }],
      legend: [
        { label: `observed ${withUnit(num(nullPlot.observed, dDecimals), dUnit)}`, color: COLOR.ink, kind: 'line' },
        { label: 'cut-offs', color: COLOR.warm, kind: 'dash' }, { label: 'both tails (light bars)', color: COLOR.warm, kind: 'band' },
      ],
    });
  }
  if (boot) {
    const median = results.bias?.median ?? NONE;
    histogramPlot(layout.doc, right, {
      title: 'Median bias: bootstrap distribution', xLabel: label('Median bias of resamples', dUnit), bins: boot.bins,
      markers: median.estimate !== null ? [{ value: median.estimate, color: COLOR.ink }] : [],
      bands: median.ci ? [{ span: median.ci, color: COLOR.warm }] : [],
      legend: [
        { label: median.estimate !== null ? `estimate ${withUnit(num(median.estimate, dDecimals), dUnit)}` : 'estimate', color: COLOR.ink, kind: 'line' },
        { label: median.ci ? `CI ${num(median.ci[0], dDecimals)} to ${withUnit(num(median.ci[1], dDecimals), dUnit)}` : 'CI', color: COLOR.warm, kind: 'band' },
      ],
    });
  }
  layout.paragraph(
    'Left: the median of resampled differences after shifting them to a median of zero; the light bars in the shaded tails lie at least as far from zero as the observed median bias (the p-value counts them). ' +
    'Right: the bootstrap distribution of the median bias with its CI. Few distinct values make these distributions lumpy: read the CI with that in mind.',
    { size: 7.5, color: COLOR.muted },
  );
}
