import { formatNumber } from '@shared/types/findings-numbers';
import { drawText, measure, textWidth, type TextStyle } from '../../reports/text';
import { COLOR, SIZE } from '../../reports/theme';

/**
 * The deviation from linearity at each level against the allowable nonlinearity, drawn in the visual language of
 * the method comparison's decision-level picture (server/reports/plots/decision-track.ts): one horizontal track per
 * level on a common axis of deviation, symmetric about 0 (no deviation). The allowable band (± the goal at that
 * level) is a hatched light-teal rectangle with solid edges, the CI a dark bar with end caps, and the deviation a
 * diamond: filled (within), half-filled (within, but the CI reaches beyond) or open (beyond). The level stands at the
 * left, the judgement in words and its numbers at the right. No colour carries meaning alone.
 */

export type { DeviationMark } from '@shared/kinds/reportable-range/words';
import type { DeviationMark } from '@shared/kinds/reportable-range/words';

export interface DeviationTrack {
  /** The level's name, and its x in words ("32.0 mmol/L", "fraction 0.125") under it. */
  name: string;
  at: string;
  deviation: number;
  ci: readonly [number, number] | null;
  /** The allowable deviation here (half the band's width). */
  goal: number;
  mark: DeviationMark;
  /** The judgement in words ("Within", "Beyond the goal"). */
  word: string;
  /** The numbers beside the word, a line each. */
  lines: string[];
}

export interface DeviationPicture {
  tracks: DeviationTrack[];
  /** The axis title, with the unit. */
  axisTitle: string;
  /** Decimals of the tick labels (the tables' decimals of a deviation). */
  decimals: number;
  /** The legend's words for the three marks and the CI. */
  legend: { filled: string; half: string; open: string; ci: string };
  /** The band's caption: the goal in words and its source. */
  bandCaption: string;
}

const LEFT = 74;
const RIGHT = 150;
const GAP = 10;
const MIN_ROW = 30;
const AXIS = 32;
const MARK = 4.6;
const INK = COLOR.ink;
const BAND_EDGE = COLOR.accent;
const BAND_FILL = '#e4eff2';
const HATCH = '#8fb4c0';

const wordStyle: TextStyle = { size: 9, bold: true };
const detail: TextStyle = { size: 7.5, color: COLOR.muted };
const nameStyle: TextStyle = { size: 8.5, bold: true };

interface AxisSpec { min: number; max: number; ticks: number[] }

/**
 * The common axis: symmetric about 0, wide enough for every band, CI and deviation plus a margin, ending on ticks of
 * 1, 2 or 5 × 10^k, never finer than the tables' decimals can write.
 */
export function deviationAxis(tracks: DeviationTrack[], decimals: number): AxisSpec {
  let reach = 0;
  const take = (v: number | null | undefined): void => {
    if (typeof v === 'number' && Number.isFinite(v)) reach = Math.max(reach, Math.abs(v));
  };
  for (const t of tracks) {
    take(t.deviation);
    take(t.goal);
    t.ci?.forEach(take);
  }
  const finest = 10 ** -decimals;
  if (reach === 0) reach = finest * 5;
  const padded = reach * 1.12;
  const raw = padded / 3;
  const power = 10 ** Math.floor(Math.log10(raw));
  const step = Math.max([1, 2, 5, 10].map((m) => m * power).find((s) => s >= raw * (1 - 1e-9)) ?? 10 * power, finest);
  const count = Math.ceil(padded / step - 1e-9);
  const ticks: number[] = [];
  for (let i = -count; i <= count; i++) {
    const t = Number((i * step).toPrecision(12));
    ticks.push(t === 0 ? 0 : t);
  }
  return { min: -count * step, max: count * step, ticks };
}

/** Every track takes the height of the tallest, so the tracks keep one rhythm down the picture. */
function rowHeight(doc: PDFKit.PDFDocument, picture: DeviationPicture): number {
  return Math.max(MIN_ROW, ...picture.tracks.map((t) => {
    const right = measure(doc, t.word, wordStyle, RIGHT) + t.lines.reduce((h, line) => h + measure(doc, line, detail, RIGHT), 0);
    const left = measure(doc, t.name, nameStyle, LEFT) + measure(doc, t.at, detail, LEFT);
    return Math.max(right, left) + 6;
  }));
}

function legendKeys(picture: DeviationPicture): { kind: DeviationMark | 'ci'; label: string }[] {
  return [
    { kind: 'filled', label: picture.legend.filled },
    { kind: 'half', label: picture.legend.half },
    { kind: 'open', label: picture.legend.open },
    { kind: 'ci', label: picture.legend.ci },
  ];
}

