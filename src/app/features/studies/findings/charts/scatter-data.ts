import type { ChartDataset } from 'chart.js';
import { paddedAxis, type PlotAxis } from '@shared/types/plot-axes';
import type { ComparisonRegression } from '../comparison/engine-types';
import { REGRESSION_LABELS } from '../../study-text';
import { formatNumber, levelLabel } from '../comparison/number-format';
import type { MarkerArea } from './markers-plugin';
import { PALETTE } from './palette';
import type { PlotPoint } from './plot-points';

export type XY = { x: number; y: number };
/** A drawn point: where it is, the specimen it stands for (its grid position), and the lines its tooltip shows. */
export type PlotDatum = XY & { key?: number; tip?: string[] };
/** The tooltip lines of a pair: its label first, then both results and the difference. */
export type PairTip = (p: PlotPoint) => string[];
/** A dataset of drawn points; `highlight` marks the ring round the selected point (not a specimen of its own). */
export type PointDataset = ChartDataset<'scatter', PlotDatum[]> & { highlight?: boolean };

/** The lowest and highest of every x and y. */
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

/**
 * Included and excluded pairs as two point datasets (the excluded ones crossed, a shape and not only a
 * colour), placed by `at`, each point keyed by its grid position and carrying its tooltip; then a ring
 * round the selected pair, drawn over the rest.
 */
export function pairDatasets(points: readonly PlotPoint[], at: (p: PlotPoint) => XY, tip?: PairTip, selected?: number | null): PointDataset[] {
  const datum = (p: PlotPoint): PlotDatum => ({ ...at(p), key: p.position, ...(tip ? { tip: tip(p) } : {}) });
  const pairs = (excluded: boolean): PlotDatum[] => points.filter((p) => p.excluded === excluded).map(datum);
  const datasets: PointDataset[] = [
    { label: 'Pairs', data: pairs(false), backgroundColor: PALETTE.point, borderColor: PALETTE.pointBorder, borderWidth: 1, pointRadius: 4, pointHoverRadius: 6, pointHitRadius: 5, pointStyle: 'circle' },
  ];
  const excluded = pairs(true);
  if (excluded.length > 0) {
    datasets.push({ label: 'Excluded pairs', data: excluded, pointStyle: 'crossRot', borderColor: PALETTE.excluded, backgroundColor: PALETTE.excluded, borderWidth: 2, pointRadius: 6, pointHoverRadius: 7, pointHitRadius: 5 });
  }
  const chosen = selected === null || selected === undefined ? [] : points.filter((p) => p.position === selected);
  if (chosen.length > 0) {
    datasets.push({
      label: 'Selected specimen', data: chosen.map(datum), highlight: true, order: -1, pointStyle: 'circle',
      pointRadius: 9, pointHoverRadius: 9, borderWidth: 2.5, borderColor: PALETTE.selected, backgroundColor: 'rgba(255, 255, 255, 0)',
    });
  }
  return datasets;
}

/** One padded axis for both results of the scatter (the plot is square in its units), reaching every point. */
export function scatterAxis(points: readonly PlotPoint[], resolution?: number | null): PlotAxis {
  return paddedAxis(points.flatMap((p) => [p.x, p.y]), { resolution });
}

/**
 * The comparison scatter: candidate (y) against comparative (x), included and excluded pairs apart, the
 * identity line y = x and the regression line y = a + b·x from one end of the padded axis to the other.
 */
export function scatterDatasets(
  points: readonly PlotPoint[], regression: ComparisonRegression | null, options: { tip?: PairTip; selected?: number | null; axis?: PlotAxis } = {},
): PointDataset[] {
  const datasets = pairDatasets(points, (p) => ({ x: p.x, y: p.y }), options.tip, options.selected);
  if (points.length === 0) return datasets;
  const axis = options.axis ?? scatterAxis(points);
  const [lo, hi] = [axis.min, axis.max];
  datasets.push({
    label: 'Identity y = x', data: [{ x: lo, y: lo }, { x: hi, y: hi }], showLine: true, pointRadius: 0, pointHitRadius: 0, pointStyle: 'line',
    borderColor: PALETTE.identity, borderDash: [6, 4], borderWidth: 1.5,
  });
  const a = regression?.intercept.estimate;
  const b = regression?.slope.estimate;
  if (regression && a !== null && a !== undefined && b !== null && b !== undefined) {
    const name = `${REGRESSION_LABELS[regression.method]}: y = ${formatNumber(a, 3)} + ${formatNumber(b, 3)}·x`;
    datasets.push({
      label: name, data: [{ x: lo, y: a + b * lo }, { x: hi, y: a + b * hi }], showLine: true, pointRadius: 0, pointHitRadius: 0, pointStyle: 'line',
      borderColor: PALETTE.regression, borderWidth: 2,
    });
  }
  return datasets;
}

/**
 * The regression line's pointwise CI as a shaded region over the comparative range (regression.band from the
 * engine, the same resamples as the decision-level biases); null when the result has no band or a point lacks
 * its CI (results of engines before 1.4.0 carry none).
 */
export function scatterBand(regression: ComparisonRegression | null, level: number): MarkerArea | null {
  const band = regression?.band;
  if (!band || band.length < 2 || band.some((p) => !p.ci)) return null;
  return {
    points: band.map((p) => ({ x: p.x, lower: p.ci![0], upper: p.ci![1] })),
    color: PALETTE.regressionBand, edge: PALETTE.regression, dash: [2, 3],
    label: `${levelLabel(level)} CI of the regression line`,
  };
}
