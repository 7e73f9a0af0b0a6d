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

/**
 * The steps the user can go back and forward through: each entry is the whole list of rows before (past) or
 * after (future) one change. Rows are never changed in place, so a snapshot shares its unchanged row objects
 * with the list on screen and costs one array. One typed cell, one paste, one deletion of any number of rows
 * or one exclusion is one step. (ag-grid's own undo covers only cell edits and clears itself whenever the rows
 * are replaced, which this grid does on every change; so the history lives here, beside the store.)
 */
export interface EditHistory {
  readonly past: readonly (readonly GridRow[])[];
  readonly future: readonly (readonly GridRow[])[];
}

export const EMPTY_HISTORY: EditHistory = { past: [], future: [] };

/** How many steps back are kept. */
export const HISTORY_LIMIT = 100;

/** The history after a change made from `before`: one more step back, and nothing left to redo. */
export function recordEdit(history: EditHistory, before: readonly GridRow[], limit = HISTORY_LIMIT): EditHistory {
  const past = [...history.past, before];
  return { past: past.length > limit ? past.slice(past.length - limit) : past, future: [] };
}

/** One step back from `current`: the rows to show and the history after it; null when there is nothing to undo. */
export function undoEdit(history: EditHistory, current: readonly GridRow[]): { rows: GridRow[]; history: EditHistory } | null {
  const previous = history.past.at(-1);
  if (!previous) return null;
  return { rows: [...previous], history: { past: history.past.slice(0, -1), future: [...history.future, current] } };
}

/** One step forward again (after an undo); null when there is nothing to redo. */
export function redoEdit(history: EditHistory, current: readonly GridRow[]): { rows: GridRow[]; history: EditHistory } | null {
  const next = history.future.at(-1);
  if (!next) return null;
  return { rows: [...next], history: { past: [...history.past, current], future: history.future.slice(0, -1) } };
}

/**
 * Where two lists of rows first differ, for putting the focus there after an undo or redo: the first row
 * (by position) that is another row or holds another value, and its first changed field (the first field
 * when the row itself came or went). Null when they hold the same.
 */
export function firstDifference(before: readonly GridRow[], after: readonly GridRow[], fields: readonly string[]): { rowIndex: number; field: string } | null {
  const length = Math.max(before.length, after.length);
  for (let i = 0; i < length; i++) {
    const a = before[i];
    const b = after[i];
    if (a === b) continue;
    if (!a || !b || a.uid !== b.uid) return { rowIndex: Math.min(i, Math.max(0, after.length - 1)), field: fields[0] };
    const field = fields.find((f) => a[f] !== b[f]);
    if (field) return { rowIndex: i, field };
  }
  return null;
}
