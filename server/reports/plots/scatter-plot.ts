import { COLOR } from '../theme';
import { clipped, dataWidth, drawAxes, makeFrame, type Frame } from './frame';
import { area, dataLine, legend, legendRows, points, type LegendItem } from './marks';
import type { Box } from './plot-box';
import { paddedAxis } from './scale';

export interface ScatterInput {
  included: [number, number][];
  excluded: [number, number][];
  /** The fitted line y = intercept + slope·x, when the fit exists. */
  line: { slope: number; intercept: number; label: string } | null;
  /** The fitted line's pointwise CI over the comparative range, with its legend words; null when there is none. */
  band?: { points: { x: number; lower: number; upper: number }[]; label: string } | null;
  xLabel: string;
  yLabel: string;
  /** The reporting step of the results (ticks are never finer). */
  resolution?: number | null;
  /** At least this many rows of legend (to line up with the plot beside it). */
  legendRows?: number;
}

/** The scatter's legend: the pairs, the identity line, the fitted line and the excluded pairs. */
export function scatterLegend(input: ScatterInput): LegendItem[] {
  return [
    { label: 'pairs', color: COLOR.accent, kind: 'point' },
    { label: 'y = x', color: COLOR.muted, kind: 'dash' },
    ...(input.line ? [{ label: input.line.label, color: COLOR.warm, kind: 'line' as const }] : []),
    ...(input.line && input.band ? [{ label: input.band.label, color: COLOR.warm, kind: 'area' as const }] : []),
    ...(input.excluded.length ? [{ label: 'excluded', color: COLOR.warm, kind: 'cross' as const }] : []),
  ];
}

/**
 * Candidate against comparative on one common scale, padded so no point sits on the frame, with the identity
 * line and the fitted line with its CI band (lightly filled, dotted edges); excluded pairs as crosses (a shape,
 * not only a colour).
 */
export function scatterPlot(doc: PDFKit.PDFDocument, box: Box, input: ScatterInput): Frame {
  const all = [...input.included, ...input.excluded];
  const axis = paddedAxis(all.flatMap(([x, y]) => [x, y]), { resolution: input.resolution });
  const items = scatterLegend(input);
  const frame = makeFrame(doc, box, axis, axis, Math.max(input.legendRows ?? 1, legendRows(doc, items, dataWidth(box)).length));
  drawAxes(frame, { title: 'Scatter plot', x: input.xLabel, y: input.yLabel });
  clipped(frame, () => {
    dataLine(frame, [axis.min, axis.min], [axis.max, axis.max], { color: COLOR.muted, width: 0.8, dash: 3 });
    if (input.line && input.band) area(frame, input.band.points, { fill: COLOR.warm, edge: COLOR.warm, opacity: 0.12 });
    if (input.line) {
      const { slope, intercept } = input.line;
      dataLine(frame, [axis.min, intercept + slope * axis.min], [axis.max, intercept + slope * axis.max], { color: COLOR.warm, width: 1.3 });
    }
    points(frame, input.included, { color: COLOR.accent });
    points(frame, input.excluded, { color: COLOR.warm, shape: 'cross', radius: 2 });
  });
  legend(frame, items);
  return frame;
}
