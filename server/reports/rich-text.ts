import { drawSymbol, isSymbol, symbolWidth } from './symbol-font';

/**
 * Text that holds a character Open Sans lacks (symbol-font.ts) is broken into lines here, since
 * pdfkit's line wrapper knows one font at a time: words are filled greedily into the width (a word too
 * long for a line is cut by characters), and each line is drawn run by run, Open Sans for the text and
 * the symbol font for the symbols, on one baseline.
 */
export const hasSymbol = (text: string): boolean => [...text].some(isSymbol);

type Run = { symbol: boolean; text: string };

function runs(text: string): Run[] {
  const out: Run[] = [];
  for (const char of text) {
    const symbol = isSymbol(char);
    const last = out[out.length - 1];
    if (last && last.symbol === symbol && !symbol) last.text += char;
    else out.push({ symbol, text: char });
  }
  return out;
}

/** Width in points of a line at the document's current font and size. */
function lineWidth(doc: PDFKit.PDFDocument, text: string, size: number): number {
  return runs(text).reduce((w, r) => w + (r.symbol ? symbolWidth(r.text, size) : doc.widthOfString(r.text)), 0);
}

/** The lines the text fills at this width (current font and size). */
export function breakLines(doc: PDFKit.PDFDocument, text: string, size: number, width: number): string[] {
  const lines: string[] = [];
  for (const paragraph of text.split('\n')) {
    let line = '';
    for (const word of paragraph.split(/\s+/).filter(Boolean)) {
      const candidate = line ? `${line} ${word}` : word;
      if (lineWidth(doc, candidate, size) <= width) {
        line = candidate;
        continue;
      }
      if (line) lines.push(line);
      line = '';
      for (const char of word) {
        if (line && lineWidth(doc, line + char, size) > width) {
          lines.push(line);
          line = '';
        }
        line += char;
      }
    }
    lines.push(line);
  }
  return lines;
}

/** Draws prepared lines from the top-left (x, y); `lineHeight` is the advance from one line to the next. */
export function drawLines(
  doc: PDFKit.PDFDocument, lines: string[], x: number, y: number,
  box: { width: number; align?: 'left' | 'right' | 'center'; size: number; ascent: number; lineHeight: number },
): void {
  lines.forEach((line, k) => {
    const free = box.width - lineWidth(doc, line, box.size);
    let cursor = x + (box.align === 'right' ? free : box.align === 'center' ? free / 2 : 0);
    const top = y + k * box.lineHeight;
    for (const run of runs(line)) {
      if (run.symbol) {
        drawSymbol(doc, run.text, cursor, top + box.ascent, box.size);
        cursor += symbolWidth(run.text, box.size);
      } else {
        doc.text(run.text, cursor, top, { lineBreak: false });
        cursor += doc.widthOfString(run.text);
      }
    }
  });
}