function legendLines(doc: PDFKit.PDFDocument, picture: DeviationPicture, width: number): { kind: DeviationMark | 'ci'; label: string; x: number }[][] {
  const lines: { kind: DeviationMark | 'ci'; label: string; x: number }[][] = [[]];
  let x = 0;
  for (const item of legendKeys(picture)) {
    const w = 18 + textWidth(doc, item.label, detail) + 12;
    if (x > 0 && x + w > width) {
      lines.push([]);
      x = 0;
    }
    lines[lines.length - 1].push({ ...item, x });
    x += w;
  }
  return lines;
}

function legendHeight(doc: PDFKit.PDFDocument, picture: DeviationPicture, width: number): number {
  return legendLines(doc, picture, width).length * 11 + measure(doc, picture.bandCaption, detail, width - 22) + 4;
}

/** A run of tracks drawn together with the axis under them; the last run carries the legend. */
export interface DeviationPart { from: number; to: number; legend: boolean; height: number; newPage: boolean }

function partHeight(doc: PDFKit.PDFDocument, picture: DeviationPicture, width: number, rows: number, withLegend: boolean): number {
  return rows * rowHeight(doc, picture) + AXIS + (withLegend ? legendHeight(doc, picture, width) : 0) + 4;
}

/**
 * The picture cut between tracks where it does not fit: the first part into `room` (what is left of this page), the
 * rest into `pageRoom` each; every part has the axis under its tracks, the last the legend. A part holds at least two
 * tracks (or all that are left), so a page never ends on one lone track.
 */
export function deviationParts(doc: PDFKit.PDFDocument, picture: DeviationPicture, width: number, room: number, pageRoom: number): DeviationPart[] {
  const row = rowHeight(doc, picture);
  const total = picture.tracks.length;
  const parts: DeviationPart[] = [];
  let from = 0;
  let space = room;
  let newPage = false;
  while (from < total) {
    const left = total - from;
    const whole = partHeight(doc, picture, width, left, true);
    if (whole <= space) {
      parts.push({ from, to: total, legend: true, height: whole, newPage });
      break;
    }
    const take = Math.min(Math.floor((space - AXIS - 4) / row), left - 2);
    if (take >= 2) {
      parts.push({ from, to: from + take, legend: false, height: partHeight(doc, picture, width, take, false), newPage });
      from += take;
    } else if (space === pageRoom) {
      // Only on a page far smaller than A4: draw what is left here.
      parts.push({ from, to: total, legend: true, height: whole, newPage });
      break;
    }
    space = pageRoom;
    newPage = true;
  }
  return parts;
}

/** Draws one part of the picture at (x, y); returns the height used. */
export function drawDeviationPart(doc: PDFKit.PDFDocument, picture: DeviationPicture, part: DeviationPart, x: number, y: number, width: number): number {
  const axis = deviationAxis(picture.tracks, picture.decimals);
  const x0 = x + LEFT + GAP;
  const x1 = x + width - RIGHT - GAP;
  const px = (v: number): number => x0 + ((v - axis.min) / (axis.max - axis.min || 1)) * (x1 - x0);
  const row = rowHeight(doc, picture);
  const tracks = picture.tracks.slice(part.from, part.to);
  const rowsHeight = tracks.length * row;
  doc.save().lineWidth(0.4).strokeColor('#e2e7ea');
  for (const t of axis.ticks) if (t !== 0) doc.moveTo(px(t), y).lineTo(px(t), y + rowsHeight);
  doc.stroke().restore();
  let top = y;
  for (const t of tracks) {
    drawRow(doc, t, px, x, top, width);
    top += row;
  }
  // 0 (no deviation from the straight line) as a dotted line through every track.
  doc.save().lineWidth(0.7).strokeColor(COLOR.muted).dash(1, { space: 1.6 });
  doc.moveTo(px(0), y - 2).lineTo(px(0), y + rowsHeight).stroke();
  doc.restore();
  top += drawAxis(doc, picture, axis, px, x0, x1, top);
  if (part.legend) top += drawLegend(doc, picture, x, top, width);
  return top - y + 4;
}

