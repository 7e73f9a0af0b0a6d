import { GridRow, SpecimenLayout, blankRow } from './specimen-layout';

/** The rows with a blank row inserted at `index` (at the end when index is past it). */
export function insertRow(rows: readonly GridRow[], layout: SpecimenLayout, index = rows.length): GridRow[] {
  const at = Math.min(Math.max(0, index), rows.length);
  return [...rows.slice(0, at), blankRow(layout), ...rows.slice(at)];
}

/** The rows without those whose uid is listed. */
export function deleteRows(rows: readonly GridRow[], uids: ReadonlySet<number>): GridRow[] {
  return rows.filter((row) => !uids.has(row.uid));
}

/** The rows with one row moved up (delta −1) or down (+1); unchanged at either end. */
export function moveRow(rows: readonly GridRow[], uid: number, delta: -1 | 1): GridRow[] {
  const from = rows.findIndex((row) => row.uid === uid);
  const to = from + delta;
  if (from < 0 || to < 0 || to >= rows.length) return [...rows];
  const out = [...rows];
  [out[from], out[to]] = [out[to], out[from]];
  return out;
}

/** The rows with one cell changed (a new row object, so signals see the change). */
export function setCell(rows: readonly GridRow[], uid: number, field: string, value: string | boolean): GridRow[] {
  return rows.map((row) => (row.uid === uid ? { ...row, [field]: value } : row));
}
