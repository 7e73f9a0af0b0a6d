import { along, type DecisionPicture, type DecisionTrack, type TrackMark } from '@shared/types/decision-track';
import { LEVEL_VERDICT_WORDS } from '@shared/text/verdict-words';
import { drawText, measure, textWidth, type TextStyle } from '../text';
import { COLOR, SIZE } from '../theme';

/**
 * The decision-level picture (shared/types/decision-track.ts) drawn with pdfkit: one horizontal track per
 * decision level on a common axis of predicted bias. The allowable band is a hatched light-teal rectangle with
 * solid edges, the CI a dark bar with end caps, the floor (where the CI is narrower than the reporting step) a
 * dashed bracket around it, and the estimate a diamond: filled (within), half-filled (inconclusive), open
 * (exceeds). The level stands at the left, the verdict word and its numbers at the right. No colour carries
 * meaning alone: in grey print the hatching, the fill of the mark and the words tell the same.
 */

const LEFT = 64;
const RIGHT = 168;
const GAP = 10;
const MIN_ROW = 30;
const AXIS = 32;
const MARK = 4.6;
const INK = COLOR.ink;
const BAND_EDGE = COLOR.accent;
const BAND_FILL = '#e4eff2';
const HATCH = '#8fb4c0';

const word: TextStyle = { size: 9, bold: true };
const detail: TextStyle = { size: 7.5, color: COLOR.muted };
const levelStyle: TextStyle = { size: 8.5, bold: true };

interface Geometry { x0: number; x1: number; px: (v: number) => number }

const geometry = (picture: DecisionPicture, x: number, width: number): Geometry => {
  const x0 = x + LEFT + GAP;
  const x1 = x + width - RIGHT - GAP;
  return { x0, x1, px: (v) => x0 + along(picture.axis, v) * (x1 - x0) };
};

/** Every track takes the height of the tallest, so the tracks keep one rhythm down the picture. */
function rowHeight(doc: PDFKit.PDFDocument, picture: DecisionPicture): number {
  return Math.max(MIN_ROW, ...picture.tracks.map((t) => textHeight(doc, t)));
}

function textHeight(doc: PDFKit.PDFDocument, t: DecisionTrack): number {
  const text = measure(doc, t.word, word, RIGHT) + t.lines.reduce((h, line) => h + measure(doc, line, detail, RIGHT), 0);
  return Math.max(MIN_ROW, text + 6, measure(doc, t.at, levelStyle, LEFT) + 6);
}

/** The legend under the axis: one line of keys, then the band's caption with its source. */
function legendItems(picture: DecisionPicture): { kind: TrackMark | 'band' | 'ci' | 'floor'; label: string }[] {
  return [
    { kind: 'filled', label: LEVEL_VERDICT_WORDS.within.legend },
    { kind: 'half', label: LEVEL_VERDICT_WORDS.inconclusive.legend },
    { kind: 'open', label: LEVEL_VERDICT_WORDS.exceeds.legend },
    { kind: 'ci', label: `${picture.confidence} CI` },
    ...(picture.hasFloor ? [{ kind: 'floor' as const, label: 'judged on: CI widened to ± half a reporting step' }] : []),
  ];
}

/** A run of tracks drawn together with the axis under them; the legend comes with the last. */
export interface TrackPart {
  from: number;
  to: number;
  legend: boolean;
  height: number;
  /** Starts on a new page. */
  newPage: boolean;
}

/** Height of the whole picture at this width, measured before drawing so the layout can keep it on one page. */
export function decisionTrackHeight(doc: PDFKit.PDFDocument, picture: DecisionPicture, width: number): number {
  return partHeight(doc, picture, width, picture.tracks.length, true);
}

function partHeight(doc: PDFKit.PDFDocument, picture: DecisionPicture, width: number, rows: number, withLegend: boolean): number {
  return rows * rowHeight(doc, picture) + AXIS + (withLegend ? legendHeight(doc, picture, width) : 0) + 4;
}

/**
 * The picture cut between tracks where it would not fit: the first part into `room` (what is left of this
 * page), the rest into `pageRoom` (a whole page) each, every part with the axis under its tracks and the last
 * with the legend. A part holds at least two tracks (or all that are left), so a page never ends on one lone
 * track nor a tall picture leaves most of a page empty by jumping whole.
 */
