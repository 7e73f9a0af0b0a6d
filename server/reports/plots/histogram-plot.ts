import type { HistogramBin } from '@shared/stats';
import { COLOR } from '../theme';
import { clipped, dataWidth, drawAxes, makeFrame, type Frame } from './frame';
import { band, legend, legendRows, markerLine, type LegendItem } from './marks';
import type { Box } from './plot-box';
import { niceAxis, paddedAxis } from './scale';

export interface HistogramInput {
  title: string;
  xLabel: string;
  bins: (HistogramBin & { tail?: 'lower' | 'upper' | null })[];
  /** Vertical markers (an observed value, a limit, an estimate). */
  markers: { value: number; color: string; dash?: boolean }[];
  /** Shaded spans of x (a CI, a tail); infinite ends stop at the axis. */
  bands: { span: [number, number]; color: string }[];
  legend: LegendItem[];
  /** The reporting step of the values (ticks are never finer); reference values are binned at its half-steps by the caller. */
  resolution?: number | null;
}

/**
 * Bars of counts on a padded axis; bins in a tail (bootstrap test) are filled light in the warm colour, the
 * others dark, so the two differ in grey print too.
 */
export function histogramPlot(doc: PDFKit.PDFDocument, box: Box, input: HistogramInput, yLabel = 'Resamples'): Frame {
  const xs = [...input.bins.flatMap((b) => [b.from, b.to]), ...input.markers.map((m) => m.value), ...input.bands.flatMap((b) => b.span)].filter(Number.isFinite);
  const top = Math.max(1, ...input.bins.map((b) => b.count));
  const xAxis = paddedAxis(xs, { resolution: input.resolution, share: 0.03, count: box.width > 300 ? 8 : 5 });
  const frame = makeFrame(doc, box, xAxis, niceAxis(0, top * 1.06, 4, 1), legendRows(doc, input.legend, dataWidth(box)).length);
  drawAxes(frame, { title: input.title, x: input.xLabel, y: yLabel });
  clipped(frame, () => {
    for (const b of input.bands) band(frame, b.span, b.color, 'vertical');
    for (const bin of input.bins) {
      if (bin.count === 0) continue;
      const left = frame.px(bin.from);
      const width = Math.max(0.6, frame.px(bin.to) - left - 0.3);
      const y = frame.py(bin.count);
      doc.save().rect(left, y, width, frame.py(0) - y).fillColor(bin.tail ? COLOR.warm : COLOR.accent).fillOpacity(bin.tail ? 0.45 : 1).fill().restore();
    }
    for (const m of input.markers) markerLine(frame, m.value, { color: m.color, width: 1.2, dash: m.dash ? 3 : undefined });
  });
  legend(frame, input.legend);
  return frame;
}
