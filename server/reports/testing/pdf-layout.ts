import { execFileSync } from 'node:child_process';
import { join } from 'node:path';
import { PAGE, SIZE } from '../theme';

/** A line of text: its top in points from the top of the page, its largest type size, and its left and right ends. */
export interface PdfLine { text: string; top: number; size: number; left: number; right: number }
export interface PdfPage { height: number; width: number; lines: PdfLine[] }

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
  const footer = page.lines.findIndex((l) => / · (study|release) \d+: /.test(l.text) && /Page \d+ of \d+/.test(l.text));
  return footer < 0 ? page.lines : page.lines.slice(0, footer);
}

/** Headings are 12.5 pt and subheadings 10 pt; no other text is set in those sizes. */
const HEADING_SIZES: number[] = [SIZE.heading, SIZE.subheading];

/**
 * What is wrong with the way the body text sits on the pages (page-marks.ts and theme.ts set the zones): a line
 * below the footer zone, above the top margin, or past the left or right margin; a page that ends with a heading
 * (12.5 pt) or subheading (10 pt), the only text set in those sizes; a page but the last that is not half full.
 * Empty when the layout is sound.
 */
export function layoutFaults(pages: PdfPage[]): string[] {
  const faults: string[] = [];
  pages.forEach((page, k) => {
    const at = `page ${k + 1}`;
    const body = bodyLines(page);
    for (const l of body) {
      if (l.top + l.size > page.height - PAGE.bottom + 1) faults.push(`${at}: below the footer zone: ${l.text}`);
      if (l.top < PAGE.top - 1) faults.push(`${at}: above the top margin: ${l.text}`);
      if (l.left < PAGE.left - 1 || l.right > page.width - PAGE.right + 1) faults.push(`${at}: past the margins (${l.left} to ${l.right}): ${l.text}`);
    }
    const last = body[body.length - 1];
    if (!last) faults.push(`${at}: no body text`);
    else {
      if (HEADING_SIZES.includes(last.size)) faults.push(`${at}: ends with a heading: ${last.text}`);
      if (k < pages.length - 1 && (last.top + last.size) / page.height <= 0.5) faults.push(`${at}: less than half full`);
    }
  });
  return faults;
}
