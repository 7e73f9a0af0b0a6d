import { magnitudeProblem } from './magnitude';
import type { ComparisonRow } from './comparison-types';

/** The included pairs (with their input indexes), every pair, and the excluded rows with reasons. */
export interface SplitRows {
  x: Float64Array;
  y: Float64Array;
  index: number[];
  allX: Float64Array;
  allY: Float64Array;
  excluded: { row: number; index: number; label: string | null; reason: string | null }[];
}

/** @throws RangeError naming the 1-based row whose x or y is not a finite number */
export function splitRows(rows: ComparisonRow[]): SplitRows {
  const index: number[] = [];
  const excluded: SplitRows['excluded'] = [];
  rows.forEach((row, i) => {
    if (!Number.isFinite(row.x) || !Number.isFinite(row.y)) throw new RangeError(`analyzeComparison requires finite x and y (row ${i + 1})`);
    const problem = magnitudeProblem(row.x) ?? magnitudeProblem(row.y);
    if (problem) throw new RangeError(`analyzeComparison: row ${i + 1}: ${problem}`);
    if (row.excluded) excluded.push({ row: i + 1, index: i, label: row.label ?? null, reason: row.exclusionReason ?? null });
    else index.push(i);
  });
  return {
    x: Float64Array.from(index, (i) => rows[i].x),
    y: Float64Array.from(index, (i) => rows[i].y),
    index,
    allX: Float64Array.from(rows, (r) => r.x),
    allY: Float64Array.from(rows, (r) => r.y),
    excluded,
  };
}
