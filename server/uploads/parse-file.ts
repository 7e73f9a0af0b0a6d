import { Readable } from 'node:stream';
import ExcelJS from 'exceljs';
import { MAX_ROWS } from '../../shared/schemas';
import { AppError } from '../http/app-error';

export interface ParsedTable { columns: string[]; rows: string[][]; hasHeader: boolean }

const bad = (message: string, path = 'file') => new AppError('invalid_request', message, [{ path, message }]);
const isXlsx = (b: Buffer) => b.length > 4 && b[0] === 0x50 && b[1] === 0x4b && b[2] === 0x03 && b[3] === 0x04;
const columnLetter = (i: number): string => (i >= 26 ? columnLetter(Math.floor(i / 26) - 1) : '') + String.fromCharCode(65 + (i % 26));

/** Reads an uploaded .xlsx, .csv or tab-separated text into strings; never trusts the browser's parse. */
export async function parseUpload(fileName: string, bytes: Buffer): Promise<ParsedTable> {
  if (!bytes.length) throw bad('The file is empty');
  const ext = (fileName.split('.').pop() ?? '').toLowerCase();
  let grid: string[][];
  if (ext === 'xlsx') {
    if (!isXlsx(bytes)) throw bad('The file is named .xlsx but is not an Excel workbook');
    grid = await readXlsx(bytes);
  } else if (['csv', 'txt', 'tsv', 'tab'].includes(ext)) {
    if (isXlsx(bytes) || bytes.includes(0)) throw bad('The file is not plain text; upload .xlsx, .csv or tab-separated text');
    grid = await readDelimited(bytes.toString('utf8').replace(/^\uFEFF/, ''), ext);
  } else {
    throw bad(`Files of type .${ext || '(none)'} cannot be read; upload .xlsx, .csv or tab-separated .txt`);
  }
  grid = grid.filter((r) => r.some((c) => c.trim() !== ''));
  if (!grid.length) throw bad('The file has no rows');
  const width = Math.max(...grid.map((r) => r.length));
  const hasHeader = grid[0].some((c) => c.trim() !== '' && !/^[+-]?\d+([.,]\d+)?$/.test(c.trim()));
  const columns = hasHeader ? grid[0].map((c, i) => c.trim() || `Column ${columnLetter(i)}`) : Array.from({ length: width }, (_, i) => `Column ${columnLetter(i)}`);
  while (columns.length < width) columns.push(`Column ${columnLetter(columns.length)}`);
  const rows = (hasHeader ? grid.slice(1) : grid).map((r) => columns.map((_, i) => (r[i] ?? '').trim()));
  if (!rows.length) throw bad('The file has a header row but no data rows');
  if (rows.length > MAX_ROWS) throw bad(`The file has ${rows.length} data rows; at most ${MAX_ROWS} can be imported`);
  const numeric = columns.some((_, i) => rows.some((r) => /^[+-]?(\d+([.,]\d*)?|[.,]\d+)$/.test(r[i])));
  if (!numeric) throw bad('No column of the file holds numbers; check that it is the right file');
  return { columns, rows, hasHeader };
}

async function readXlsx(bytes: Buffer): Promise<string[][]> {
  const wb = new ExcelJS.Workbook();
  try {
    await wb.xlsx.load(bytes as unknown as ArrayBuffer);
  } catch {
    throw bad('The workbook could not be read; save it again as .xlsx and retry');
  }
  const sheet = wb.worksheets[0];
  if (!sheet) throw bad('The workbook has no sheet');
  const grid: string[][] = [];
  sheet.eachRow({ includeEmpty: true }, (row, rowNumber) => {
    const cells: string[] = [];
    row.eachCell({ includeEmpty: true }, (cell, col) => {
      cells[col - 1] = cellText(cell.value, rowNumber, col);
    });
    grid[rowNumber - 1] = Array.from(cells, (c) => c ?? '');
  });
  return Array.from(grid, (r) => r ?? []);
}

function cellText(v: ExcelJS.CellValue, row: number, col: number): string {
  if (v === null || v === undefined) return '';
  if (typeof v === 'number') return String(v);
  if (typeof v === 'string') return v;
  if (typeof v === 'boolean') return v ? 'TRUE' : 'FALSE';
  if (v instanceof Date) return v.toISOString().slice(0, 10);
  const where = `sheet row ${row}, column ${columnLetter(col - 1)}`;
  if ('error' in v) throw bad(`${where}: the cell holds the error ${v.error}; fix it in the workbook and upload again`);
  if ('formula' in v || 'sharedFormula' in v) {
    const result = (v as { result?: unknown }).result;
    if (result && typeof result === 'object' && 'error' in result) throw bad(`${where}: the formula gives the error ${(result as { error: string }).error}`);
    return result === undefined || result === null ? '' : String(result);
  }
  if ('richText' in v) return v.richText.map((t) => t.text).join('');
  if ('text' in v) return String(v.text);
  return String(v);
}

async function readDelimited(text: string, ext: string): Promise<string[][]> {
  const firstLine = text.split(/\r?\n/, 1)[0] ?? '';
  const delimiter = ext !== 'csv' || firstLine.includes('\t') ? '\t' : firstLine.split(';').length > firstLine.split(',').length ? ';' : ',';
  const wb = new ExcelJS.Workbook();
  const sheet = await wb.csv.read(Readable.from([text]), { parserOptions: { delimiter, quote: '"' }, map: (v: unknown) => v } as never);
  const grid: string[][] = [];
  sheet.eachRow({ includeEmpty: true }, (row, n) => {
    grid[n - 1] = (row.values as unknown[]).slice(1).map((c) => (c === null || c === undefined ? '' : String(c)));
  });
  return Array.from(grid, (r) => r ?? []);
}
