import { isNumberText } from './result-number';

/**
 * Splits text copied from a spreadsheet into lines of cells: tabs between cells, any line break
 * (\r\n, \n or \r) between lines. A cell in double quotes may hold tabs, line breaks and doubled
 * quotes ("" for "), as spreadsheets write them. A final line break adds no empty line; lines of
 * different lengths stay as they are (ragged).
 */
export function splitClipboard(text: string): string[][] {
  const lines: string[][] = [];
  let line: string[] = [];
  let cell = '';
  let i = 0;
  const endCell = (): void => {
    line.push(cell);
    cell = '';
  };
  const endLine = (): void => {
    endCell();
    lines.push(line);
    line = [];
  };
  while (i < text.length) {
    const ch = text[i];
    if (ch === '"' && cell === '') {
      const close = quotedEnd(text, i + 1);
      if (close !== -1) {
        cell = text.slice(i + 1, close).replace(/""/g, '"');
        i = close + 1;
        continue;
      }
    }
    if (ch === '\t') endCell();
    else if (ch === '\r' || ch === '\n') {
      endLine();
      if (ch === '\r' && text[i + 1] === '\n') i++;
    } else cell += ch;
    i++;
  }
  if (cell !== '' || line.length > 0) endLine();
  return lines;
}

/** Index of the quote closing a quoted cell opened before `from`, if the cell ends right after it. */
function quotedEnd(text: string, from: number): number {
  for (let i = from; i < text.length; i++) {
    if (text[i] !== '"') continue;
    if (text[i + 1] === '"') {
      i++;
      continue;
    }
    const next = text[i + 1];
    return next === undefined || next === '\t' || next === '\n' || next === '\r' ? i : -1;
  }
  return -1;
}

/**
 * A header is a first line whose cells that land on result columns are all filled and none is a
 * number ("Current", "New method"), while the block has more lines. A single line, or a first line
 * with any numeric result, is data (so a typing error like "5,x" in row 1 is not taken for a header).
 * @param resultColumns positions within the pasted line that land on result columns
 */
export function hasHeader(lines: readonly string[][], resultColumns: readonly number[]): boolean {
  if (lines.length < 2) return false;
  const cells = resultColumns.map((k) => lines[0][k]).filter((c): c is string => c !== undefined);
  return cells.length > 0 && cells.every((c) => c.trim() !== '' && !isNumberText(c));
}

const YES = new Set(['yes', 'y', 'true', '1', 'x', '✓', 'excluded']);

/** A pasted yes/no cell: yes, y, true, 1, x, ✓ or "excluded" (any case) mean yes; anything else no. */
export function parseFlag(text: string): boolean {
  return YES.has(text.trim().toLowerCase());
}
