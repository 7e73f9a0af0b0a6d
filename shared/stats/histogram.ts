/**
 * Histogram bins for plotting a bootstrap distribution (results carry bins, never raw replicates).
 * Bins are [from, to) of equal width over [min, max]; the last bin also holds max.
 */
export interface HistogramBin {
  from: number;
  to: number;
  count: number;
}

export interface Histogram {
  bins: HistogramBin[];
  total: number;
}

export const DEFAULT_BINS = 40;

export function histogram(values: Float64Array, binCount = DEFAULT_BINS): Histogram {
  if (values.length === 0) return { bins: [], total: 0 };
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < values.length; i++) {
    if (values[i] < min) min = values[i];
    if (values[i] > max) max = values[i];
  }
  if (min === max) return { bins: [{ from: min, to: max, count: values.length }], total: values.length };
  const width = (max - min) / binCount;
  const counts = new Array<number>(binCount).fill(0);
  for (let i = 0; i < values.length; i++) {
    counts[Math.min(binCount - 1, Math.floor((values[i] - min) / width))]++;
  }
  const bins = counts.map((count, k) => ({ from: min + k * width, to: k === binCount - 1 ? max : min + (k + 1) * width, count }));
  return { bins, total: values.length };
}
