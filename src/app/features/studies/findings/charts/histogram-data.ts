import { niceAxis, paddedAxis, type PlotAxis } from '@shared/types/plot-axes';
import type { HistogramBin, Interval, NullDistributionPlot } from '../comparison/engine-types';
import { type Markers, markerRange } from './markers-plugin';
import { PALETTE } from './palette';
import type { PlotDatum } from './scatter-data';

/** "0.10 to 0.20 mmol/L" from "0.10 mmol/L" and "0.20 mmol/L": the unit once, after the second value. */
export function rangeWords(from: string, to: string): string {
  const cut = from.indexOf(' ');
  return cut > 0 && to.endsWith(from.slice(cut)) ? `${from.slice(0, cut)} to ${to}` : `${from} to ${to}`;
}

/** How a bar's tooltip names its bin and its count: "0.10 to 0.30 mmol/L" and "8 resamples". */
export interface BinWords {
  range: (from: number, to: number) => string;
  count: (n: number) => string;
}

/** Histogram bins as bars on a number line: one point per bin at its middle, the height its count, with its tooltip. */
export function binBars(bins: readonly HistogramBin[], words?: BinWords): PlotDatum[] {
  return bins.map((b) => ({ x: (b.from + b.to) / 2, y: b.count, ...(words ? { tip: [words.range(b.from, b.to), words.count(b.count)] } : {}) }));
}

/**
 * Both axes of a histogram: x padded over every bin edge and every marker (a CI may reach past the bars),
 * y from 0 to a little above the tallest bar.
 */
export function histogramAxes(bins: readonly HistogramBin[], markers: Markers, resolution?: number | null): { x: PlotAxis; y: PlotAxis } {
  const xs = [...bins.flatMap((b) => [b.from, b.to]), ...(markerRange(markers, 'x') ?? [])];
  const top = Math.max(1, ...bins.map((b) => b.count));
  const y = niceAxis(0, top * 1.06, { count: 5, resolution: 1 });
  // More ticks than a scatter's: a wide plot, and a coarse step would leave much of it empty past the bars.
  return { x: paddedAxis(xs, { resolution, share: 0.03, count: 8 }), y };
}

/** The bins' share of all resamples that lies in the tails (for the caption). */
export function tailShare(plot: NullDistributionPlot): number {
  const total = plot.bins.reduce((s, b) => s + b.count, 0);
  const tails = plot.bins.filter((b) => b.tail !== null).reduce((s, b) => s + b.count, 0);
  return total === 0 ? 0 : tails / total;
}

/**
 * The shifted-null distribution of the median bias: both tails (at or beyond ±|observed| from the null)
 * shaded as regions and their bars in the light colour, and lines at the observed median (solid), its
 * mirror image (dashed) and the null value (dotted).
 */
export function nullHistogram(plot: NullDistributionPlot, label: (v: number) => string, words?: BinWords): { bars: PlotDatum[]; colors: string[]; markers: Markers } {
  const mirror = 2 * plot.nullValue - plot.observed;
  return {
    bars: binBars(plot.bins, words),
    colors: plot.bins.map((b) => (b.tail ? PALETTE.tail : PALETTE.barInCi)),
    markers: {
      bands: [
        { axis: 'x', from: -Infinity, to: plot.lowerCutoff, color: PALETTE.tailBand, label: 'Both tails (counted in p)' },
        { axis: 'x', from: plot.upperCutoff, to: Infinity, color: PALETTE.tailBand },
      ],
      lines: [
        { axis: 'x', value: plot.nullValue, color: PALETTE.zero, dash: [2, 3], width: 1 },
        { axis: 'x', value: plot.observed, color: PALETTE.observed, width: 2, label: `Observed ${label(plot.observed)}` },
        { axis: 'x', value: mirror, color: PALETTE.observed, dash: [6, 4], width: 1.5, label: `Mirror image ${label(mirror)}` },
      ],
    },
  };
}

/**
 * The bootstrap distribution of the bias: bars that reach into the CI dark, the others grey, and lines at the
 * estimate and both CI limits.
 */
export function biasHistogram(
  bins: readonly HistogramBin[], estimate: number | null, ci: Interval | null, label: (v: number) => string, words?: BinWords, level = '',
): { bars: PlotDatum[]; colors: string[]; markers: Markers } {
  const inside = (b: HistogramBin): boolean => !!ci && b.from <= ci[1] && b.to > ci[0];
  const lines: Markers['lines'] = [];
  if (ci) {
    lines.push(
      { axis: 'x', value: ci[0], color: PALETTE.bias, dash: [6, 4], label: `${level ? `${level} ` : ''}CI ${rangeWords(label(ci[0]), label(ci[1]))}` },
      { axis: 'x', value: ci[1], color: PALETTE.bias, dash: [6, 4] },
    );
  }
  if (estimate !== null) lines.push({ axis: 'x', value: estimate, color: PALETTE.observed, width: 2, label: `Estimate ${label(estimate)}` });
  return { bars: binBars(bins, words), colors: bins.map((b) => (inside(b) ? PALETTE.barInCi : PALETTE.bar)), markers: { bands: [], lines } };
}
