import { drawText, textWidth } from '../text';
import { COLOR, SIZE } from '../theme';
import type { Frame } from './frame';

export interface Stroke { color: string; width?: number; dash?: number }

/** A line between two data points (the caller clips to the data area). */
export function dataLine(frame: Frame, from: [number, number], to: [number, number], stroke: Stroke): void {
  const { doc } = frame;
  doc.save().lineWidth(stroke.width ?? 1).strokeColor(stroke.color);
  if (stroke.dash) doc.dash(stroke.dash, { space: stroke.dash * 0.8 });
  doc.moveTo(frame.px(from[0]), frame.py(from[1])).lineTo(frame.px(to[0]), frame.py(to[1])).stroke();
  doc.restore();
}

/** A horizontal line across the data area at y = value. */
export function levelLine(frame: Frame, value: number, stroke: Stroke): void {
  dataLine(frame, [frame.xAxis.min, value], [frame.xAxis.max, value], stroke);
}

/** A vertical line across the data area at x = value. */
export function markerLine(frame: Frame, value: number, stroke: Stroke): void {
  dataLine(frame, [value, frame.yAxis.min], [value, frame.yAxis.max], stroke);
}

/** A translucent band between two y values (horizontal) or two x values (vertical). */
export function band(frame: Frame, span: readonly [number, number], color: string, direction: 'horizontal' | 'vertical', opacity = 0.22): void {
  const { doc } = frame;
  const axis = direction === 'horizontal' ? frame.yAxis : frame.xAxis;
  const clamp = (v: number): number => Math.min(axis.max, Math.max(axis.min, v));
  span = [clamp(span[0]), clamp(span[1])];
  doc.save().fillColor(color).fillOpacity(opacity);
  if (direction === 'horizontal') {
    const top = frame.py(Math.max(span[0], span[1]));
    doc.rect(frame.x, top, frame.width, Math.abs(frame.py(span[0]) - frame.py(span[1]))).fill();
  } else {
    const left = frame.px(Math.min(span[0], span[1]));
    doc.rect(left, frame.y, Math.abs(frame.px(span[1]) - frame.px(span[0])), frame.height).fill();
  }
  doc.restore();
}

export function points(frame: Frame, data: [number, number][], style: { color: string; radius?: number; hollow?: boolean }): void {
  const { doc } = frame;
  const r = style.radius ?? 1.8;
  doc.save().lineWidth(0.7);
  for (const [x, y] of data) {
    doc.circle(frame.px(x), frame.py(y), r);
    if (style.hollow) doc.strokeColor(style.color).stroke();
    else doc.fillColor(style.color).fillOpacity(0.85).fill();
  }
  doc.restore();
}

export interface LegendItem { label: string; color: string; kind: 'line' | 'dash' | 'band' | 'point' | 'ring' }

/** A row of legend keys under the axis title, from the left edge of the data area. */
export function legend(frame: Frame, items: LegendItem[]): void {
  const { doc } = frame;
  const style = { size: SIZE.small, color: COLOR.muted };
  let x = frame.x;
  const y = frame.y + frame.height + 29;
  for (const item of items) {
    swatch(doc, item, x, y + 4.5);
    x += 16;
    const w = textWidth(doc, item.label, style);
    drawText(doc, item.label, x, y, style, { width: w + 2, oneLine: true });
    x += w + 12;
  }
}

function swatch(doc: PDFKit.PDFDocument, item: LegendItem, x: number, y: number): void {
  doc.save();
  if (item.kind === 'band') doc.rect(x, y - 3, 12, 6).fillColor(item.color).fillOpacity(0.3).fill();
  else if (item.kind === 'point') doc.circle(x + 6, y, 2).fillColor(item.color).fill();
  else if (item.kind === 'ring') doc.circle(x + 6, y, 2.2).lineWidth(0.7).strokeColor(item.color).stroke();
  else {
    doc.lineWidth(1.2).strokeColor(item.color);
    if (item.kind === 'dash') doc.dash(3, { space: 2 });
    doc.moveTo(x, y).lineTo(x + 12, y).stroke();
  }
  doc.restore();
}
