import { drawText } from './text';
import { COLOR, PAGE, SIZE } from './theme';

export interface PageMarks {
  contentHash: string;
  verificationCode: string;
  draft: boolean;
  study: string;
}

/**
 * Written after layout (the document has no bottom margin, so pdfkit adds no page here), on every buffered page: the footer (content hash, verification code, page x of
 * y, DRAFT when not signed) and, on drafts, a large diagonal watermark.
 */
export function markPages(doc: PDFKit.PDFDocument, marks: PageMarks): void {
  const { start, count } = doc.bufferedPageRange();
  for (let i = start; i < start + count; i++) {
    doc.switchToPage(i);
    if (marks.draft) watermark(doc);
    footer(doc, marks, i - start + 1, count);
  }
}

function footer(doc: PDFKit.PDFDocument, marks: PageMarks, page: number, pages: number): void {
  const left = PAGE.left;
  const width = doc.page.width - PAGE.left - PAGE.right;
  const top = doc.page.height - PAGE.bottom + 22;
  const small = { size: SIZE.footer, color: COLOR.muted };
  doc.moveTo(left, top - 5).lineTo(left + width, top - 5).lineWidth(0.5).strokeColor(COLOR.rule).stroke();
  const status = marks.draft ? 'DRAFT — not signed' : 'Signed record';
  drawText(doc, `${status} · ${marks.study}`, left, top, { ...small, bold: marks.draft, color: marks.draft ? COLOR.draft : COLOR.muted }, { width: width - 80, oneLine: true });
  drawText(doc, `Page ${page} of ${pages}`, left + width - 80, top, { ...small, bold: true, color: COLOR.ink }, { width: 80, align: 'right', oneLine: true });
  drawText(doc, `Content hash SHA-256 ${marks.contentHash}`, left, top + 10, small, { width: width - 150, oneLine: true });
  drawText(doc, `Verification code ${marks.verificationCode}`, left + width - 150, top + 10, small, { width: 150, align: 'right', oneLine: true });
}

function watermark(doc: PDFKit.PDFDocument): void {
  const cx = doc.page.width / 2;
  const cy = doc.page.height / 2;
  doc.save();
  const size = 62;
  doc.rotate((-Math.atan2(doc.page.height, doc.page.width) * 180) / Math.PI, { origin: [cx, cy] });
  doc.fillOpacity(0.1);
  const style = { size, bold: true, color: COLOR.draft };
  drawText(doc, 'DRAFT — not signed', cx - 400, cy - (size * 2789) / 2048 / 2, style, { width: 800, align: 'center', oneLine: true });
  doc.restore();
}
