import type { HistogramBin } from '../../../shared/stats';
import { COLOR } from '../theme';
import { clipped, drawAxes, makeFrame } from './frame';
import { band, legend, markerLine, type LegendItem } from './marks';
import type { Box } from './plot-box';
import { extent, niceAxis } from './scale';

export interface HistogramInput {
  title: string;
  xLabel: string;
  bins: (HistogramBin & { tail?: 'lower' | 'upper' | null })[];
  /** Vertical markers (an observed value, a limit, an estimate). */
  markers: { value: number; color: string; dash?: boolean }[];
  /** Shaded spans of x (a CI, a tail); infinite ends stop at the axis. */
  bands: { span: [number, number]; color: string }[];
  legend: LegendItem[];
}

/** Bars of counts; bins in a tail (bootstrap test) are filled in the warm colour. */
export function histogramPlot(doc: PDFKit.PDFDocument, box: Box, input: HistogramInput, yLabel = 'Resamples'): void {
  const xs = [...input.bins.flatMap((b) => [b.from, b.to]), ...input.markers.map((m) => m.value), ...input.bands.flatMap((b) => b.span)].filter(Number.isFinite);
  const top = Math.max(1, ...input.bins.map((b) => b.count));
  const frame = makeFrame(doc, box, niceAxis(...extent(xs)), niceAxis(0, top * 1.05, 4));
  drawAxes(frame, { title: input.title, x: input.xLabel, y: yLabel });
  clipped(frame, () => {
    for (const b of input.bands) band(frame, b.span, b.color, 'vertical');
    for (const bin of input.bins) {
      if (bin.count === 0) continue;
      const left = frame.px(bin.from);
      const width = Math.max(0.6, frame.px(bin.to) - left - 0.3);
      const y = frame.py(bin.count);
      doc.rect(left, y, width, frame.py(0) - y).fill(bin.tail ? COLOR.warm : COLOR.accent);
    }
    for (const m of input.markers) markerLine(frame, m.value, { color: m.color, width: 1.2, dash: m.dash ? 3 : undefined });
  });
  legend(frame, input.legend);
}
