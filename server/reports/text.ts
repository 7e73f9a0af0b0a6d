import { REGULAR, SEMIBOLD } from './fonts';
import { breakLines, drawLines, hasSymbol } from './rich-text';
import { COLOR } from './theme';

export interface TextStyle {
  size: number;
  bold?: boolean;
  color?: string;
}

export interface TextBox {
  width: number;
  align?: 'left' | 'right' | 'center';
  /** One line only: no wrapping, cut with an ellipsis when too long. */
  oneLine?: boolean;
}

export const LINE_GAP = 1.5;
/** Open Sans's ascent (hhea 2189 of 2048 units, both weights): where pdfkit puts the baseline below the top. */
const ASCENT = 2189 / 2048;

function apply(doc: PDFKit.PDFDocument, style: TextStyle): void {
  doc.font(style.bold ? SEMIBOLD : REGULAR).fontSize(style.size).fillColor(style.color ?? COLOR.ink);
}

const advance = (doc: PDFKit.PDFDocument): number => doc.currentLineHeight(true) + LINE_GAP;

/** Height the text takes in a box of this width. */
export function measure(doc: PDFKit.PDFDocument, raw: string, style: TextStyle, width: number): number {
  const text = raw ?? ''; // results from an older engine may lack a field
  apply(doc, style);
  if (hasSymbol(text)) return breakLines(doc, text, style.size, width).length * advance(doc);
  return doc.heightOfString(text || ' ', { width, lineGap: LINE_GAP });
}

export function textWidth(doc: PDFKit.PDFDocument, text: string, style: TextStyle): number {
  apply(doc, style);
  return doc.widthOfString(text);
}

/** Draws text with its top-left corner at (x, y); returns the height used. */
export function drawText(doc: PDFKit.PDFDocument, raw: string, x: number, y: number, style: TextStyle, box: TextBox): number {
  const text = raw ?? '';
  apply(doc, style);
  if (hasSymbol(text)) {
    const lines = breakLines(doc, text, style.size, box.width);
    const shown = box.oneLine ? lines.slice(0, 1) : lines;
    drawLines(doc, shown, x, y, { ...box, size: style.size, ascent: ASCENT * style.size, lineHeight: advance(doc) });
    return shown.length * advance(doc);
  }
  const options: PDFKit.Mixins.TextOptions = { width: box.width, align: box.align ?? 'left', lineGap: LINE_GAP };
  if (box.oneLine) Object.assign(options, { ellipsis: true, height: doc.currentLineHeight(true) });
  const height = box.oneLine ? doc.currentLineHeight(true) : doc.heightOfString(text || ' ', options);
  doc.text(text, x, y, options);
  return height;
}

/**
 * Text broken into lines at spaces only, each narrower than `width` at this size (regular face): pdfkit
 * would also break after a slash and print "mmol/" at the end of one line and "L" on the next.
 */
export function wrapAtSpaces(doc: PDFKit.PDFDocument, text: string, size: number, width: number): string {
  const fits = (line: string): boolean => textWidth(doc, line, { size }) <= width - 2;
  return text.split('\n').map((paragraph) => {
    const lines: string[] = [];
    let line = '';
    for (const word of paragraph.split(' ')) {
      if (line && !fits(`${line} ${word}`)) {
        lines.push(line);
        line = word;
      } else line = line ? `${line} ${word}` : word;
    }
    return [...lines, line].join('\n');
  }).join('\n');
}
