import type { Scale } from 'chart.js';
import { resultText, statText, type PrecisionFormat } from '@shared/kinds/precision/words';
import type { PrecisionMaterialResult } from '@shared/stats/precision-types';
import { plural } from '@shared/types/plural';
import { paddedAxis, type PlotAxis } from '@shared/types/plot-axes';
import { linearScale, tipOf } from '../../../findings/charts/chart-options';
import type { Markers } from '../../../findings/charts/markers-plugin';
import { PALETTE } from '../../../findings/charts/palette';
import type { PlotDatum, PointDataset } from '../../../findings/charts/scatter-data';

/**
 * The plot of one material's days: each day a column (the days as categories, in the engine's order), its
 * results as dots spread a little across the column so equal results stay visible, flagged replicates as
 * diamonds (a shape, not only a colour), each day's mean as a short bar, and the grand mean as a line across,
 * so a day that sits apart stands out. Drawing only: every number comes from the engine's result.
 */
export interface DayPlot {
  /** The day names, the x axis's categories at 1, 2, … */
  days: string[];
  datasets: PointDataset[];
  markers: Markers;
  x: PlotAxis;
  y: PlotAxis;
  /** The plot in words, for readers who cannot see it (the canvas's accessible label). */
  summary: string;
}

/** Half the width of a day's column the replicates spread over. */
const SPREAD = 0.18;

/** Where the j-th of n results of a day is drawn across its column (the day's centre for one). */
export function spreadOffset(j: number, n: number): number {
  return n <= 1 ? 0 : -SPREAD + (2 * SPREAD * j) / (n - 1);
}

const same = (a: number, b: number): boolean => Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b));

/** For each day, the indices of its results that are flagged replicates (matched by day and value), with why. */
export function flaggedIndices(m: Pick<PrecisionMaterialResult, 'byDay' | 'outliers'>): Map<string, Map<number, string>> {
  const out = new Map<string, Map<number, string>>();
  for (const o of m.outliers) {
    const day = m.byDay.find((d) => d.day === o.day);
    if (!day) continue;
    const taken = out.get(o.day) ?? new Map<number, string>();
    const index = day.values.findIndex((v, j) => !taken.has(j) && same(v, o.value));
    if (index < 0) continue;
    taken.set(index, o.why);
    out.set(o.day, taken);
  }
  return out;
}

/** The plot in words: counts, the grand mean, the range of the day means and the day furthest from the grand mean. */
export function dayPlotSummary(m: PrecisionMaterialResult, f: PrecisionFormat): string {
  if (m.byDay.length === 0) return `${m.name}: no results to draw.`;
  const head = `${m.name}: ${plural(m.n, 'result')} on ${plural(m.byDay.length, 'day')} around the grand mean ${statText(m.mean, f)}.`;
  const byMean = [...m.byDay].sort((a, b) => a.mean - b.mean);
  const low = byMean[0];
  const high = byMean[byMean.length - 1];
  const far = m.byDay.reduce((best, d) => (Math.abs(d.mean - m.mean) > Math.abs(best.mean - m.mean) ? d : best), m.byDay[0]);
  const gap = far.mean - m.mean;
  const range = m.byDay.length > 1
    ? ` Day means run from ${statText(low.mean, f)} (day ${low.day}) to ${statText(high.mean, f)} (day ${high.day}); the day furthest from the grand mean is ${far.day}, ${statText(Math.abs(gap), f)} ${gap >= 0 ? 'above' : 'below'} it.`
    : ` One day only: its mean is the grand mean.`;
  const flagged = m.outliers.length ? ` ${plural(m.outliers.length, 'flagged replicate')}, drawn as diamonds.` : '';
  return head + range + flagged;
}

