import type { SpecimenRow } from '@shared/schemas';

/** How a cell holds its value: free text, a measured result (typed text, checked as a number), or a yes/no flag. */
export type CellKind = 'text' | 'result' | 'flag';

/** One editable column of the specimen grid. */
export interface SpecimenField {
  field: string;
  header: string;
  kind: CellKind;
  /** The field in words, as messages name it: "candidate result". */
  words: string;
  /** What an empty text cell is sent as. */
  blankAs?: '' | null;
  width?: number;
  /** Takes a share of the room left over (free-text columns). */
  grow?: boolean;
}

/** One grid row: a local id for the grid, then one value per field (text as typed, flags as booleans). */
export interface GridRow {
  uid: number;
  [field: string]: string | boolean | number;
}

/** The columns a kind of study enters; pasting, validation and saving all follow this list. */
export interface SpecimenLayout {
  fields: readonly SpecimenField[];
  /**
   * A kind's own reading of a pasted block (lines of cells, as split from the clipboard): when it recognises a shape
   * of its own (such as one column per replicate), the rows to write instead, each in the order of `fields` from the
   * first; null pastes the block as it stands.
   */
  pasteRows?(lines: string[][]): string[][] | null;
}

export const COMPARISON_LAYOUT: SpecimenLayout = {
  fields: [
    { field: 'label', header: 'Specimen label', kind: 'text', words: 'specimen label', width: 150 },
    { field: 'comparative', header: 'Comparative result', kind: 'result', words: 'comparative result', width: 175 },
    { field: 'candidate', header: 'Candidate result', kind: 'result', words: 'candidate result', width: 175 },
    { field: 'excluded', header: 'Excluded', kind: 'flag', words: 'excluded', width: 100 },
    { field: 'exclusionReason', header: 'Exclusion reason', kind: 'text', words: 'exclusion reason', blankAs: null, width: 200, grow: true },
    { field: 'note', header: 'Note', kind: 'text', words: 'note', width: 200, grow: true },
  ],
};

let nextUid = 1;
/** A fresh id for a new grid row (ids only need to be unique within the page). */
export function newUid(): number {
  return nextUid++;
}

export function blankRow(layout: SpecimenLayout): GridRow {
  const row: GridRow = { uid: newUid() };
  for (const f of layout.fields) row[f.field] = f.kind === 'flag' ? false : '';
  return row;
}

/** True when nothing has been entered in the row. */
export function isBlank(row: GridRow, layout: SpecimenLayout): boolean {
  return layout.fields.every((f) => (f.kind === 'flag' ? row[f.field] !== true : String(row[f.field] ?? '').trim() === ''));
}

/** A stored row as the grid shows it: results as the text that was reported (so "7.0" keeps its zero). */
export function fromStored(stored: SpecimenRow, layout: SpecimenLayout): GridRow {
  const source = stored as unknown as Record<string, unknown>;
  const row = blankRow(layout);
  for (const f of layout.fields) {
    const value = f.kind === 'result' ? (source[`${f.field}Text`] ?? source[f.field]) : source[f.field];
    if (f.kind === 'flag') row[f.field] = value === true;
    else row[f.field] = value === null || value === undefined ? '' : String(value);
  }
  return row;
}

/** A grid row as PUT /specimens takes it: results as trimmed text (or null), empty texts as the field says. */
export function toInput(row: GridRow, layout: SpecimenLayout): Record<string, unknown> {
  const input: Record<string, unknown> = {};
  for (const f of layout.fields) {
    const value = row[f.field];
    if (f.kind === 'flag') input[f.field] = value === true;
    else {
      const text = String(value ?? '').trim();
      input[f.field] = text === '' ? (f.kind === 'result' ? null : f.blankAs === undefined ? '' : f.blankAs) : text;
    }
  }
  return input;
}
