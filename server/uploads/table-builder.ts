import { MESSAGES, UPLOAD_LIMITS, columnLetter, refuse } from './upload-limits';

export interface ParsedTable { columns: string[]; rows: string[][]; hasHeader: boolean }

const HEADER_NUMBER = /^[+-]?\d+([.,]\d+)?$/;
const NUMBER = /^[+-]?(\d+([.,]\d*)?|[.,]\d+)$/;

/**
 * Collects the rows a reader hands over, one at a time, and refuses the file the moment a limit
 * is passed: data rows, columns holding a value, characters in a cell and in all cells. Blank rows
 * are skipped; the first row that is not blank is the header when it holds a word.
 */
export class TableBuilder {
  private readonly grid: string[][] = [];
  private hasHeader = false;
  private width = 0;
  private chars = 0;

  /** Refuses a cell longer than the limit; `where` names it, e.g. "sheet row 12, column AB". */
  static checkCell(text: string, where: () => string): void {
    if (text.length > UPLOAD_LIMITS.cellChars) refuse(MESSAGES.cell(where()));
  }

  /** Refuses a value in a column past the limit (`col` is zero-based). */
  static checkColumn(col: number, where: () => string): void {
    if (col >= UPLOAD_LIMITS.columns) refuse(MESSAGES.columns(where()));
  }

  /** Adds one row of the file (cells by zero-based column; holes are empty cells). */
  addRow(cells: readonly (string | undefined)[]): void {
    const row: string[] = [];
    let last = -1;
    let chars = 0;
    for (let i = 0; i < cells.length; i++) {
      const text = (cells[i] ?? '').trim();
      row.push(text);
      chars += text.length;
      if (text !== '') last = i;
    }
    if (last < 0) return;
    row.length = last + 1;
    if (!this.grid.length) this.hasHeader = row.some((c) => c !== '' && !HEADER_NUMBER.test(c));
    else if (this.grid.length - (this.hasHeader ? 1 : 0) >= UPLOAD_LIMITS.rows) refuse(MESSAGES.rows());
    this.chars += chars;
    if (this.chars > UPLOAD_LIMITS.textChars) refuse(MESSAGES.text());
    this.width = Math.max(this.width, row.length);
    this.grid.push(row);
  }

  /** The table with named columns, every row as wide as the widest; refuses a file with nothing to import. */
  finish(): ParsedTable {
    if (!this.grid.length) refuse('The file has no rows');
    const { width, hasHeader } = this;
    const columns = Array.from({ length: width }, (_, i) => (hasHeader ? this.grid[0][i] : '') || `Column ${columnLetter(i)}`);
    const rows = (hasHeader ? this.grid.slice(1) : this.grid).map((r) => columns.map((_, i) => r[i] ?? ''));
    if (!rows.length) refuse('The file has a header row but no data rows');
    const numeric = columns.some((_, i) => rows.some((r) => NUMBER.test(r[i])));
    if (!numeric) refuse('No column of the file holds numbers; check that it is the right file');
    return { columns, rows, hasHeader };
  }
}
