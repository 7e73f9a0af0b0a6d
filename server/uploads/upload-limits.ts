import { MAX_ROWS } from '@shared/schemas';

/** What one upload may hold; each is checked while the file is read, and each refusal names its limit. */
export const UPLOAD_LIMITS = {
  /** Bytes all parts of a workbook that are read may inflate to, together. */
  inflatedBytes: 50 * 1024 * 1024,
  /** Entries in the workbook's zip directory. A workbook has a few dozen. */
  zipEntries: 2_000,
  /** Data rows (not counting a header row or blank rows). */
  rows: MAX_ROWS,
  /** Columns that hold a value. */
  columns: 200,
  /** Characters in one cell. */
  cellChars: 1_000,
  /** Characters in all cells together: bounds the table sent back and stored. */
  textChars: 10_000_000,
  /** Wall time one file may take to read, once its worker has started on it. */
  timeMs: 15_000,
  /** Heap of the worker thread that reads a file. */
  memoryMb: 256,
} as const;

export type UploadLimits = typeof UPLOAD_LIMITS;

/** A file the reader refuses; its message is shown to the user as it is. Crosses the worker boundary as a plain message. */
export class Refusal extends Error {}

export const refuse = (message: string): never => { throw new Refusal(message); };

/** 12345 → "12,345", so limits read as people write them. */
export const count = (n: number): string => n.toLocaleString('en-US');

/** 0 → "A", 27 → "AB": the column letter a spreadsheet shows for a zero-based index. */
export const columnLetter = (i: number): string => (i >= 26 ? columnLetter(Math.floor(i / 26) - 1) : '') + String.fromCharCode(65 + (i % 26));

/** "AB" → 27; the zero-based index of a spreadsheet column letter, or -1 if it is not one. */
export function columnIndex(letters: string): number {
  let n = 0;
  for (const ch of letters) {
    const c = ch.charCodeAt(0) - 64;
    if (c < 1 || c > 26) return -1;
    n = n * 26 + c;
  }
  return letters ? n - 1 : -1;
}

export const MESSAGES = {
  inflated: () => `The workbook inflates to more than ${UPLOAD_LIMITS.inflatedBytes / 1024 / 1024} MB when unpacked; at most ${UPLOAD_LIMITS.inflatedBytes / 1024 / 1024} MB can be read. Save only the sheet with the results in a new workbook`,
  zipEntries: () => `The workbook holds more than ${count(UPLOAD_LIMITS.zipEntries)} parts; at most ${count(UPLOAD_LIMITS.zipEntries)} can be read. Save only the sheet with the results in a new workbook`,
  rows: () => `The file has more than ${count(UPLOAD_LIMITS.rows)} data rows; at most ${count(UPLOAD_LIMITS.rows)} can be imported at once`,
  columns: (where: string) => `${where}: the row has values in more than ${count(UPLOAD_LIMITS.columns)} columns; at most ${count(UPLOAD_LIMITS.columns)} columns can be read`,
  cell: (where: string) => `${where}: a cell holds more than ${count(UPLOAD_LIMITS.cellChars)} characters; at most ${count(UPLOAD_LIMITS.cellChars)} can be read`,
  text: () => `The cells of the file hold more than ${count(UPLOAD_LIMITS.textChars)} characters in all; at most ${count(UPLOAD_LIMITS.textChars)} can be read`,
  time: (ms: number) => `Reading the file took longer than ${ms / 1000} s, the most one file may take; save only the sheet with the results and upload again`,
  memory: (mb: number) => `Reading the file needed more than ${mb} MB of memory, the most one file may use; save only the sheet with the results and upload again`,
  busy: () => 'The server is reading too many files at once; upload again in a minute',
};
