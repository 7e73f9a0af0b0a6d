import type { ParsedTable } from './table-builder';
import { readDelimited, guessDelimiter } from './read-text';
import { readXlsx } from './read-xlsx';
import { refuse } from './upload-limits';

export type { ParsedTable } from './table-builder';

const isZip = (b: Uint8Array) => b.length > 4 && b[0] === 0x50 && b[1] === 0x4b && b[2] === 0x03 && b[3] === 0x04;

/**
 * Reads an uploaded .xlsx, .csv or tab-separated text into strings; never trusts the browser's
 * parse. Runs in a worker thread (see parse-pool.ts); refuses a bad file by throwing a Refusal.
 */
export async function parseUpload(fileName: string, bytes: Buffer): Promise<ParsedTable> {
  if (!bytes.length) refuse('The file is empty');
  const ext = (fileName.split('.').pop() ?? '').toLowerCase();
  if (ext === 'xlsx') {
    if (!isZip(bytes)) refuse('The file is named .xlsx but is not an Excel workbook');
    return readXlsx(bytes);
  }
  if (['csv', 'txt', 'tsv', 'tab'].includes(ext)) {
    if (isZip(bytes) || bytes.includes(0)) refuse('The file is not plain text; upload .xlsx, .csv or tab-separated text');
    const text = bytes.toString('utf8').replace(/^\uFEFF/, '');
    return readDelimited(text, guessDelimiter(text, ext));
  }
  return refuse(`Files of type .${ext || '(none)'} cannot be read; upload .xlsx, .csv or tab-separated .txt`);
}
