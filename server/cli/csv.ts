import { readResult } from '@shared/schemas/result-text';

/**
 * A small strict CSV reader for the analyze command (RFC 4180: comma-separated, fields may be quoted with
 * "..." and "" for a quote inside, CRLF or LF line ends, an optional UTF-8 byte-order mark).
 * The first line is the header. Blank lines are skipped; data rows are numbered from 1 (the first data
 * line after the header), and every error names the row and its line in the file.
 */
export interface CsvTable {
  header: string[];
  rows: { row: number; line: number; cells: string[] }[];
}

export class CsvError extends Error {}

export function parseCsv(text: string): CsvTable {
  const records = splitRecords(text.replace(/^\uFEFF/, ''));
  const nonBlank = records.filter((r) => !(r.cells.length === 1 && r.cells[0].trim() === ''));
  if (nonBlank.length === 0) throw new CsvError('the file is empty: a header row is required');
  const header = nonBlank[0].cells.map((c) => c.trim());
  const rows = nonBlank.slice(1).map((r, k) => {
    if (r.cells.length !== header.length) {
      throw new CsvError(`row ${k + 1} (line ${r.line}): ${r.cells.length} fields, the header has ${header.length}`);
    }
    return { row: k + 1, line: r.line, cells: r.cells };
  });
  return { header, rows };
}

function splitRecords(text: string): { line: number; cells: string[] }[] {
  const records: { line: number; cells: string[] }[] = [];
  let cells: string[] = [];
  let field = '';
  let quoted = false;
  let line = 1;
  let startLine = 1;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i];
    if (quoted) {
      if (ch === '"' && text[i + 1] === '"') { field += '"'; i++; }
      else if (ch === '"') quoted = false;
      else { if (ch === '\n') line++; field += ch; }
      continue;
    }
    if (ch === '"' && field.trim() === '') { quoted = true; field = ''; }
    else if (ch === ',') { cells.push(field); field = ''; }
    else if (ch === '\n' || ch === '\r') {
      if (ch === '\r' && text[i + 1] === '\n') i++;
      cells.push(field);
      records.push({ line: startLine, cells });
      cells = [];
      field = '';
      startLine = ++line;
    } else field += ch;
  }
  if (quoted) throw new CsvError(`line ${startLine}: a quoted field is not closed`);
  if (field !== '' || cells.length > 0) { cells.push(field); records.push({ line: startLine, cells }); }
  return records;
}

/** The cell of a column, by header name (case-insensitive); undefined when the column is absent. */
export function columnIndex(table: CsvTable, name: string): number | undefined {
  const k = table.header.findIndex((h) => h.toLowerCase() === name.toLowerCase());
  return k >= 0 ? k : undefined;
}

/** A required numeric column's values; the error names the row, line and column of a bad value. */
export function numberColumn(table: CsvTable, name: string): number[] {
  const k = columnIndex(table, name);
  if (k === undefined) throw new CsvError(`the header has no column "${name}" (found: ${table.header.join(', ')})`);
  return table.rows.map((r) => parseNumber(r.cells[k], `row ${r.row} (line ${r.line}), column ${name}`));
}

/**
 * A value read as the server reads a result in a study that detects the decimal mark, its default
 * (shared/schemas/result-text.ts): "<0.5" (censored), "1e309" (too large), "1.2.3" and a quoted "1,234" (unclear)
 * are refused with the server's words.
 */
export function parseNumber(text: string, where: string): number {
  const read = readResult(text, 'auto');
  if ('error' in read) throw new CsvError(`${where}: ${read.error}`);
  if (read.value === null) throw new CsvError(`${where}: the value is empty`);
  return read.value;
}

/** An optional text column's values ('' where absent). */
export function textColumn(table: CsvTable, name: string): string[] | undefined {
  const k = columnIndex(table, name);
  return k === undefined ? undefined : table.rows.map((r) => r.cells[k].trim());
}
