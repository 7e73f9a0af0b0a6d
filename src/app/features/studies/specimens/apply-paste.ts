import type { DecimalMark } from '@shared/schemas/result-text';
import { hasHeader, splitClipboard, parseFlag } from './paste-parser';
import { normaliseDecimal } from './result-number';
import { GridRow, SpecimenField, SpecimenLayout, blankRow } from './specimen-layout';

/** Where a paste lands: the focused cell's row index and field. */
export interface PasteTarget {
  rowIndex: number;
  field: string;
}

export interface PasteOutcome {
  rows: GridRow[];
  /** Grid rows the paste wrote into (existing and new). */
  written: number;
  added: number;
  skippedHeader: boolean;
  /** Cells to the right of the last column, left out. */
  ignoredCells: number;
}

function cellValue(field: SpecimenField, text: string, mark: DecimalMark): string | boolean {
  if (field.kind === 'flag') return parseFlag(text);
  if (field.kind === 'result') return normaliseDecimal(text, mark);
  return text.trim();
}

/**
 * Writes a block copied from a spreadsheet into the rows, starting at the target cell and going right
 * and down; past the last row it adds rows. A header line is detected and skipped (see hasHeader);
 * a short (ragged) line fills only its own cells. Results are read with the study's decimal mark
 * (normaliseDecimal); one that does not read stays as pasted, to be marked. A block the layout reads in a shape of its
 * own (SpecimenLayout.pasteRows) is written as the rows it gives, from the first column of the target row. The input
 * rows are not changed.
 */
export function applyPaste(
  rows: readonly GridRow[], layout: SpecimenLayout, target: PasteTarget, text: string, mark: DecimalMark = 'auto',
): PasteOutcome {
  let lines = splitClipboard(text);
  // A shape of the kind's own (its layout's pasteRows) becomes whole rows from the first column; its header is used up.
  const reshaped = layout.pasteRows?.(lines) ?? null;
  const start = reshaped ? 0 : Math.max(0, layout.fields.findIndex((f) => f.field === target.field));
  const width = Math.max(0, ...lines.map((l) => l.length));
  const resultColumns = Array.from({ length: width }, (_, k) => k).filter((k) => layout.fields[start + k]?.kind === 'result');
  const skippedHeader = reshaped !== null || hasHeader(lines, resultColumns);
  if (reshaped) lines = reshaped;
  else if (skippedHeader) lines = lines.slice(1);
  const out = [...rows];
  let added = 0;
  let ignoredCells = 0;
  lines.forEach((cells, i) => {
    const index = target.rowIndex + i;
    if (index >= out.length) {
      out.push(blankRow(layout));
      added++;
    }
    const row = { ...out[index] };
    cells.forEach((text, k) => {
      const field = layout.fields[start + k];
      if (field) row[field.field] = cellValue(field, text, mark);
      else ignoredCells++;
    });
    out[index] = row;
  });
  return { rows: out, written: lines.length, added, skippedHeader, ignoredCells };
}
