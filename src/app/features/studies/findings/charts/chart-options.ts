import type { ActiveElement, Chart } from 'chart.js';
import type { PlotAxis } from '@shared/types/plot-axes';
import { formatNumber } from '../comparison/number-format';
import type { Markers } from './markers-plugin';
import type { PlotDatum } from './scatter-data';

/** The lines of the tooltip a hovered point or bar carries (its `tip`), or null for lines and bands. */
export function tipOf(raw: unknown): string[] | null {
  const tip = (raw as PlotDatum | null)?.tip;
  return Array.isArray(tip) && tip.length > 0 ? tip : null;
}

/** The specimen a clicked point stands for (its grid position), from the elements chart.js found under the pointer. */
export function keyOf(chart: Pick<Chart, 'data'>, elements: readonly Pick<ActiveElement, 'datasetIndex' | 'index'>[]): number | null {
  for (const el of elements) {
    const raw = chart.data.datasets[el.datasetIndex]?.data[el.index] as PlotDatum | undefined;
    if (raw && typeof raw.key === 'number') return raw.key;
  }
  return null;
}

/** A chart.js linear scale fixed to a computed axis: its ends, its tick step, ticks written with its decimals. */
export function linearScale(axis: PlotAxis | null, title: string, offset = false): Record<string, unknown> {
  return {
    type: 'linear',
    offset,
    title: { display: !!title, text: title },
    ...(axis
      ? { min: axis.min, max: axis.max, ticks: { stepSize: axis.step, callback: (v: number | string) => formatNumber(Number(v), axis.decimals) } }
      : {}),
  };
}

/** One key of a plot's legend: what it is drawn as, in which colour and dash, and its words. */
export interface LegendEntry {
  text: string;
  kind: 'point' | 'ring' | 'cross' | 'diamond' | 'line' | 'rect' | 'area' | 'triangle';
  color: string;
  fill?: string;
  dash?: number[];
  width?: number;
}

interface DatasetLike {
  label?: string;
  type?: string;
  pointStyle?: unknown;
  showLine?: boolean;
  backgroundColor?: unknown;
  borderColor?: unknown;
  borderDash?: number[];
  borderWidth?: unknown;
  highlight?: boolean;
}

const colour = (c: unknown, fallback = '#40484a'): string => (typeof c === 'string' ? c : fallback);

/**
 * The legend under a plot, as HTML (read, copied and tested like any text): the datasets (pairs as dots,
 * excluded pairs as crosses, lines with their dash, then the selected specimen as a ring), then every labelled
 * marker with its value (bands and regions as filled boxes, lines with their dash, decision levels as
 * triangles). A histogram's bars are not named: the axis says what they count.
 */
export function legendEntries(datasets: readonly DatasetLike[], markers: Partial<Markers>, histogram: boolean): LegendEntry[] {
  const entries: LegendEntry[] = [];
  const rings: LegendEntry[] = [];
  for (const d of datasets) {
    if (!d.label || d.type === 'bar' || (histogram && d.type !== 'scatter')) continue;
    const color = colour(d.borderColor);
    if (d.highlight) rings.push({ text: d.label, kind: 'ring', color });
    else if (d.showLine || d.pointStyle === 'line') entries.push({ text: d.label, kind: 'line', color, dash: d.borderDash ?? [], width: typeof d.borderWidth === 'number' ? d.borderWidth : 1.5 });
    else if (d.pointStyle === 'crossRot' || d.pointStyle === 'cross') entries.push({ text: d.label, kind: 'cross', color });
    else if (d.pointStyle === 'rectRot') entries.push({ text: d.label, kind: 'diamond', color, fill: colour(d.backgroundColor, color) });
    else entries.push({ text: d.label, kind: 'point', color, fill: colour(d.backgroundColor, color) });
  }
  entries.push(...rings);
  for (const b of markers.bands ?? []) if (b.label) entries.push({ text: b.label, kind: 'rect', color: b.color, fill: b.color });
  for (const a of markers.areas ?? []) if (a.label) entries.push({ text: a.label, kind: 'area', color: a.edge, fill: a.color, dash: a.dash ?? [] });
  for (const l of markers.lines ?? []) {
    if (l.label) entries.push({ text: l.label, kind: l.axisMark ? 'triangle' : 'line', color: l.color, dash: l.dash ?? [], width: l.width ?? 1.5 });
  }
  return entries;
}