export function decisionTrackParts(doc: PDFKit.PDFDocument, picture: DecisionPicture, width: number, room: number, pageRoom: number): TrackPart[] {
  const row = rowHeight(doc, picture);
  const total = picture.tracks.length;
  const parts: TrackPart[] = [];
  let from = 0;
  let space = room;
  let newPage = false;
  while (from < total) {
    const left = total - from;
    if (partHeight(doc, picture, width, left, true) <= space) {
      parts.push({ from, to: total, legend: true, height: partHeight(doc, picture, width, left, true), newPage });
      break;
    }
    const fits = Math.floor((space - AXIS - 4) / row);
    // Leave at least two tracks for the last part, which also carries the legend.
    const take = Math.min(fits, left - 2);
    if (take >= 2) {
      parts.push({ from, to: from + take, legend: false, height: partHeight(doc, picture, width, take, false), newPage });
      from += take;
    }
    if (space === pageRoom && take < 2) {
      // A whole page holds fewer than four tracks' worth only on a page far smaller than A4: draw what is left here.
      parts.push({ from, to: total, legend: true, height: partHeight(doc, picture, width, left, true), newPage });
      break;
    }
    space = pageRoom;
    newPage = true;
  }
  return parts;
}

function legendHeight(doc: PDFKit.PDFDocument, picture: DecisionPicture, width: number): number {
  return legendLines(doc, picture, width).length * 11 + measure(doc, picture.bandCaption, detail, width - 22) + 4;
}

