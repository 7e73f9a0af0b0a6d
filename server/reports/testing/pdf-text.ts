import { execFileSync } from 'node:child_process';
import { join } from 'node:path';

/**
 * The text lines of each page of a PDF, extracted by pdfjs-dist. pdfjs-dist ships only ES modules and
 * jest here runs CommonJS (swc turns import() into require()), so the extraction runs in a child Node
 * process (pdf-text.mjs) that imports it natively.
 */
export function pdfPages(pdf: Buffer): string[][] {
  const out = execFileSync(process.execPath, [join(__dirname, 'pdf-text.mjs')], {
    input: pdf, maxBuffer: 64 * 1024 * 1024, cwd: join(__dirname, '..', '..', '..'),
  });
  return JSON.parse(out.toString('utf8')) as string[][];
}

/** All the text of a page (or pages) as one string with single spaces, for phrases that wrap. */
export const flat = (lines: string[] | string[][]): string => lines.flat().join(' ').replace(/\s+/g, ' ');
