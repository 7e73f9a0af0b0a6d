import { outsideStated } from '@shared/stats/stated-limits';
import { dataStep } from '@shared/types/plot-axes';
import { COLOR } from '../theme';
import { clipped, drawAxes, makeFrame, type Frame } from './frame';
import { band, legend, markerLine } from './marks';
import type { Box } from './plot-box';
import { niceAxis, paddedAxis } from './scale';

export interface StripInput {
  title: string;
  xLabel: string;
  values: number[];
  lower: number | null;
  upper: number | null;
  /** The reporting step of the values; read from the values when not given. */
  resolution?: number | null;
}

/**
 * Values as dots along one axis, stacked where they would overlap (a dot plot, so no random jitter),
 * against the stated limits; values outside the limits as diamonds in the warm colour (a shape as well as a
 * colour). The axis is padded past every value and limit, its ticks in steps the results can be reported in.
 */
export function stripPlot(doc: PDFKit.PDFDocument, box: Box, input: StripInput): Frame {
  const limits = [input.lower, input.upper].filter((v): v is number => v !== null);
  const resolution = input.resolution ?? (input.values.length ? dataStep([...input.values, ...limits]) : null);
  const frame = makeFrame(doc, box, paddedAxis([...input.values, ...limits], { resolution, share: 0.08 }), niceAxis(0, 1, 1));
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
      const outside = outsideStated(v, input);
      const cx = column * 2 * radius;
      const cy = Math.max(frame.y + radius, frame.y + frame.height - radius - 1 - level * 2 * radius);
      doc.save();
      if (outside) {
        const r = radius * 1.15;
        doc.polygon([cx, cy - r], [cx + r, cy], [cx, cy + r], [cx - r, cy]).lineWidth(0.8).fillColor(COLOR.warm).strokeColor(COLOR.warm).fillOpacity(0.4).fillAndStroke();
      } else {
        doc.circle(cx, cy, radius).fillColor(COLOR.ink).fillOpacity(0.85).fill();
      }
      doc.restore();
    }
  });
  legend(frame, [
    { label: 'stated limits', color: COLOR.accent, kind: 'dash' },
    { label: 'inside', color: COLOR.ink, kind: 'point' },
    { label: 'outside', color: COLOR.warm, kind: 'diamond' },
  ]);
  return frame;
}
