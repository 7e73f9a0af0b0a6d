import { reportableRangeMeta } from '@shared/kinds/reportable-range/meta';
import { isNumberText } from '../../specimens/result-number';
import type { SpecimenLayout } from '../../specimens/specimen-layout';

/** How the shared description heads a file's level column (the import's own pattern: Level, Sample, Pool, Dilution, Mixture). */
const LEVEL_HEADER = reportableRangeMeta.rowFields.find((f) => f.field === 'level')!.importHeader;
/** A replicate's column: "1", "Rep 1", "Rep. 2", "Replicate 3", "R4", "#5". */
const REPLICATE_HEADER = /^(?:rep(?:licate)?\.?|r|#)?\s*(\d{1,2})$/i;
/** A cell with the shape of a result, readable or not ("12.1", "12,1", "-0.5", "<0.5"): the shared test the grid's header check uses. */
const NUMBER = { test: (cell: string): boolean => isNumberText(cell) };
/** A replicate number as the long layout's second column holds it: a whole number from 1 to 10. */
const REPLICATE = /^(?:[1-9]|10)$/;

/** The cells without the empty ones at the end of the line. */
function trimEnd(cells: readonly string[]): string[] {
  const out = cells.map((c) => c.trim());
  while (out.length > 0 && out[out.length - 1] === '') out.pop();
  return out;
}

/** One row per result of a line with its level, then one result per replicate (an empty cell: a missing replicate). */
function spread(level: string, results: readonly string[], replicates: readonly number[]): string[][] {
  const out: string[][] = [];
  replicates.forEach((replicate, k) => {
    const result = (results[k] ?? '').trim();
    if (result !== '') out.push([level, String(replicate), result]);
  });
  return out;
}

/**
 * Reads a block with one line per level and one column per replicate, as linearity results are often kept, and turns it
 * into one row per result: level, replicate, result (the grid's first three columns). Two shapes are read:
 *
 *   Level    | Rep 1 | Rep 2 | …     with a header line: each line its level, then its results (numbered from the header)
 *   Level 3  | 12.1  | 12.3  | …     without one: each line a level's name, then two or more results, numbered 1, 2, …
 *
 * The level header is the one a file import recognises (Level, Sample, Pool, Dilution, Mixture); a replicate's header is
 * its number, alone or after Rep, Replicate, R or # ("Rep 1", "R2", "3"), numbered 1, 2, 3 … in order, at least two.
 * Without a header, every line's first cell is a name that is not a number and the cells after it are numbers (or empty);
 * a block of three cells a line whose second cell is a whole number from 1 to 10 is the grid's own shape (level,
 * replicate, result) and is pasted as it stands; put a header line over a block of two whole-number results to read it
 * as replicates. An empty result cell gives no row (a missing replicate), and an empty line is skipped. Results are left
 * as pasted (the grid reads them with the study's decimal mark). Null when the block is not of these shapes.
 */
export function wideRangeRows(lines: readonly string[][]): string[][] | null {
  const rows = lines.map(trimEnd).filter((cells) => cells.length > 0);
  if (rows.length === 0) return null;
  const [header] = rows;
  if (header.length >= 3 && LEVEL_HEADER?.test(header[0])) {
    const replicates = header.slice(1).map((c) => Number(REPLICATE_HEADER.exec(c)?.[1]));
    if (replicates.some((r, k) => r !== k + 1) || rows.length < 2) return null;
    return rows.slice(1).flatMap((cells) => spread(cells[0], cells.slice(1), replicates));
  }
  const wide = rows.every((cells) => cells.length >= 3 && !NUMBER.test(cells[0]) && cells.slice(1).every((c) => c === '' || NUMBER.test(c)));
  if (!wide) return null;
  const ownShape = rows.every((cells) => cells.length === 3 && REPLICATE.test(cells[1]));
  if (ownShape) return null;
  return rows.flatMap((cells) => spread(cells[0], cells.slice(1), cells.slice(1).map((_, k) => k + 1)));
}

/**
 * The grid of a reportable-range study: one row per result, with its level (as the levels table names it) and its
 * replicate number (sent as typed; the server checks it is a whole number). Empty level and replicate cells are sent as
 * null. A block with one column per replicate is pasted as one row per result (wideRangeRows).
 */
export const RANGE_LAYOUT: SpecimenLayout = {
  fields: [
    { field: 'level', header: 'Level', kind: 'text', words: 'level', blankAs: null, width: 150 },
    { field: 'replicate', header: 'Replicate', kind: 'text', words: 'replicate', blankAs: null, width: 110 },
    { field: 'value', header: 'Result', kind: 'result', words: 'result', width: 120 },
    { field: 'excluded', header: 'Excluded', kind: 'flag', words: 'excluded', width: 100 },
    { field: 'exclusionReason', header: 'Exclusion reason', kind: 'text', words: 'exclusion reason', blankAs: null, width: 200, grow: true },
    { field: 'note', header: 'Note', kind: 'text', words: 'note', width: 200, grow: true },
  ],
  pasteRows: wideRangeRows,
};
