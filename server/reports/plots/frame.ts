import { drawText } from '../text';
import { COLOR, SIZE } from '../theme';
import { scale, tickLabel, type Axis } from './scale';

/** Where a plot draws on the page: the outer box, and inside it the data area right of and above the axes. */
export interface Frame {
  doc: PDFKit.PDFDocument;
  x: number;
  y: number;
  width: number;
  height: number;
  xAxis: Axis;
  yAxis: Axis;
  px: (value: number) => number;
  py: (value: number) => number;
}

const INSET = { left: 42, right: 8, top: 18, bottom: 42 };
/** The height of one more row of legend keys under the axis title. */
export const LEGEND_ROW = 11;

/** The width of a box's data area (what a legend may fill). */
export const dataWidth = (box: { width: number }): number => box.width - INSET.left - INSET.right;

/** The data area of a box: room is left under it for the tick labels, the axis title and `legendRows` rows of keys. */
export function makeFrame(doc: PDFKit.PDFDocument, box: { x: number; y: number; width: number; height: number }, xAxis: Axis, yAxis: Axis, legendRows = 1): Frame {
  const x = box.x + INSET.left;
  const y = box.y + INSET.top;
  const width = dataWidth(box);
  const height = box.height - INSET.top - INSET.bottom - Math.max(0, legendRows - 1) * LEGEND_ROW;
  return { doc, x, y, width, height, xAxis, yAxis, px: scale(xAxis, x, x + width), py: scale(yAxis, y + height, y) };
}

/** Title above, light grid lines at the ticks, tick labels, and the axis titles with their units. */
export function drawAxes(frame: Frame, labels: { title: string; x: string; y: string | null }): void {
  const { doc, x, y, width, height } = frame;
  const small = { size: SIZE.small, color: COLOR.muted };
  drawText(doc, labels.x, x, y + height + 15, small, { width, align: 'center', oneLine: true });
  drawText(doc, labels.title, x - 42, y - 16, { size: SIZE.body, bold: true }, { width: width + 50, oneLine: true });
  doc.save().lineWidth(0.4).strokeColor('#e2e7ea');
  for (const t of frame.xAxis.ticks) doc.moveTo(frame.px(t), y).lineTo(frame.px(t), y + height);
  if (labels.y !== null) for (const t of frame.yAxis.ticks) doc.moveTo(x, frame.py(t)).lineTo(x + width, frame.py(t));
  doc.stroke().restore();
  doc.rect(x, y, width, height).lineWidth(0.6).strokeColor(COLOR.rule).stroke();
  for (const t of frame.xAxis.ticks) {
    doc.moveTo(frame.px(t), y + height).lineTo(frame.px(t), y + height + 3).lineWidth(0.6).strokeColor(COLOR.muted).stroke();
    drawText(doc, tickLabel(frame.xAxis, t), frame.px(t) - 20, y + height + 4, small, { width: 40, align: 'center', oneLine: true });
  }
  if (labels.y === null) return;
  for (const t of frame.yAxis.ticks) {
    doc.moveTo(x - 3, frame.py(t)).lineTo(x, frame.py(t)).lineWidth(0.6).strokeColor(COLOR.muted).stroke();
    drawText(doc, tickLabel(frame.yAxis, t), x - 40, frame.py(t) - 4.5, small, { width: 35, align: 'right', oneLine: true });
  }
  doc.save().rotate(-90, { origin: [x - 36, y + height / 2] });
  drawText(doc, labels.y, x - 36 - height / 2, y + height / 2 - 5, small, { width: height, align: 'center', oneLine: true });
  doc.restore();
}

/** Runs `draw` with everything outside the data area clipped away. */
export function clipped(frame: Frame, draw: () => void): void {
  frame.doc.save();
  frame.doc.rect(frame.x, frame.y, frame.width, frame.height).clip();
  draw();
  frame.doc.restore();
}
