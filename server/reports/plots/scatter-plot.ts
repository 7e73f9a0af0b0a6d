import { COLOR } from '../theme';
import { clipped, drawAxes, makeFrame } from './frame';
import { dataLine, legend, points } from './marks';
import type { Box } from './plot-box';
import { extent, niceAxis } from './scale';

export interface ScatterInput {
  included: [number, number][];
  excluded: [number, number][];
  /** The fitted line y = intercept + slope·x, when the fit exists. */
  line: { slope: number; intercept: number; label: string } | null;
  xLabel: string;
  yLabel: string;
}

/** Candidate against comparative on one common scale, with the identity line and the fitted line. */
export function scatterPlot(doc: PDFKit.PDFDocument, box: Box, input: ScatterInput): void {
  const all = [...input.included, ...input.excluded];
  const [lo, hi] = extent(all.flatMap(([x, y]) => [x, y]));
  const axis = niceAxis(lo, hi);
  const frame = makeFrame(doc, box, axis, axis);
  drawAxes(frame, { title: 'Scatter plot', x: input.xLabel, y: input.yLabel });
  clipped(frame, () => {
    dataLine(frame, [axis.min, axis.min], [axis.max, axis.max], { color: COLOR.muted, width: 0.8, dash: 3 });
    if (input.line) {
      const { slope, intercept } = input.line;
      dataLine(frame, [axis.min, intercept + slope * axis.min], [axis.max, intercept + slope * axis.max], { color: COLOR.warm, width: 1.3 });
    }
    points(frame, input.included, { color: COLOR.accent });
    points(frame, input.excluded, { color: COLOR.bad, hollow: true, radius: 2.2 });
  });
  legend(frame, [
    { label: 'y = x', color: COLOR.muted, kind: 'dash' },
    ...(input.line ? [{ label: input.line.label, color: COLOR.warm, kind: 'line' as const }] : []),
    ...(input.excluded.length ? [{ label: 'excluded', color: COLOR.bad, kind: 'ring' as const }] : []),
  ]);
}
