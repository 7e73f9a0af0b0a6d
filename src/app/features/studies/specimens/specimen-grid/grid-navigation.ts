import { GridRow, SpecimenLayout, isBlank } from '../specimen-layout';

/** A cell by row position and field. */
export interface CellAt {
  rowIndex: number;
  field: string;
}

/**
 * Where Tab (or Shift+Tab) goes from a cell: the next field of the row, and past the last field the first
 * field of the next row (backwards: past the first, the last field of the row before), so the row number
 * and the tick box are never stops. Null past the grid's first or last cell, where Tab leaves the grid.
 * From a column that is not a field (the row number, the tick box) Tab goes to the row's first field.
 */
export function tabTarget(from: CellAt, backwards: boolean, fields: readonly string[], rowCount: number): CellAt | null {
  if (fields.length === 0 || rowCount === 0) return null;
  const last = fields.length - 1;
  const at = fields.indexOf(from.field);
  if (at < 0) {
    if (!backwards) return { rowIndex: from.rowIndex, field: fields[0] };
    return from.rowIndex > 0 ? { rowIndex: from.rowIndex - 1, field: fields[last] } : null;
  }
  if (!backwards) {
    if (at < last) return { rowIndex: from.rowIndex, field: fields[at + 1] };
    return from.rowIndex + 1 < rowCount ? { rowIndex: from.rowIndex + 1, field: fields[0] } : null;
  }
  if (at > 0) return { rowIndex: from.rowIndex, field: fields[at - 1] };
  return from.rowIndex > 0 ? { rowIndex: from.rowIndex - 1, field: fields[last] } : null;
}

/**
 * Whether Enter on row `rowIndex` adds a row: only on the last row, and only when that row holds something
 * (so holding Enter on an empty last row does not pile up empty rows).
 */
export function enterAddsRow(rowIndex: number, rows: readonly GridRow[], layout: SpecimenLayout): boolean {
  const last = rows.length - 1;
  return rowIndex === last && last >= 0 && !isBlank(rows[last], layout);
}
