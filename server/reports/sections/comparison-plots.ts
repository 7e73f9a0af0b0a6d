import { num } from '../format';
import type { Layout } from '../layout';
import { differencePlot } from '../plots/difference-plot';
import { histogramPlot } from '../plots/histogram-plot';
import { plotRow } from '../plots/plot-box';
import { scatterPlot } from '../plots/scatter-plot';
import type { ComparisonFindings, StudyReport } from '../report-model';
import { COLOR } from '../theme';
import { REGRESSION_WORDS } from '../words';
import { differenceUnit, type Pair } from './comparison-data';

const NONE = { estimate: null, ci: null };
const label = (name: string, unit: string): string => (unit ? `${name} (${unit})` : name);

/** The four plots, drawn as vector paths: scatter, difference, and the two bootstrap distributions. */
export function comparisonPlots(layout: Layout, report: StudyReport, results: ComparisonFindings, pairs: Pair[]): void {
  const unit = report.analyte.unit;
  const dUnit = differenceUnit(report, results);
  const included = pairs.filter((p) => !p.row.excluded);
  const excluded = pairs.filter((p) => p.row.excluded);
  layout.heading('Plots', 260);
  if (pairs.length) {
    const [left, right] = plotRow(layout, 2, 245);
    const reg = results.regression;
    const line = reg?.slope?.estimate != null && reg.intercept?.estimate != null
      ? { slope: reg.slope.estimate, intercept: reg.intercept.estimate, label: REGRESSION_WORDS[reg.method] ?? reg.method }
      : null;
    scatterPlot(layout.doc, left, {
      included: included.map((p) => [p.x, p.y]), excluded: excluded.map((p) => [p.x, p.y]), line,
      xLabel: label('Comparative x', unit), yLabel: label('Candidate y', unit),
    });
    differencePlot(layout.doc, right, {
      included: included.map((p) => [p.at, p.difference]), excluded: excluded.map((p) => [p.at, p.difference]),
      bias: results.bias?.mean ?? NONE, lower: results.limitsOfAgreement?.lower ?? NONE, upper: results.limitsOfAgreement?.upper ?? NONE,
      xLabel: label(results.differenceType === 'percent-x' ? 'Comparative x' : 'Mean of the pair', unit),
      yLabel: label('Difference y − x', dUnit),
    });
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
      legend: [{ label: `observed ${num(nullPlot.observed, 3)}`, color: COLOR.ink, kind: 'line' }, { label: 'both tails', color: COLOR.warm, kind: 'band' }],
    });
  }
  if (boot) {
    const median = results.bias?.median ?? NONE;
    histogramPlot(layout.doc, right, {
      title: 'Median bias: bootstrap distribution', xLabel: label('Median bias of resamples', dUnit), bins: boot.bins,
      markers: median.estimate !== null ? [{ value: median.estimate, color: COLOR.ink }] : [],
      bands: median.ci ? [{ span: median.ci, color: COLOR.warm }] : [],
      legend: [{ label: 'estimate', color: COLOR.ink, kind: 'line' }, { label: 'CI', color: COLOR.warm, kind: 'band' }],
    });
  }
  layout.paragraph(
    'Left: the median of resampled differences after shifting them to a median of zero; the shaded bars lie at least as far from zero as the observed median bias (the p-value counts them). ' +
    'Right: the bootstrap distribution of the median bias with its CI. Few distinct values make these distributions lumpy: read the CI with that in mind.',
    { size: 7.5, color: COLOR.muted },
  );
}
