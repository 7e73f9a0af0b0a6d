import { execFileSync } from 'node:child_process';
import { join } from 'node:path';

export interface PdfLine { text: string; top: number; size: number }
export interface PdfPage { height: number; lines: PdfLine[] }

/**
 * Where each line of text stands on each page of a PDF (points from the top of the page, type size),
 * extracted by pdfjs-dist in a child Node process (pdf-layout.mjs), as pdf-text.ts does for the text alone.
 */
export function pdfLayout(pdf: Buffer): PdfPage[] {
  const out = execFileSync(process.execPath, [join(__dirname, 'pdf-layout.mjs')], {
    input: pdf, maxBuffer: 64 * 1024 * 1024, cwd: join(__dirname, '..', '..', '..'),
  });
  return JSON.parse(out.toString('utf8')) as PdfPage[];
}

/** The footer's two lines (status and page, hash and code) are the last on every page; the body is what stands above them. */
export function bodyLines(page: PdfPage): PdfLine[] {
  const footer = page.lines.findIndex((l) => / · study \d+: /.test(l.text) && /Page \d+ of \d+/.test(l.text));
  return footer < 0 ? page.lines : page.lines.slice(0, footer);
}