/** The legend's keys flowed into lines that fit the width. */
function legendLines(doc: PDFKit.PDFDocument, picture: DecisionPicture, width: number): { kind: TrackMark | 'band' | 'ci' | 'floor'; label: string; x: number }[][] {
  const lines: { kind: TrackMark | 'band' | 'ci' | 'floor'; label: string; x: number }[][] = [[]];
  let x = 0;
  for (const item of legendItems(picture)) {
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

/** Draws the whole picture with its top-left corner at (x, y); returns the height used. */
export function drawDecisionTrack(doc: PDFKit.PDFDocument, picture: DecisionPicture, x: number, y: number, width: number): number {
  const total = picture.tracks.length;
  return drawDecisionTrackPart(doc, picture, { from: 0, to: total, legend: true, height: 0, newPage: false }, x, y, width);
}

/** Draws one part of the picture (its tracks, the axis, and the legend when it is the last) at (x, y); returns the height used. */
export function drawDecisionTrackPart(doc: PDFKit.PDFDocument, picture: DecisionPicture, part: TrackPart, x: number, y: number, width: number): number {
  const g = geometry(picture, x, width);
  const row = rowHeight(doc, picture);
  const tracks = picture.tracks.slice(part.from, part.to);
  const rowsHeight = tracks.length * row;
  // Light grid at the ticks, and zero (no bias) as a dotted line through every track.
  doc.save().lineWidth(0.4).strokeColor('#e2e7ea');
  for (const t of picture.axis.ticks) if (t !== 0) doc.moveTo(g.px(t), y).lineTo(g.px(t), y + rowsHeight);
  doc.stroke().restore();
  let top = y;
  for (const t of tracks) {
    drawRow(doc, t, g, x, top, width);
    top += row;
  }
  doc.save().lineWidth(0.7).strokeColor(COLOR.muted).dash(1, { space: 1.6 });
  doc.moveTo(g.px(0), y - 2).lineTo(g.px(0), y + rowsHeight).stroke();
  doc.restore();
  top += axis(doc, picture, g, top);
  if (part.legend) top += legend(doc, picture, x, top, width);
  return top - y + 4;
}

function drawRow(doc: PDFKit.PDFDocument, t: DecisionTrack, g: Geometry, x: number, y: number, width: number): void {
  const mid = y + 11.5;
  drawText(doc, t.at, x, y + 5.5, levelStyle, { width: LEFT, align: 'right' });
  // The track's own rule, from end to end.
  doc.save().lineWidth(0.5).strokeColor(COLOR.rule).moveTo(g.x0, mid).lineTo(g.x1, mid).stroke().restore();
  if (t.band) band(doc, g.px(-t.band.half), g.px(t.band.half), mid);
  if (t.floor) floor(doc, g.px(t.floor[0]), g.px(t.floor[1]), mid);
  if (t.ci) ci(doc, g.px(t.ci[0]), g.px(t.ci[1]), mid);
  if (t.estimate !== null) mark(doc, t.mark, g.px(t.estimate), mid);
  let ty = y + 5;
  const rx = x + width - RIGHT;
  ty += drawText(doc, t.word, rx, ty, word, { width: RIGHT });
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

/** The floor: a dashed bracket a little taller than the CI bar, open at neither end. */
function floor(doc: PDFKit.PDFDocument, from: number, to: number, mid: number): void {
  doc.save().lineWidth(0.8).strokeColor(COLOR.warm).dash(2, { space: 1.5 });
  doc.rect(from, mid - 5.5, Math.max(to - from, 0.5), 11).stroke();
  doc.restore();
}

function ci(doc: PDFKit.PDFDocument, from: number, to: number, mid: number): void {
  doc.save().lineWidth(2.6).strokeColor(INK).lineCap('butt');
  if (to - from > 0.5) doc.moveTo(from, mid).lineTo(to, mid).stroke();
  doc.lineWidth(1).moveTo(from, mid - 4).lineTo(from, mid + 4).moveTo(to, mid - 4).lineTo(to, mid + 4).stroke();
  doc.restore();
}

/** The estimate's diamond: filled, half-filled (left half) or open; a small ring when there is no verdict. */
function mark(doc: PDFKit.PDFDocument, kind: TrackMark, cx: number, cy: number, r = MARK): void {
  doc.save();
  const diamond = (): void => {
    doc.moveTo(cx, cy - r).lineTo(cx + r, cy).lineTo(cx, cy + r).lineTo(cx - r, cy).closePath();
  };
  if (kind === 'none') {
    doc.circle(cx, cy, r * 0.6).lineWidth(1).fillColor('#ffffff').strokeColor(INK).fillAndStroke();
  } else {
    diamond();
    doc.fillColor(kind === 'filled' ? INK : '#ffffff').fill();
    if (kind === 'half') {
      doc.moveTo(cx, cy - r).lineTo(cx, cy + r).lineTo(cx - r, cy).closePath().fillColor(INK).fill();
    }
    diamond();
    doc.lineWidth(1.1).strokeColor(INK).lineJoin('miter').stroke();
  }
  doc.restore();
}

function axis(doc: PDFKit.PDFDocument, picture: DecisionPicture, g: Geometry, y: number): number {
  const small = { size: SIZE.small, color: COLOR.muted };
  doc.save().lineWidth(0.6).strokeColor(COLOR.muted).moveTo(g.x0, y + 2).lineTo(g.x1, y + 2).stroke();
  picture.axis.ticks.forEach((t, k) => {
    const px = g.px(t);
    doc.moveTo(px, y + 2).lineTo(px, y + 5).stroke();
    drawText(doc, picture.axis.labels[k], px - 20, y + 6, small, { width: 40, align: 'center', oneLine: true });
  });
  doc.restore();
  drawText(doc, picture.axis.title, g.x0, y + 17, small, { width: g.x1 - g.x0, align: 'center', oneLine: true });
  return AXIS;
}

function legend(doc: PDFKit.PDFDocument, picture: DecisionPicture, x: number, y: number, width: number): number {
  let top = y;
  for (const line of legendLines(doc, picture, width)) {
    for (const item of line) {
      const sx = x + item.x;
      const cy = top + 4.6;
      if (item.kind === 'ci') ci(doc, sx + 2, sx + 14, cy);
      else if (item.kind === 'floor') floor(doc, sx + 1, sx + 15, cy);
      else mark(doc, item.kind as TrackMark, sx + 8, cy, 3.6);
      drawText(doc, item.label, sx + 18, top, detail, { width: textWidth(doc, item.label, detail) + 2, oneLine: true });
    }
    top += 11;
  }
  band(doc, x + 1, x + 15, top + 5, 9);
  top += drawText(doc, picture.bandCaption, x + 22, top, detail, { width: width - 22 }) + 4;
  return top - y;
}
