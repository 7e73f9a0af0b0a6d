import { drawText, textWidth, wrapAtSpaces } from '../text';
import { COLOR, SIZE } from '../theme';
import { LEGEND_ROW, type Frame } from './frame';

export interface Stroke { color: string; width?: number; dash?: number; space?: number }

/** A line between two data points (the caller clips to the data area). */
export function dataLine(frame: Frame, from: [number, number], to: [number, number], stroke: Stroke): void {
  const { doc } = frame;
  doc.save().lineWidth(stroke.width ?? 1).strokeColor(stroke.color);
  if (stroke.dash) doc.dash(stroke.dash, { space: stroke.space ?? stroke.dash * 0.8 });
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

/**
 * A region between a lower and an upper curve over x (the allowable-bias band): filled lightly, its two edges
 * dotted. Values beyond the y axis (an infinite percentage) are drawn at its edge; the caller clips.
 */
export function area(frame: Frame, curve: { x: number; lower: number; upper: number }[], style: { fill: string; edge: string; opacity?: number }): void {
  if (curve.length < 2) return;
  const { doc } = frame;
  const [high, low] = [frame.y - 2, frame.y + frame.height + 2];
  const top = (v: number): number => (Number.isFinite(v) ? Math.max(high, Math.min(low, frame.py(v))) : v > 0 ? high : low);
  doc.save();
  doc.moveTo(frame.px(curve[0].x), top(curve[0].upper));
  for (const p of curve.slice(1)) doc.lineTo(frame.px(p.x), top(p.upper));
  for (const p of [...curve].reverse()) doc.lineTo(frame.px(p.x), top(p.lower));
  doc.closePath().fillColor(style.fill).fillOpacity(style.opacity ?? 0.14).fill();
  doc.restore();
  for (const side of ['upper', 'lower'] as const) {
    doc.save().lineWidth(0.8).strokeColor(style.edge).dash(1, { space: 1.6 });
    doc.moveTo(frame.px(curve[0].x), top(curve[0][side]));
    for (const p of curve.slice(1)) doc.lineTo(frame.px(p.x), top(p[side]));
    doc.stroke().restore();
  }
}

/** A small filled triangle standing on the x axis at a value, pointing up into the plot (a decision level). */
export function axisTriangle(frame: Frame, value: number, color: string): void {
  const x = frame.px(value);
  if (x < frame.x - 0.5 || x > frame.x + frame.width + 0.5) return;
  const bottom = frame.y + frame.height;
  frame.doc.save().polygon([x, bottom - 6], [x - 3.4, bottom], [x + 3.4, bottom]).fillColor(color).fill().restore();
}

export type PointShape = 'dot' | 'ring' | 'diamond' | 'cross' | 'triangle';

function shape(doc: PDFKit.PDFDocument, kind: PointShape, x: number, y: number, r: number, color: string): void {
  if (kind === 'dot') doc.circle(x, y, r).fillColor(color).fillOpacity(0.85).fill();
  else if (kind === 'ring') doc.circle(x, y, r).lineWidth(0.8).strokeColor(color).stroke();
  else if (kind === 'diamond') doc.polygon([x, y - r * 1.35], [x + r * 1.35, y], [x, y + r * 1.35], [x - r * 1.35, y]).lineWidth(0.8).fillColor(color).strokeColor(color).fillOpacity(0.35).fillAndStroke();
  else if (kind === 'triangle') doc.polygon([x, y - r * 1.4], [x - r * 1.25, y + r * 0.9], [x + r * 1.25, y + r * 0.9]).fillColor(color).fill();
  else doc.lineWidth(0.9).strokeColor(color).moveTo(x - r, y - r).lineTo(x + r, y + r).moveTo(x - r, y + r).lineTo(x + r, y - r).stroke();
}

/** The dash pattern of a reference line (a target, a limit): long dash, dot, so it differs from a dashed data line in shape too. */
const REFERENCE_DASH = [6, 2, 1.2, 2];

/** Sets the reference line's dash pattern (pdfkit takes a pattern as an array; its types know one length only). */
export function referenceDash(doc: PDFKit.PDFDocument): PDFKit.PDFDocument {
  return doc.dash(REFERENCE_DASH as unknown as number, {});
}

/** Points of one kind: filled dots, open rings, diamonds, crosses or triangles, so kinds differ in shape, not colour alone. */
export function points(frame: Frame, data: [number, number][], style: { color: string; radius?: number; hollow?: boolean; shape?: PointShape }): void {
  const { doc } = frame;
  const r = style.radius ?? 1.8;
  const kind = style.shape ?? (style.hollow ? 'ring' : 'dot');
  for (const [x, y] of data) {
    doc.save();
    shape(doc, kind, frame.px(x), frame.py(y), r, style.color);
    doc.restore();
  }
}

export interface LegendItem {
  label: string;
  color: string;
  kind: 'line' | 'dash' | 'dots' | 'reference' | 'band' | 'area' | 'point' | 'ring' | 'diamond' | 'cross' | 'triangle';
  /** Set by legendRows on the further lines of a label too wide for one row: drawn without a key. */
  continued?: boolean;
}

const LEGEND_STYLE = { size: SIZE.small, color: COLOR.muted };
const KEY = 16;
const GAP = 12;

/**
 * A label broken into lines no wider than `width`: after the commas of a list first ("3.0 mmol/L, 10.0 mmol/L"),
 * at other spaces only where one item is itself too wide, and never between a value and its unit.
 */
function labelLines(doc: PDFKit.PDFDocument, label: string, width: number): string[] {
  const fits = (text: string): boolean => textWidth(doc, text, LEGEND_STYLE) <= width - 2;
  const lines: string[] = [];
  for (const piece of label.split(/(?<=,) /)) {
    const last = lines[lines.length - 1];
    if (last !== undefined && fits(`${last} ${piece}`)) lines[lines.length - 1] = `${last} ${piece}`;
    else if (fits(piece)) lines.push(piece);
    // A number and the word after it (its unit) stay together: joined by a no-break space while the piece is broken.
    else lines.push(...wrapAtSpaces(doc, piece.replace(/(\d) (?=\S)/g, '$1\u00a0'), LEGEND_STYLE.size, width).split('\n').map((l) => l.replace(/\u00a0/g, ' ')));
  }
  return lines;
}

/**
 * The legend's keys placed in rows no wider than `width`: each row a list of [item, x offset]. A label too wide
 * for a row of its own ("decision levels 3.0 mmol/L, 10.0 mmol/L, 20.0 mmol/L" under a half-width plot) is broken
 * at spaces over rows of its own, its key on the first, so no legend runs past its plot.
 */
export function legendRows(doc: PDFKit.PDFDocument, items: LegendItem[], width: number): [LegendItem, number][][] {
  const rows: [LegendItem, number][][] = [[]];
  let x = 0;
  for (const item of items) {
    const w = KEY + textWidth(doc, item.label, LEGEND_STYLE);
    if (w > width) {
      if (x > 0) rows.push([]);
      labelLines(doc, item.label, width - KEY).forEach((line, k) => {
        if (k > 0) rows.push([]);
        rows[rows.length - 1].push([{ ...item, label: line, continued: k > 0 }, 0]);
      });
      rows.push([]);
      x = 0;
      continue;
    }
    if (x > 0 && x + w > width) {
      rows.push([]);
      x = 0;
    }
    rows[rows.length - 1].push([item, x]);
    x += w + GAP;
  }
  if (rows.length > 1 && rows[rows.length - 1].length === 0) rows.pop();
  return rows;
}

/** Rows of legend keys under the axis title, from the left edge of the data area (see legendRows). */
export function legend(frame: Frame, items: LegendItem[]): void {
  const { doc } = frame;
  legendRows(doc, items, frame.width).forEach((row, k) => {
    const y = frame.y + frame.height + 29 + k * LEGEND_ROW;
    for (const [item, dx] of row) {
      const x = frame.x + dx;
      if (!item.continued) swatch(doc, item, x, y + 4.5);
      const w = textWidth(doc, item.label, LEGEND_STYLE);
      drawText(doc, item.label, x + KEY, y, LEGEND_STYLE, { width: w + 2, oneLine: true });
    }
  });
}

function swatch(doc: PDFKit.PDFDocument, item: LegendItem, x: number, y: number): void {
  doc.save();
  if (item.kind === 'band') doc.rect(x, y - 3, 12, 6).fillColor(item.color).fillOpacity(0.3).fill();
  else if (item.kind === 'area') {
    doc.rect(x, y - 3, 12, 6).fillColor(item.color).fillOpacity(0.14).fill();
    doc.fillOpacity(1).lineWidth(0.8).strokeColor(item.color).dash(1, { space: 1.6 }).moveTo(x, y - 3).lineTo(x + 12, y - 3).moveTo(x, y + 3).lineTo(x + 12, y + 3).stroke();
  } else if (item.kind === 'point') shape(doc, 'dot', x + 6, y, 2, item.color);
  else if (item.kind === 'ring') shape(doc, 'ring', x + 6, y, 2.2, item.color);
  else if (item.kind === 'diamond') shape(doc, 'diamond', x + 6, y, 2.2, item.color);
  else if (item.kind === 'cross') shape(doc, 'cross', x + 6, y, 2.2, item.color);
  else if (item.kind === 'triangle') doc.polygon([x + 6, y - 3], [x + 2.6, y + 3], [x + 9.4, y + 3]).fillColor(item.color).fill();
  else if (item.kind === 'reference') referenceDash(doc.lineWidth(0.9).strokeColor(item.color)).moveTo(x, y).lineTo(x + 12, y).stroke();
  else {
    doc.lineWidth(1.2).strokeColor(item.color);
    if (item.kind === 'dash') doc.dash(3, { space: 2 });
    if (item.kind === 'dots') doc.dash(1, { space: 1.6 });
    doc.moveTo(x, y).lineTo(x + 12, y).stroke();
  }
  doc.restore();
}
