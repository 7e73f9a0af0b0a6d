import { drawText, measure, wrapAtSpaces, type TextStyle } from './text';
import { COLOR, PAGE, SIZE } from './theme';

/** The type size of the conclusion that leads page 1. */
const LEAD = 10.5;
/** Room given to pdfkit beyond the width lines were broken to (wrapAtSpaces), so it never breaks them again. */
const SLACK = 6;

/**
 * The flow of the report down the page: a cursor y between the top margin and the footer zone, and a
 * new page whenever the next block would not fit. Blocks measure themselves before they draw, so
 * pdfkit's own page breaking is never triggered.
 */
export class Layout {
  y: number;

  constructor(readonly doc: PDFKit.PDFDocument) {
    this.y = PAGE.top;
  }

  get left(): number { return PAGE.left; }
  get width(): number { return this.doc.page.width - PAGE.left - PAGE.right; }
  get right(): number { return this.left + this.width; }
  get bottom(): number { return this.doc.page.height - PAGE.bottom; }
  get room(): number { return this.bottom - this.y; }
  /** The room of a whole page, from the top margin to the footer zone. */
  get pageRoom(): number { return this.bottom - PAGE.top; }

  newPage(): void {
    this.doc.addPage();
    this.y = PAGE.top;
  }

  /** Starts a new page unless `height` points still fit; true when it did. */
  ensure(height: number): boolean {
    if (this.y + height <= this.bottom || this.y === PAGE.top) return false;
    this.newPage();
    return true;
  }

  gap(points: number): void {
    this.y = Math.min(this.y + points, this.bottom);
  }

  /** The height a heading takes with its space above and its rule. */
  headingHeight(text: string): number {
    return 10 + measure(this.doc, text, { size: SIZE.heading, bold: true }, this.width) + 6;
  }

  /**
   * A section title, kept with at least `keep` points of what follows (a measured first block where the
   * caller knows it), so a heading never ends a page without its content.
   */
  heading(text: string, keep = 90): void {
    this.ensure(Math.min(keep, this.bottom - PAGE.top - 40) + this.headingHeight(text));
    if (this.y > PAGE.top) this.gap(10);
    this.y += drawText(this.doc, text, this.left, this.y, { size: SIZE.heading, bold: true, color: COLOR.accent }, { width: this.width });
    this.doc.moveTo(this.left, this.y + 1).lineTo(this.right, this.y + 1).lineWidth(0.6).strokeColor(COLOR.rule).stroke();
    this.gap(6);
  }

  /** The height keyValues takes for these pairs (or its first `count` pairs), to keep a heading with them. */
  keyValuesHeight(pairs: [string, string][], labelWidth = 150, count = pairs.length): number {
    const style: TextStyle = { size: SIZE.body };
    return pairs.slice(0, count).reduce((h, [label, value]) =>
      h + Math.max(measure(this.doc, label, style, labelWidth - 8), measure(this.doc, value, style, this.width - labelWidth)) + 2, 0);
  }

  /** A block of measured height drawn by `draw` at the cursor, on a new page when it does not fit; the cursor moves past it. */
  block(height: number, draw: (y: number) => void): void {
    this.ensure(height);
    draw(this.y);
    this.y += height;
  }

  /**
   * The conclusion that leads page 1: a label and one or two sentences in a larger face beside a teal rule.
   * Returns nothing; the cursor moves below it.
   */
  conclusion(label: string, text: string): void {
    const width = this.width - 14;
    const labelStyle: TextStyle = { size: SIZE.small, bold: true, color: COLOR.accent };
    const textStyle: TextStyle = { size: LEAD };
    // Broken at spaces only, so "mmol/L" never splits at its slash.
    const wrapped = wrapAtSpaces(this.doc, text, LEAD, width);
    const height = measure(this.doc, label, labelStyle, width) + 2 + measure(this.doc, wrapped, textStyle, width + SLACK) + 8;
    this.ensure(height + 6);
    this.doc.rect(this.left, this.y, 3, height).fill(COLOR.accent);
    let y = this.y + 3;
    y += drawText(this.doc, label.toUpperCase(), this.left + 14, y, labelStyle, { width }) + 2;
    drawText(this.doc, wrapped, this.left + 14, y, textStyle, { width: width + SLACK });
    this.y += height + 8;
  }

  subheading(text: string, keep = 60): void {
    this.ensure(keep + 18);
    this.gap(4);
    this.y += drawText(this.doc, text, this.left, this.y, { size: SIZE.subheading, bold: true }, { width: this.width });
    this.gap(2);
  }

  /** A paragraph broken at spaces only (never inside "mmol/L"), on a new page when it does not fit. */
  paragraph(raw: string, style: Partial<TextStyle> = {}, indent = 0): void {
    const full: TextStyle = { size: SIZE.body, ...style };
    const width = this.width - indent;
    const text = full.bold ? raw : wrapAtSpaces(this.doc, raw, full.size, width);
    // The lines already fit `width`; pdfkit's own wrapper counts a trailing space too, so it gets a little more
    // room and never breaks a line again ("judged" / "from").
    const box = full.bold ? width : width + SLACK;
    this.ensure(measure(this.doc, text, full, box));
    this.y += drawText(this.doc, text, this.left + indent, this.y, full, { width: box });
    this.gap(3);
  }

  /** Label and value pairs in two columns of text, the label muted. */
  keyValues(pairs: [string, string][], labelWidth = 150): void {
    const valueWidth = this.width - labelWidth;
    for (const [label, value] of pairs) {
      const style: TextStyle = { size: SIZE.body };
      const height = Math.max(measure(this.doc, label, style, labelWidth - 8), measure(this.doc, value, style, valueWidth));
      this.ensure(height);
      drawText(this.doc, label, this.left, this.y, { ...style, color: COLOR.muted }, { width: labelWidth - 8 });
      drawText(this.doc, value, this.left + labelWidth, this.y, style, { width: valueWidth });
      this.y += height + 2;
    }
    this.gap(2);
  }

  /** A tinted box with a coloured left edge holding one paragraph (the caution, a verdict). */
  callout(text: string, options: { fill: string; edge: string; bold?: boolean; title?: string }): void {
    const pad = 7;
    const width = this.width - 2 * pad - 3;
    const title = options.title ? { size: SIZE.body, bold: true, color: options.edge } : null;
    const titleHeight = title ? measure(this.doc, options.title!, title, width) + 2 : 0;
    const style: TextStyle = { size: SIZE.body, bold: options.bold };
    const height = titleHeight + measure(this.doc, text, style, width) + 2 * pad;
    this.ensure(height + 4);
    this.doc.rect(this.left, this.y, this.width, height).fill(options.fill);
    this.doc.rect(this.left, this.y, 3, height).fill(options.edge);
    if (title) drawText(this.doc, options.title!, this.left + pad + 3, this.y + pad, title, { width });
    drawText(this.doc, text, this.left + pad + 3, this.y + pad + titleHeight, style, { width });
    this.y += height + 6;
  }
}
