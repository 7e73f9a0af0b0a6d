import { goalText, percentText, statText, xText, type RangeFormat } from '@shared/kinds/reportable-range/words';
import { allowableBiasAt } from '@shared/stats/decision-levels';
import { polynomialAt } from '@shared/stats/polynomial-fit';
import type { RangeResult } from '@shared/stats/reportable-range-types';
import { formatNumber, withUnit } from '@shared/types/findings-numbers';
import { plural } from '@shared/types/plural';
import { paddedAxis, type PlotAxis } from '@shared/types/plot-axes';
import type { MarkerArea, Markers } from '../../../findings/charts/markers-plugin';
import { PALETTE } from '../../../findings/charts/palette';
import type { PlotDatum, PointDataset } from '../../../findings/charts/scatter-data';

/**
 * The linearity plot: every included result and each level's mean against the level's x (its assigned value, or the
 * high pool's fraction), the straight line and the best-fitting polynomial (a smooth curve, when it is not the straight
 * line), and the allowable nonlinearity as a shaded band around the straight line. Drawing only: the lines are the
 * engine's coefficients, and the band's half-width at each x follows the engine's rule (the larger of the absolute goal
 * and the % goal of the straight line's value), so at every level it is the engine's goal there. Lines and band span
 * the levels tested, never beyond them.
 */
export interface RangePlot {
  datasets: PointDataset[];
  markers: Markers;
  x: PlotAxis;
  y: PlotAxis;
  xTitle: string;
  yTitle: string;
  /** What the plot shows and how to read it (its caption). */
  caption: string;
}

/** How many steps the curves and the band are drawn in between the lowest and the highest level. */
const STEPS = 64;


/** The allowable nonlinearity at a straight-line value, by the engine's rule (the larger of the absolute goal and the % goal of |value|; null without a goal). */
export function goalAt(linear: number, goal: RangeResult['goal']): number | null {
  return allowableBiasAt(linear, goal.absolute ?? null, goal.percent ?? null);
}

/** The x the curves are drawn at: even steps from the lowest to the highest level, and every level's own x. */
export function curveXs(xs: readonly number[]): number[] {
  if (xs.length === 0) return [];
  const lo = Math.min(...xs);
  const hi = Math.max(...xs);
  const even = Array.from({ length: STEPS + 1 }, (_, k) => lo + ((hi - lo) * k) / STEPS);
  return [...new Set([...even, ...xs])].sort((a, b) => a - b);
}

/** The plot's datasets, band and axes (see RangePlot). */
export function rangePlot(r: RangeResult, f: RangeFormat): RangePlot {
  const fraction = r.basis === 'fraction';
  const u = f.unit ? ` (${f.unit})` : '';
  const straight = r.fits.find((fit) => fit.degree === 1) ?? null;
  const best = r.fits.find((fit) => fit.degree === r.bestDegree) ?? straight;
  const xs = curveXs(r.levels.map((l) => l.x));
  const result = (v: number): string => withUnit(formatNumber(v, f.value), f.unit);
  const at = (l: RangeResult['levels'][number]): string => (fraction ? `Fraction ${xText(l, f)}` : `Assigned ${withUnit(xText(l, f), f.unit)}`);

  const results: PlotDatum[] = r.levels.flatMap((l) => l.values.map((v) => ({ x: l.x, y: v, tip: [l.level, `Result ${result(v)}`, at(l)] })));
  const means: PlotDatum[] = r.levels.map((l) => ({
    x: l.x, y: l.mean,
    tip: [
      l.level, `Mean ${withUnit(statText(l.mean, f), f.unit)} (${plural(l.n, 'result')})`, at(l),
      `Straight line ${withUnit(statText(l.linear, f), f.unit)}, best fit ${withUnit(statText(l.fitted, f), f.unit)}`,
      `Deviation ${withUnit(statText(l.deviation, f), f.unit)} (${percentText(l.deviationPercent, f)}), allowable ±${withUnit(statText(l.goal, f), f.unit)}`,
    ],
  }));
  const datasets: PointDataset[] = [
    { label: 'Results', data: results, pointStyle: 'circle', backgroundColor: PALETTE.point, borderColor: PALETTE.pointBorder, borderWidth: 1, pointRadius: 4, pointHoverRadius: 6, pointHitRadius: 4 },
    // A level's mean: a short bar across its results (chart.js's 'line' point style), drawn under them.
    { label: "Level's mean", data: means, pointStyle: 'line', borderColor: PALETTE.bias, backgroundColor: PALETTE.bias, borderWidth: 3, pointRadius: 12, pointHoverRadius: 13, pointHitRadius: 6, order: 1 },
  ];
  const curve = (coefficients: readonly number[]) => xs.map((x) => ({ x, y: polynomialAt(coefficients, x) }));
  const bestIsStraight = !best || best.degree === 1;
  if (straight) {
    datasets.push({
      label: bestIsStraight ? 'Straight line (the best fit)' : 'Straight line', data: curve(straight.coefficients), showLine: true, pointRadius: 0, pointHitRadius: 0,
      pointStyle: 'line', borderColor: PALETTE.bias, borderWidth: 1.5, borderDash: bestIsStraight ? [] : [6, 4],
    });
  }
  if (best && !bestIsStraight) {
    datasets.push({
      label: `Best fit: polynomial of degree ${best.degree}`, data: curve(best.coefficients), showLine: true, pointRadius: 0, pointHitRadius: 0,
      pointStyle: 'line', borderColor: PALETTE.regression, borderWidth: 2,
    });
  }

  const areas: MarkerArea[] = [];
  if (straight) {
    const points = xs.flatMap((x) => {
      const linear = polynomialAt(straight.coefficients, x);
      const half = goalAt(linear, r.goal);
      return half === null ? [] : [{ x, lower: linear - half, upper: linear + half }];
    });
    if (points.length > 1) {
      const source = r.goal.source?.trim();
      areas.push({
        points, color: PALETTE.allowable, edge: PALETTE.allowableEdge, dash: [4, 3],
        label: `Allowable nonlinearity around the straight line: ${goalText(r.goal, f)}${source ? ` (source: ${source})` : ''}`,
      });
    }
  }

  const ys = [
    ...r.levels.flatMap((l) => [...l.values, l.mean, l.linear, l.fitted]),
    ...areas.flatMap((a) => a.points.flatMap((p) => [p.lower, p.upper])),
  ];
  return {
    datasets,
    markers: { lines: [], bands: [], areas },
    // About 8 ticks: with 5, levels from 0.3 to 32 would get an axis from −10 to 40.
    x: paddedAxis(r.levels.map((l) => l.x), fraction ? { count: 8 } : { count: 8, resolution: 10 ** -f.value }),
    y: paddedAxis(ys, { count: 8, resolution: 10 ** -f.value }),
    xTitle: fraction ? 'Fraction of the high pool' : `Assigned value${u}`,
    yTitle: `Result${u}`,
    caption: `${plural(r.levels.reduce((n, l) => n + l.n, 0), 'result')} at ${plural(r.levels.length, 'level')}: each result a dot, each level's mean a short bar. ` +
      (bestIsStraight
        ? 'The solid line is the straight line, which fits best; '
        : `The dashed line is the straight line, the solid curve the best fit (degree ${best!.degree}); `) +
      (areas.length ? 'the shaded band around the straight line is the allowable nonlinearity.' : 'no allowable nonlinearity is set, so no band is drawn.'),
  };
}
