import { COLOR } from '../theme';
import { clipped, drawAxes, makeFrame } from './frame';
import { band, legend, markerLine } from './marks';
import type { Box } from './plot-box';
import { extent, niceAxis } from './scale';

export interface StripInput {
  title: string;
  xLabel: string;
  values: number[];
  lower: number | null;
  upper: number | null;
}

/**
 * Values as dots along one axis, stacked where they would overlap (a dot plot, so no random jitter),
 * against the stated limits; dots outside the limits in the alarm colour.
 */
export function stripPlot(doc: PDFKit.PDFDocument, box: Box, input: StripInput): void {
  const limits = [input.lower, input.upper].filter((v): v is number => v !== null);
  const frame = makeFrame(doc, box, niceAxis(...extent([...input.values, ...limits], 0.08)), niceAxis(0, 1, 1));
  drawAxes(frame, { title: input.title, x: input.xLabel, y: null });
  const radius = 2.4;
  const stacks = new Map<number, number>();
  clipped(frame, () => {
    if (input.lower !== null && input.upper !== null) band(frame, [input.lower, input.upper], COLOR.accent, 'vertical', 0.12);
    for (const v of limits) markerLine(frame, v, { color: COLOR.accent, width: 1.2, dash: 4 });
    for (const v of [...input.values].sort((a, b) => a - b)) {
      const column = Math.round(frame.px(v) / (2 * radius));
      const level = stacks.get(column) ?? 0;
      stacks.set(column, level + 1);
      const outside = (input.lower !== null && v < input.lower) || (input.upper !== null && v > input.upper);
      const cy = frame.y + frame.height - radius - 1 - level * 2 * radius;
      doc.circle(column * 2 * radius, Math.max(frame.y + radius, cy), radius).fillColor(outside ? COLOR.bad : COLOR.ink).fillOpacity(0.85).fill();
    }
  });
  legend(frame, [
    { label: 'stated limits', color: COLOR.accent, kind: 'dash' },
    { label: 'inside', color: COLOR.ink, kind: 'point' },
    { label: 'outside', color: COLOR.bad, kind: 'point' },
  ]);
}
