import { precisionMeta } from '@shared/kinds/precision/meta';
import { isNumberText } from '../../specimens/result-number';
import type { SpecimenLayout } from '../../specimens/specimen-layout';

/** How the shared description heads a file's material and day columns (the import's own patterns). */
const headerOf = (field: string): RegExp => precisionMeta.rowFields.find((f) => f.field === field)!.importHeader!;
const MATERIAL_HEADER = headerOf('material');
const DAY_HEADER = headerOf('day');
/** A replicate's column: "1", "Rep 1", "Rep. 2", "Replicate 3", "R4", "#5". */
const REPLICATE_HEADER = /^(?:rep(?:licate)?\.?|r|#)?\s*(\d{1,2})$/i;

/**
 * Reads a block with one line per day and one column per replicate, as precision results are often kept, and turns it
 * into one row per result: material, day, replicate, result (the grid's first four columns). Two shapes are read,
 * each with its header line (the header is how the block is recognised; a block without one is pasted as it stands):
 *
 *   Material | Day | Rep 1 | Rep 2 | …     each line: its material, its day, then its results
 *   Day      | 1   | 2     | 3     | …     each line: its day, then its results; the material cells stay empty
 *   Level 1  | 1   | 2     | 3     | …     as above, the corner cell naming the material of every line
 *
 * The material and day headers are those a file import recognises (Material, Level, Control, Sample; Day, Date, Run);
 * a replicate's header is its number, alone or after Rep, Replicate, R or # ("Rep 1", "R2", "3"), numbered 1, 2, 3 …
 * in order, at least two; a corner cell that is a number is not a header (so a first line of results is never taken for
 * one). An empty result cell gives no row (a missing replicate), and an empty line is skipped. Results are left as
 * pasted (the grid reads them with the study's decimal mark). Null when the block is not of these shapes.
 */
export function widePrecisionRows(lines: readonly string[][]): string[][] | null {
  if (lines.length < 2) return null;
  const header = trimEnd(lines[0].map((c) => c.trim()));
  const lead = header.length > 1 && MATERIAL_HEADER.test(header[0]) && DAY_HEADER.test(header[1]) ? 2 : 1;
  const replicates = header.slice(lead).map((c) => Number(REPLICATE_HEADER.exec(c)?.[1]));
  if (replicates.length < 2 || replicates.some((r, k) => r !== k + 1)) return null;
  const corner = lead === 1 && !DAY_HEADER.test(header[0]) ? header[0] : '';
  if (isNumberText(corner)) return null;
  const out: string[][] = [];
  for (const cells of lines.slice(1)) {
    if (cells.every((c) => c.trim() === '')) continue;
    const material = lead === 2 ? (cells[0] ?? '').trim() : corner;
    const day = (cells[lead - 1] ?? '').trim();
    replicates.forEach((replicate, k) => {
      const result = (cells[lead + k] ?? '').trim();
      if (result !== '') out.push([material, day, String(replicate), result]);
    });
  }
  return out;
}

/** The cells without the empty ones at the end of the line. */
function trimEnd(cells: string[]): string[] {
  let end = cells.length;
  while (end > 0 && cells[end - 1] === '') end--;
  return cells.slice(0, end);
}

/**
 * The grid of a precision study: one row per result, with its material, its day (a date or a run number) and its
 * replicate number (sent as typed; the server checks it is a whole number). Empty material, day and replicate cells are
 * sent as null. A block with one column per replicate is pasted as one row per result (widePrecisionRows).
 */
export const PRECISION_LAYOUT: SpecimenLayout = {
  fields: [
    { field: 'material', header: 'Material', kind: 'text', words: 'material', blankAs: null, width: 150 },
    { field: 'day', header: 'Day', kind: 'text', words: 'day', blankAs: null, width: 130 },
    { field: 'replicate', header: 'Replicate', kind: 'text', words: 'replicate', blankAs: null, width: 110 },
    { field: 'value', header: 'Result', kind: 'result', words: 'result', width: 120 },
    { field: 'excluded', header: 'Excluded', kind: 'flag', words: 'excluded', width: 100 },
    { field: 'exclusionReason', header: 'Exclusion reason', kind: 'text', words: 'exclusion reason', blankAs: null, width: 200, grow: true },
    { field: 'note', header: 'Note', kind: 'text', words: 'note', width: 200, grow: true },
  ],
  pasteRows: widePrecisionRows,
};
