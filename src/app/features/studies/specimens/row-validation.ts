import type { DecimalMark } from '@shared/schemas/result-text';
import { parseResult, resultProblem } from './result-number';
import { GridRow, SpecimenLayout, isBlank } from './specimen-layout';

/** What the study allows in its rows. */
export interface RowRules {
  /** False when the analyte cannot be below zero (Study.canBeNegative). */
  canBeNegative: boolean;
  /** How results are read (the study's settings.decimalMark): the same reading the server applies. */
  decimalMark: DecimalMark;
}

/** One problem in one cell, in words: `message` for the summary ("row 14: …"), `text` for the cell's tooltip. */
export interface CellProblem {
  rowIndex: number;
  field: string;
  message: string;
  text: string;
}

function problem(rowIndex: number, field: string, what: string): CellProblem {
  return { rowIndex, field, message: `row ${rowIndex + 1}: ${what}`, text: what.charAt(0).toUpperCase() + what.slice(1) };
}

/**
 * The problems of one row, in column order: a result the server would refuse (not a number, unclear as
 * "1,234", beyond what a number keeps), below zero where the analyte cannot be, or missing while the row
 * holds something else; an exclusion without a reason. The words are the server's own.
 * A row with nothing entered has no problems (it is not sent).
 */
export function rowProblems(row: GridRow, rowIndex: number, layout: SpecimenLayout, rules: RowRules): CellProblem[] {
  if (isBlank(row, layout)) return [];
  const out: CellProblem[] = [];
  for (const f of layout.fields) {
    if (f.kind !== 'result') continue;
    const text = String(row[f.field] ?? '');
    const value = parseResult(text, rules.decimalMark);
    if (value === null) out.push(problem(rowIndex, f.field, `${f.words} is missing`));
    else if (Number.isNaN(value)) out.push(problem(rowIndex, f.field, `${f.words} ${resultProblem(text, rules.decimalMark)}`));
    else if (value < 0 && !rules.canBeNegative) out.push(problem(rowIndex, f.field, `${f.words} is negative, which this analyte cannot be`));
  }
  if (row['excluded'] === true && String(row['exclusionReason'] ?? '').trim() === '') {
    out.push(problem(rowIndex, 'exclusionReason', 'excluded without a reason; give the reason'));
  }
  return out;
}

/** Every problem of every row, by row then column. */
export function allProblems(rows: readonly GridRow[], layout: SpecimenLayout, rules: RowRules): CellProblem[] {
  return rows.flatMap((row, i) => rowProblems(row, i, layout, rules));
}

/** The problem of one cell, if any (for the grid's cell class and tooltip). */
export function cellProblem(problems: readonly CellProblem[], rowIndex: number, field: string): CellProblem | undefined {
  return problems.find((p) => p.rowIndex === rowIndex && p.field === field);
}
