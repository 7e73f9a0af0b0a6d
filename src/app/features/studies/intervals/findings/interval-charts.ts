import { histogram } from '../../../../../../shared/stats/histogram';
import type { LimitResult } from '../../../../../../shared/stats/reference-interval';
import { binBars } from '../../findings/charts/histogram-data';
import type { MarkerLine, Markers } from '../../findings/charts/markers-plugin';
import { PALETTE } from '../../findings/charts/palette';
import type { XY } from '../../findings/charts/scatter-data';
import { gridNumber } from '../../specimens/result-number';
import type { GridRow } from '../../specimens/specimen-layout';

/** One analysed value with its grid position (1-based). */
export interface PlacedValue {
  position: number;
  value: number;
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
    if (value !== null && Number.isFinite(value)) out.push({ position: i + 1, value });
  });
  return out;
}

/** A bin count that suits n values: about √n, between 8 and 30. */
export function binCount(n: number): number {
  return Math.min(30, Math.max(8, Math.round(Math.sqrt(n))));
}

function limitMarkers(limit: LimitResult | null, name: string, label: (v: number) => string): Markers {
  if (!limit || limit.estimate === null) return { lines: [], bands: [] };
  const lines: MarkerLine[] = [{ axis: 'x', value: limit.estimate, color: PALETTE.bias, label: `${name} ${label(limit.estimate)}` }];
  if (limit.rankCi) lines.push(...limit.rankCi.map((v) => ({ axis: 'x' as const, value: v, color: PALETTE.limits, dash: [6, 4] })));
  const bands = limit.ci ? [{ axis: 'x' as const, from: limit.ci[0], to: limit.ci[1], color: PALETTE.biasBand }] : [];
  return { lines, bands };
}

/**
 * The values as a histogram, with a solid line at each limit, its bootstrap CI as a shaded band and its
 * rank-based CI as dashed lines. Bars of values beyond a limit are coloured as tails.
 */
export function valueHistogram(
  values: readonly number[], lower: LimitResult | null, upper: LimitResult | null, label: (v: number) => string,
): { bars: XY[]; colors: string[]; markers: Markers } {
  const bins = histogram(Float64Array.from(values), binCount(values.length)).bins;
  const lo = lower?.estimate ?? -Infinity;
  const hi = upper?.estimate ?? Infinity;
  const parts = [limitMarkers(lower, 'Lower', label), limitMarkers(upper, 'Upper', label)];
  return {
    bars: binBars(bins),
    colors: bins.map((b) => (b.to <= lo || b.from >= hi ? PALETTE.tail : PALETTE.barInCi)),
    markers: { lines: parts.flatMap((p) => p.lines), bands: parts.flatMap((p) => p.bands) },
  };
}

/**
 * A strip plot of the verification values: each value at its row position (y), those outside the stated
 * limits apart; the stated interval as a shaded band between two lines.
 */
export function stripData(
  values: readonly PlacedValue[], stated: { lower: number; upper: number }, label: (v: number) => string,
): { inside: XY[]; outside: XY[]; markers: Markers } {
  const point = (v: PlacedValue): XY => ({ x: v.value, y: v.position });
  const out = (v: PlacedValue): boolean => v.value < stated.lower || v.value > stated.upper;
  return {
    inside: values.filter((v) => !out(v)).map(point),
    outside: values.filter(out).map(point),
    markers: {
      bands: [{ axis: 'x', from: stated.lower, to: stated.upper, color: PALETTE.biasBand }],
      lines: [
        { axis: 'x', value: stated.lower, color: PALETTE.bias, label: `Lower ${label(stated.lower)}` },
        { axis: 'x', value: stated.upper, color: PALETTE.bias, label: `Upper ${label(stated.upper)}` },
      ],
    },
  };
}
