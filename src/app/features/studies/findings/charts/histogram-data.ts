import type { HistogramBin, Interval, NullDistributionPlot } from '../comparison/engine-types';
import type { Markers } from './markers-plugin';
import { PALETTE } from './palette';
import type { XY } from './scatter-data';

/** Histogram bins as bars on a number line: one point per bin at its middle, the height its count. */
export function binBars(bins: readonly HistogramBin[]): XY[] {
  return bins.map((b) => ({ x: (b.from + b.to) / 2, y: b.count }));
}

/** The bins' share of all resamples that lies in the tails (for the caption). */
export function tailShare(plot: NullDistributionPlot): number {
  const total = plot.bins.reduce((s, b) => s + b.count, 0);
  const tails = plot.bins.filter((b) => b.tail !== null).reduce((s, b) => s + b.count, 0);
  return total === 0 ? 0 : tails / total;
}

/**
 * The shifted-null distribution of the median bias: both tails (at or beyond ±|observed| from the null)
 * shaded as regions and their bars coloured, and lines at the observed median, its mirror image and the null value.
 */
export function nullHistogram(plot: NullDistributionPlot, label: (v: number) => string): { bars: XY[]; colors: string[]; markers: Markers } {
  const mirror = 2 * plot.nullValue - plot.observed;
  return {
    bars: binBars(plot.bins),
    colors: plot.bins.map((b) => (b.tail ? PALETTE.tail : PALETTE.bar)),
    markers: {
      bands: [
        { axis: 'x', from: -Infinity, to: plot.lowerCutoff, color: PALETTE.tailBand },
        { axis: 'x', from: plot.upperCutoff, to: Infinity, color: PALETTE.tailBand },
      ],
      lines: [
        { axis: 'x', value: plot.nullValue, color: PALETTE.zero, dash: [2, 3] },
        { axis: 'x', value: plot.observed, color: PALETTE.observed, label: `Observed ${label(plot.observed)}` },
        { axis: 'x', value: mirror, color: PALETTE.observed, dash: [6, 4] },
      ],
    },
  };
}

/**
 * The bootstrap distribution of the bias: bars that reach into the CI coloured, the others grey, and lines at the
 * estimate and both CI limits.
 */
export function biasHistogram(bins: readonly HistogramBin[], estimate: number | null, ci: Interval | null, label: (v: number) => string): { bars: XY[]; colors: string[]; markers: Markers } {
  const inside = (b: HistogramBin): boolean => !!ci && b.from <= ci[1] && b.to > ci[0];
  const lines: Markers['lines'] = [];
  if (ci) {
    lines.push({ axis: 'x', value: ci[0], color: PALETTE.bias, dash: [6, 4] }, { axis: 'x', value: ci[1], color: PALETTE.bias, dash: [6, 4] });
  }
  if (estimate !== null) lines.push({ axis: 'x', value: estimate, color: PALETTE.observed, label: `Estimate ${label(estimate)}` });
  return { bars: binBars(bins), colors: bins.map((b) => (inside(b) ? PALETTE.barInCi : PALETTE.bar)), markers: { bands: [], lines } };
}
