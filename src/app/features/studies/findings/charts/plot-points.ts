import type { StudySettings } from '@shared/schemas';
import { gridNumber } from '../../specimens/result-number';
import type { GridRow } from '../../specimens/specimen-layout';

/** One pair as the plots draw it: where it sits in the grid, its two results, their mean and difference. */
export interface PlotPoint {
  position: number;
  label: string;
  x: number;
  y: number;
  mean: number;
  difference: number;
  excluded: boolean;
}

/** The plotted difference, as the analysis defines it: y − x, or a percentage of the pair mean or of x. */
export function difference(x: number, y: number, type: StudySettings['differenceType']): number {
  if (type === 'absolute') return y - x;
  const base = type === 'percent-mean' ? (x + y) / 2 : x;
  return base === 0 ? Number.NaN : (100 * (y - x)) / base;
}

/**
 * The pairs to plot from the rows the analysis read (the saved rows, while the findings are current):
 * rows with both results, in grid order, excluded ones marked. These are drawing coordinates only; every
 * estimate on the page comes from the server's analysis.
 */
export function plotPoints(rows: readonly GridRow[], type: StudySettings['differenceType']): PlotPoint[] {
  const points: PlotPoint[] = [];
  rows.forEach((row, i) => {
    const x = gridNumber(String(row['comparative'] ?? ''));
    const y = gridNumber(String(row['candidate'] ?? ''));
    if (x === null || y === null || Number.isNaN(x) || Number.isNaN(y)) return;
    const d = difference(x, y, type);
    if (!Number.isFinite(d)) return;
    points.push({ position: i + 1, label: String(row['label'] ?? ''), x, y, mean: (x + y) / 2, difference: d, excluded: row['excluded'] === true });
  });
  return points;
}
