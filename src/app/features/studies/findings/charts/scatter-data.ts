import type { ChartDataset } from 'chart.js';
import type { ComparisonRegression } from '../comparison/engine-types';
import { REGRESSION_LABELS } from '../../study-text';
import { formatNumber } from '../comparison/number-format';
import { PALETTE } from './palette';
import type { PlotPoint } from './plot-points';

export type XY = { x: number; y: number };

/** The lowest and highest of every x and y (so the identity line spans the whole square). */
export function extent(points: readonly PlotPoint[]): [number, number] | null {
  if (points.length === 0) return null;
  let lo = Infinity;
  let hi = -Infinity;
  for (const p of points) {
    lo = Math.min(lo, p.x, p.y);
    hi = Math.max(hi, p.x, p.y);
  }
  return [lo, hi];
}

/** Included and excluded pairs as two point datasets (the excluded ones crossed), placed by `at`. */
export function pairDatasets(points: readonly PlotPoint[], at: (p: PlotPoint) => XY): ChartDataset<'scatter', XY[]>[] {
  const pairs = (excluded: boolean): XY[] => points.filter((p) => p.excluded === excluded).map(at);
  const datasets: ChartDataset<'scatter', XY[]>[] = [
    { label: 'Pairs', data: pairs(false), backgroundColor: PALETTE.point, borderColor: PALETTE.pointBorder, pointRadius: 4 },
  ];
  const excluded = pairs(true);
  if (excluded.length > 0) {
    datasets.push({ label: 'Excluded pairs', data: excluded, pointStyle: 'crossRot', borderColor: PALETTE.excluded, borderWidth: 2, pointRadius: 6 });
  }
  return datasets;
}

/**
 * The comparison scatter: candidate (y) against comparative (x), included and excluded pairs apart,
 * the identity line y = x and the regression line y = a + b·x across the measured range.
 */
export function scatterDatasets(points: readonly PlotPoint[], regression: ComparisonRegression | null): ChartDataset<'scatter', XY[]>[] {
  const range = extent(points);
  const datasets = pairDatasets(points, (p) => ({ x: p.x, y: p.y }));
  if (!range) return datasets;
  const [lo, hi] = range;
  datasets.push({
    label: 'Identity y = x', data: [{ x: lo, y: lo }, { x: hi, y: hi }], showLine: true, pointRadius: 0,
    borderColor: PALETTE.identity, borderDash: [6, 4], borderWidth: 1.5,
  });
  const a = regression?.intercept.estimate;
  const b = regression?.slope.estimate;
  if (regression && a !== null && a !== undefined && b !== null && b !== undefined) {
    const name = `${REGRESSION_LABELS[regression.method]}: y = ${formatNumber(a, 3)} + ${formatNumber(b, 3)}·x`;
    datasets.push({
      label: name, data: [{ x: lo, y: a + b * lo }, { x: hi, y: a + b * hi }], showLine: true, pointRadius: 0,
      borderColor: PALETTE.regression, borderWidth: 2,
    });
  }
  return datasets;
}
