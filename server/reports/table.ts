import type { Layout } from './layout';
import { drawText, measure, wrapAtSpaces, type TextStyle } from './text';
import { COLOR, SIZE } from './theme';

export interface Column {
  header: string;
  /** Relative width; the columns share the text width in proportion. */
  weight: number;
  align?: 'left' | 'right' | 'center';
}

export interface TableOptions {
  size?: number;
  /** Rows to print in semibold (a total, a headline). */
  strong?: (row: number) => boolean;
  /** A text colour per cell, e.g. for a verdict. */
  color?: (row: number, column: number) => string | undefined;
  /**
   * Break every cell at spaces to its column's width first (wrapAtSpaces), so "America/Halifax" or "mmol/L" is
   * never split at its slash; a word longer than its column is still broken by pdfkit.
   */
  breakAtSpaces?: boolean;
}

const PAD_X = 4;
const PAD_Y = 2.5;
/** How much narrower than its cell breakAtSpaces makes a line, so pdfkit never breaks it again. */
const BREAK_SLACK = 6;

/**
 * A table that flows down the pages: each row is measured first and, when it would cross the footer
 * zone, a new page starts and the header row is drawn again. Cells wrap within their column.
 */
export function drawTable(layout: Layout, columns: Column[], given: string[][], options: TableOptions = {}): void {
  const size = options.size ?? SIZE.table;
  const total = columns.reduce((sum, c) => sum + c.weight, 0);
  const widths = columns.map((c) => (layout.width * c.weight) / total);
  const headerStyle: TextStyle = { size, bold: true, color: COLOR.ink };
  // Headings and strong rows are set in the semibold face, which runs wider than the regular one wrapAtSpaces measures;
  // and pdfkit counts a line's trailing space, so lines are made a little narrower than the cell (BREAK_SLACK).
  const breakCell = (cell: string, c: number, scale = 1): string =>
    options.breakAtSpaces ? wrapAtSpaces(layout.doc, cell, size, (widths[c] - 2 * PAD_X) * scale - BREAK_SLACK) : cell;
  const header = columns.map((c, k) => breakCell(c.header, k, 0.92));
  const rows = given.map((row, r) => row.map((cell, c) => breakCell(cell, c, options.strong?.(r) ? 0.92 : 1)));
  const headerHeight = rowHeight(layout, header, widths, headerStyle);

  const drawHeader = (): void => {
    layout.doc.rect(layout.left, layout.y, layout.width, headerHeight).fill(COLOR.accentSoft);
    drawCells(layout, header, widths, columns, headerStyle);
    layout.y += headerHeight;
  };

  const firstRow = rows.length ? rowHeight(layout, rows[0], widths, { size }) : 0;
  layout.ensure(headerHeight + firstRow);
  drawHeader();
  rows.forEach((row, r) => {
    const style: TextStyle = { size, bold: options.strong?.(r) ?? false };
    const height = rowHeight(layout, row, widths, style);
    if (layout.ensure(height)) drawHeader();
    if (r % 2 === 1) layout.doc.rect(layout.left, layout.y, layout.width, height).fill(COLOR.tint);
    drawCells(layout, row, widths, columns, style, (c) => options.color?.(r, c));
    layout.y += height;
  });
  layout.doc.moveTo(layout.left, layout.y).lineTo(layout.right, layout.y).lineWidth(0.5).strokeColor(COLOR.rule).stroke();
  layout.gap(8);
}

function rowHeight(layout: Layout, cells: string[], widths: number[], style: TextStyle): number {
  const heights = cells.map((cell, c) => measure(layout.doc, cell, style, widths[c] - 2 * PAD_X));
  return Math.max(...heights) + 2 * PAD_Y;
}

function drawCells(
  layout: Layout, cells: string[], widths: number[], columns: Column[], style: TextStyle, color?: (c: number) => string | undefined,
): void {
  let x = layout.left;
  cells.forEach((cell, c) => {
    const cellStyle = { ...style, color: color?.(c) ?? style.color };
    drawText(layout.doc, cell, x + PAD_X, layout.y + PAD_Y, cellStyle, { width: widths[c] - 2 * PAD_X, align: columns[c].align });
    x += widths[c];
  });
}