function drawRow(doc: PDFKit.PDFDocument, t: DeviationTrack, px: (v: number) => number, x: number, y: number, width: number): void {
  const mid = y + 11.5;
  const nameHeight = drawText(doc, t.name, x, y + 4, nameStyle, { width: LEFT, align: 'right' });
  drawText(doc, t.at, x, y + 4 + nameHeight, detail, { width: LEFT, align: 'right' });
  doc.save().lineWidth(0.5).strokeColor(COLOR.rule).moveTo(x + LEFT + GAP, mid).lineTo(x + width - RIGHT - GAP, mid).stroke().restore();
  if (t.goal > 0) band(doc, px(-t.goal), px(t.goal), mid);
  if (t.ci) ci(doc, px(t.ci[0]), px(t.ci[1]), mid);
  mark(doc, t.mark, px(t.deviation), mid);
  let ty = y + 4;
  const rx = x + width - RIGHT;
  ty += drawText(doc, t.word, rx, ty, wordStyle, { width: RIGHT });
  for (const line of t.lines) ty += drawText(doc, line, rx, ty, detail, { width: RIGHT });
}

function band(doc: PDFKit.PDFDocument, from: number, to: number, mid: number, h = 16): void {
  const top = mid - h / 2;
  doc.save().rect(from, top, to - from, h).fill(BAND_FILL);
  doc.save().rect(from, top, to - from, h).clip().lineWidth(0.45).strokeColor(HATCH);
  for (let hx = from - h; hx < to; hx += 3.2) doc.moveTo(hx, top + h).lineTo(hx + h, top);
  doc.stroke().restore();
  doc.lineWidth(1).strokeColor(BAND_EDGE);
  doc.moveTo(from, top).lineTo(from, top + h).moveTo(to, top).lineTo(to, top + h).stroke();
  doc.restore();
}

function ci(doc: PDFKit.PDFDocument, from: number, to: number, mid: number): void {
  doc.save().lineWidth(2.6).strokeColor(INK).lineCap('butt');
  if (to - from > 0.5) doc.moveTo(from, mid).lineTo(to, mid).stroke();
  doc.lineWidth(1).moveTo(from, mid - 4).lineTo(from, mid + 4).moveTo(to, mid - 4).lineTo(to, mid + 4).stroke();
  doc.restore();
}

/** The deviation's diamond: filled, half-filled (left half) or open. */
function mark(doc: PDFKit.PDFDocument, kind: DeviationMark, cx: number, cy: number, r = MARK): void {
  doc.save();
  const diamond = (): void => {
    doc.moveTo(cx, cy - r).lineTo(cx + r, cy).lineTo(cx, cy + r).lineTo(cx - r, cy).closePath();
  };
  diamond();
  doc.fillColor(kind === 'filled' ? INK : '#ffffff').fill();
  if (kind === 'half') doc.moveTo(cx, cy - r).lineTo(cx, cy + r).lineTo(cx - r, cy).closePath().fillColor(INK).fill();
  diamond();
  doc.lineWidth(1.1).strokeColor(INK).lineJoin('miter').stroke();
  doc.restore();
}

function drawAxis(doc: PDFKit.PDFDocument, picture: DeviationPicture, axis: AxisSpec, px: (v: number) => number, x0: number, x1: number, y: number): number {
  const small = { size: SIZE.small, color: COLOR.muted };
  doc.save().lineWidth(0.6).strokeColor(COLOR.muted).moveTo(x0, y + 2).lineTo(x1, y + 2).stroke();
  for (const t of axis.ticks) {
    doc.moveTo(px(t), y + 2).lineTo(px(t), y + 5).stroke();
    drawText(doc, formatNumber(t, picture.decimals), px(t) - 20, y + 6, small, { width: 40, align: 'center', oneLine: true });
  }
  doc.restore();
  drawText(doc, picture.axisTitle, x0, y + 17, small, { width: x1 - x0, align: 'center', oneLine: true });
  return AXIS;
}

function drawLegend(doc: PDFKit.PDFDocument, picture: DeviationPicture, x: number, y: number, width: number): number {
  let top = y;
  for (const line of legendLines(doc, picture, width)) {
    for (const item of line) {
      const sx = x + item.x;
      const cy = top + 4.6;
      if (item.kind === 'ci') ci(doc, sx + 2, sx + 14, cy);
      else mark(doc, item.kind, sx + 8, cy, 3.6);
      drawText(doc, item.label, sx + 18, top, detail, { width: textWidth(doc, item.label, detail) + 2, oneLine: true });
    }
    top += 11;
  }
  band(doc, x + 1, x + 15, top + 5, 9);
  top += drawText(doc, picture.bandCaption, x + 22, top, detail, { width: width - 22 }) + 4;
  return top - y;
}
