import { niceAxis, paddedAxis, valueBins, type PlotAxis } from '@shared/types/plot-axes';
import type { LimitResult } from '@shared/stats/reference-interval';
import { outsideStated } from '@shared/stats/stated-limits';
import { binBars, histogramAxes, rangeWords } from '../../findings/charts/histogram-data';
import { withUnit } from '../../findings/comparison/comparison-result';
import type { MarkerLine, Markers } from '../../findings/charts/markers-plugin';
import { PALETTE } from '../../findings/charts/palette';
import type { PlotDatum, PointDataset } from '../../findings/charts/scatter-data';
import { gridNumber } from '../../specimens/result-number';
import type { GridRow } from '../../specimens/specimen-layout';

/** One analysed value with its grid position (1-based) and the individual's label. */
export interface PlacedValue {
  position: number;
  value: number;
  label: string;
}

/**
 * The values the analysis used, read from the grid: not excluded, a number, and (when a subgroup is
 * given) with that value in the partition field, e.g. sex = "F".
 */
export function analysedValues(rows: readonly GridRow[], subgroup?: { field: string; group: string }): PlacedValue[] {
  const out: PlacedValue[] = [];
  rows.forEach((row, i) => {
    if (row['excluded'] === true) return;
    if (subgroup && String(row[subgroup.field] ?? '').trim() !== subgroup.group) return;
    const value = gridNumber(String(row['value'] ?? ''));
    if (value !== null && Number.isFinite(value)) out.push({ position: i + 1, value, label: String(row['label'] ?? '').trim() });
  });
  return out;
}

/** An individual's name: the label, or the row when there is none. */
export function individualName(v: Pick<PlacedValue, 'label' | 'position'>): string {
  return v.label ? `${v.label} (row ${v.position})` : `Row ${v.position}`;
}

function limitMarkers(limit: LimitResult | null, name: string, label: (v: number) => string): Markers {
  if (!limit || limit.estimate === null) return { lines: [], bands: [] };
  const lines: MarkerLine[] = [{ axis: 'x', value: limit.estimate, color: PALETTE.bias, width: 2, label: `${name} limit ${label(limit.estimate)}` }];
  if (limit.rankCi) {
    lines.push(...limit.rankCi.map((v, k) => ({
      axis: 'x' as const, value: v, color: PALETTE.limits, dash: [6, 4], ...(k === 0 ? { label: `Rank-based CI ${rangeWords(label(limit.rankCi![0]), label(limit.rankCi![1]))}` } : {}),
    })));
  }
  const bands = limit.ci ? [{ axis: 'x' as const, from: limit.ci[0], to: limit.ci[1], color: PALETTE.biasBand, label: `Bootstrap CI ${rangeWords(label(limit.ci[0]), label(limit.ci[1]))}` }] : [];
  return { lines, bands };
}

/** How a bin's tooltip writes its values, "58 to 60 µmol/L" (the reportable values it holds): the number, then the unit. */
export interface ValueWords {
  value: (v: number) => string;
  unit: string;
}

/**
 * The values as a histogram by the rule the PDF draws with (valueBins, shared/types/plot-axes.ts): bins at half-steps
 * of the reporting step `resolution` (or the values' own, when coarser or none is stated), with
 * a solid line at each limit, its bootstrap CI as a shaded band and its rank-based CI as dashed lines. Bars of
 * values beyond a limit are light. A bar's tooltip gives its range, its count and (for a few) who they are.
 */
export function valueHistogram(
  values: readonly PlacedValue[], lower: LimitResult | null, upper: LimitResult | null, label: (v: number) => string,
  resolution?: number | null, words?: ValueWords,
): { bars: PlotDatum[]; colors: string[]; markers: Markers; axes: { x: PlotAxis; y: PlotAxis } } {
  const { step, bins } = valueBins(values.map((v) => v.value), resolution);
  const lo = lower?.estimate ?? -Infinity;
  const hi = upper?.estimate ?? Infinity;
  const parts = [limitMarkers(lower, 'Lower', label), limitMarkers(upper, 'Upper', label)];
  const markers: Markers = { lines: parts.flatMap((p) => p.lines), bands: parts.flatMap((p) => p.bands) };
  const bars = binBars(bins).map((bar, k) => {
    if (!words) return bar;
    const b = bins[k];
    const inBin = values.filter((v) => v.value >= b.from && v.value < b.to);
    // The reportable values the bin holds: from its lower edge + h/2 to its upper edge − h/2.
    const first = b.from + step / 2;
    const last = b.to - step / 2;
    const range = withUnit(Math.abs(last - first) < 1e-9 ? words.value(first) : `${words.value(first)} to ${words.value(last)}`, words.unit);
    const names = inBin.slice(0, 6).map(individualName).join(', ') + (inBin.length > 6 ? ` and ${inBin.length - 6} more` : '');
    return { ...bar, tip: [range, `${b.count} ${b.count === 1 ? 'individual' : 'individuals'}`, ...(names ? [names] : [])] };
  });
  return {
    bars,
    colors: bins.map((b) => (b.to <= lo || b.from >= hi ? PALETTE.tail : PALETTE.barInCi)),
    markers,
    axes: histogramAxes(bins, markers, step),
  };
}

/**
 * A strip plot of the verification values: each individual at its row (y), those outside the stated limits
 * drawn as light diamonds apart from the dark circles inside (a shape, not only a colour); the stated
 * interval as a shaded band between two lines. Each point's tooltip names the individual and the value.
 */
export function stripData(
  values: readonly PlacedValue[], stated: { lower: number; upper: number }, label: (v: number) => string, resolution?: number | null,
): { inside: PlotDatum[]; outside: PlotDatum[]; datasets: PointDataset[]; markers: Markers; axes: { x: PlotAxis; y: PlotAxis } } {
  const out = (v: PlacedValue): boolean => outsideStated(v.value, stated);
  const point = (v: PlacedValue): PlotDatum => ({
    x: v.value, y: v.position, key: v.position,
    tip: [individualName(v), `Value ${label(v.value)}`, out(v) ? 'Outside the stated interval' : 'Inside the stated interval'],
  });
  const inside = values.filter((v) => !out(v)).map(point);
  const outside = values.filter(out).map(point);
  const datasets: PointDataset[] = [
    { label: 'Inside', data: inside, pointStyle: 'circle', backgroundColor: PALETTE.point, borderColor: PALETTE.pointBorder, borderWidth: 1, pointRadius: 4, pointHoverRadius: 6 },
    { label: 'Outside', data: outside, pointStyle: 'rectRot', backgroundColor: PALETTE.tail, borderColor: PALETTE.excluded, borderWidth: 2, pointRadius: 7, pointHoverRadius: 8 },
  ];
  const rows = values.map((v) => v.position);
  const axes = {
    x: paddedAxis([...values.map((v) => v.value), stated.lower, stated.upper], { resolution }),
    y: niceAxis(0, Math.max(1, ...rows) + 1, { count: 5, resolution: 1 }),
  };
  return {
    inside, outside, datasets, axes,
    markers: {
      bands: [{ axis: 'x', from: stated.lower, to: stated.upper, color: PALETTE.biasBand, label: 'Stated interval' }],
      lines: [
        { axis: 'x', value: stated.lower, color: PALETTE.bias, width: 2, label: `Lower limit ${label(stated.lower)}` },
        { axis: 'x', value: stated.upper, color: PALETTE.bias, width: 2, label: `Upper limit ${label(stated.upper)}` },
      ],
    },
  };
}