/** The plot of one material's days (see DayPlot). */
export function dayPlot(m: PrecisionMaterialResult, f: PrecisionFormat): DayPlot {
  const flagged = flaggedIndices(m);
  const results: PlotDatum[] = [];
  const marked: PlotDatum[] = [];
  const means: PlotDatum[] = [];
  m.byDay.forEach((d, i) => {
    const x = i + 1;
    const flags = flagged.get(d.day);
    d.values.forEach((v, j) => {
      const why = flags?.get(j);
      const tip = [`Day ${d.day}`, `Result ${resultText(v, f)}`, `Day mean ${statText(d.mean, f)}`, ...(why ? [`Flagged: ${why}`] : [])];
      (why ? marked : results).push({ x: x + spreadOffset(j, d.values.length), y: v, tip });
    });
    means.push({ x, y: d.mean, tip: [`Day ${d.day}`, `Day mean ${statText(d.mean, f)} (${plural(d.values.length, 'result')})`, `Grand mean ${statText(m.mean, f)}`] });
  });
  const k = m.byDay.length;
  const datasets: PointDataset[] = [
    { label: 'Results', data: results, pointStyle: 'circle', backgroundColor: PALETTE.point, borderColor: PALETTE.pointBorder, borderWidth: 1, pointRadius: 4, pointHoverRadius: 6, pointHitRadius: 4 },
  ];
  if (marked.length) {
    datasets.push({ label: 'Flagged replicates', data: marked, pointStyle: 'rectRot', backgroundColor: PALETTE.tail, borderColor: PALETTE.excluded, borderWidth: 2, pointRadius: 7, pointHoverRadius: 8, pointHitRadius: 4 });
  }
  // A day's mean: a short bar across its column (chart.js's 'line' point style, as wide as twice the radius).
  datasets.push({
    label: "Day's mean", data: means, pointStyle: 'line', borderColor: PALETTE.bias, backgroundColor: PALETTE.bias, borderWidth: 3,
    pointRadius: k > 12 ? 7 : 14, pointHoverRadius: k > 12 ? 8 : 15, pointHitRadius: 6,
    // Drawn first (chart.js draws the higher order underneath), so a result at the day's mean stays visible on its bar.
    order: 1,
  });
  const values = m.byDay.flatMap((d) => [...d.values, d.mean]);
  return {
    days: m.byDay.map((d) => d.day),
    datasets,
    markers: { bands: [], lines: [{ axis: 'y', value: m.mean, color: PALETTE.regression, dash: [6, 4], width: 1.5, label: `Grand mean ${statText(m.mean, f)}` }] },
    x: { min: 0.5, max: k + 0.5, step: 1, ticks: m.byDay.map((_, i) => i + 1), decimals: 0 },
    y: paddedAxis([...values, m.mean], { resolution: 10 ** -f.value }),
    summary: dayPlotSummary(m, f),
  };
}

/** The x axis's tick at `value`: the day's name at 1, 2, …, nothing between. */
export function dayTick(days: readonly string[], value: number | string): string {
  const v = Number(value);
  return Number.isInteger(v) ? days[v - 1] ?? '' : '';
}

/**
 * The chart.js options of a day plot: the days as named ticks on a linear axis (ticks placed at 1, 2, … by
 * `afterBuildTicks`, so the dots can spread across each day's column), the results' axis padded as the other
 * Findings plots are, a tooltip naming the day and the result, and the grand mean drawn by our markers plugin.
 */
export function dayPlotOptions(plot: DayPlot, yTitle: string): Record<string, unknown> {
  return {
    responsive: true,
    maintainAspectRatio: false,
    animation: false,
    interaction: { mode: 'nearest', intersect: true },
    scales: {
      x: {
        type: 'linear', min: plot.x.min, max: plot.x.max, title: { display: true, text: 'Day' }, grid: { display: false },
        afterBuildTicks: (scale: Pick<Scale, 'ticks'>) => { scale.ticks = plot.x.ticks.map((value) => ({ value })); },
        ticks: { autoSkip: true, maxRotation: 60, callback: (value: number | string) => dayTick(plot.days, value) },
      },
      y: linearScale(plot.y, yTitle),
    },
    plugins: {
      legend: { display: false },
      tooltip: {
        filter: (item: { raw: unknown }) => tipOf(item.raw) !== null,
        callbacks: {
          title: (items: { raw: unknown }[]) => tipOf(items[0]?.raw)?.[0] ?? '',
          label: (item: { raw: unknown }) => tipOf(item.raw)?.slice(1) ?? [],
        },
      },
      parallaxMarkers: plot.markers,
    },
  };
}
