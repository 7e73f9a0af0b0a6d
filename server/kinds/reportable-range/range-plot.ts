import { allowableBiasAt } from '@shared/stats/decision-levels';
import { polynomialAt } from '@shared/stats/polynomial-fit';
import type { RangeFit, RangeResult } from '@shared/stats/reportable-range-types';
import { clipped, dataWidth, drawAxes, makeFrame, type Frame } from '../../reports/plots/frame';
import { area, dataLine, legend, legendRows, points, type LegendItem } from '../../reports/plots/marks';
import type { Box } from '../../reports/plots/plot-box';
import { paddedAxis, type Axis } from '../../reports/plots/scale';
import { COLOR } from '../../reports/theme';

export interface RangePlotInput {
  title: string;
  /** The axis titles, with the unit. */
  xLabel: string;
  yLabel: string;
  /** The legend's words for the best-fitting polynomial ("best fit, degree 3"); null when the straight line fits best. */
  bestLabel: string | null;
  /** The legend's words for the allowable band; null draws none. */
  bandLabel: string | null;
  /** The legend's words for a level whose deviation lies beyond the goal. */
  beyondLabel: string;
}

/** How near the frame, in points, a value may stand: a level mean's ring and its replicates beside it stay whole. */
const MARK_ROOM = 6;

/**
 * An axis over values none of which is below 0 (concentrations, fractions) ends just below the smallest, by MARK_ROOM
 * points, rather than on a negative tick that padding reached; its first tick is then 0. `length` is the axis's length
 * in points (about).
 */
function fromZero(axis: Axis, values: number[], length: number): Axis {
  const lowest = Math.min(...values);
  if (!(axis.min < 0) || !(lowest >= 0) || !(length > 0)) return axis;
  const min = Math.min(0, lowest - (MARK_ROOM * axis.max) / length);
  return { ...axis, min, ticks: axis.ticks.filter((t) => t >= min) };
}

/** Samples enough to draw a cubic as a smooth curve at this size. */
const SAMPLES = 96;

const finite = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

/**
 * Linearity as a picture: every included result against its level's x (the assigned value, or the fraction of the
 * high pool), the replicates of a level side by side a point or two apart (no random jitter), the level's mean as a
 * ring, the straight line through all results, the best-fitting polynomial as a dashed curve, and around the
 * straight line the allowable nonlinearity (the larger of the absolute goal and the % goal of the line's value, as
 * the engine judges each level), lightly filled with dotted edges. A level whose deviation lies beyond the goal has
 * its mean drawn as a warm diamond: a shape as well as a colour.
 */
export function rangePlot(doc: PDFKit.PDFDocument, box: Box, results: RangeResult, input: RangePlotInput): Frame {
  const levels = results.levels ?? [];
  const line = (results.fits ?? []).find((f) => f.degree === 1) ?? null;
  const best = results.bestDegree > 1 ? (results.fits ?? []).find((f) => f.degree === results.bestDegree) ?? null : null;
  const goal = results.goal ?? { absolute: null, percent: null };
  const hasGoal = input.bandLabel !== null && (goal.absolute !== null || goal.percent !== null);
  const beyond = levels.some((l) => !l.within);
  const items: LegendItem[] = [
    { label: 'result', color: COLOR.accent, kind: 'point' },
    { label: 'level mean', color: COLOR.ink, kind: 'ring' },
    ...(beyond ? [{ label: input.beyondLabel, color: COLOR.warm, kind: 'diamond' as const }] : []),
    ...(line ? [{ label: 'straight line', color: COLOR.warm, kind: 'line' as const }] : []),
    ...(best && input.bestLabel ? [{ label: input.bestLabel, color: COLOR.ink, kind: 'dash' as const }] : []),
    ...(line && hasGoal ? [{ label: input.bandLabel!, color: COLOR.accent, kind: 'area' as const }] : []),
  ];
  const rows = legendRows(doc, items, dataWidth(box)).length;
  const xs = levels.map((l) => l.x).filter(finite);
  const xAxis = fromZero(paddedAxis(xs, { share: 0.04, count: 7 }), xs, dataWidth(box));
  // The fits and the band are drawn over the levels' span only: the fits hold there, and the goal is judged there.
  const lo = xs.length ? Math.min(...xs) : 0;
  const hi = xs.length ? Math.max(...xs) : 1;
  const curve = (fit: RangeFit): [number, number][] => Array.from({ length: SAMPLES + 1 }, (_, k) => {
    const x = lo + ((hi - lo) * k) / SAMPLES;
    return [x, polynomialAt(fit.coefficients, x)];
  });
  const band = line && hasGoal ? Array.from({ length: SAMPLES + 1 }, (_, k) => {
    const x = lo + ((hi - lo) * k) / SAMPLES;
    const y = polynomialAt(line.coefficients, x);
    const half = allowableBiasAt(y, goal.absolute, goal.percent) ?? 0;
    return { x, lower: y - half, upper: y + half };
  }) : [];
  const ys = [
    ...levels.flatMap((l) => [...(l.values ?? []), l.mean, l.linear, l.fitted]),
    ...(best ? curve(best).map(([, y]) => y) : []),
    ...band.flatMap((p) => [p.lower, p.upper]),
  ].filter(finite);
  // The data area's height is the box's less the title, the tick labels, the axis title and the legend (frame.ts).
  const yAxis = fromZero(paddedAxis(ys, { resolution: results.resolution?.increment, share: 0.04, count: 7 }), ys, box.height - 60 - 11 * rows);
  const frame = makeFrame(doc, box, xAxis, yAxis, rows);
  drawAxes(frame, { title: input.title, x: input.xLabel, y: input.yLabel });
  // Replicates of a level sit 2.6 points apart across its x, in the order measured.
  const perPoint = (xAxis.max - xAxis.min) / frame.width;
  clipped(frame, () => {
    if (band.length) area(frame, band, { fill: COLOR.accent, edge: COLOR.accent, opacity: 0.16 });
    if (line) dataLine(frame, [lo, polynomialAt(line.coefficients, lo)], [hi, polynomialAt(line.coefficients, hi)], { color: COLOR.warm, width: 1.2 });
    if (best) {
      const c = curve(best);
      doc.save().lineWidth(1.1).strokeColor(COLOR.ink).dash(3, { space: 2 });
      doc.moveTo(frame.px(c[0][0]), frame.py(c[0][1]));
      for (const [x, y] of c.slice(1)) doc.lineTo(frame.px(x), frame.py(y));
      doc.stroke().restore();
    }
    for (const l of levels) {
      const n = l.values?.length ?? 0;
      points(frame, (l.values ?? []).map((v, j): [number, number] => [l.x + (j - (n - 1) / 2) * 2.6 * perPoint, v]), { color: COLOR.accent, radius: 1.7 });
    }
    points(frame, levels.filter((l) => l.within).map((l): [number, number] => [l.x, l.mean]), { color: COLOR.ink, radius: 3.2, shape: 'ring' });
    points(frame, levels.filter((l) => !l.within).map((l): [number, number] => [l.x, l.mean]), { color: COLOR.warm, radius: 3, shape: 'diamond' });
  });
  legend(frame, items);
  return frame;
}
