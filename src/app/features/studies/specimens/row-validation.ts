import type { RowField } from '@shared/kinds/kind';
import {
  EXCLUDED_WITHOUT_REASON, emptyRequired, emptyRequiredWords, fieldProblem, lacksReason, readField, type RowRules as SharedRowRules,
} from '@shared/results/row-checks';
import { GridRow, SpecimenLayout, isBlank } from './specimen-layout';

/** What the study allows in its rows: the sign rule and decimal mark the server reads with (shared/results/row-checks.ts). */
export interface RowRules extends SharedRowRules {
  /**
   * The kind's row fields (shared/kinds/<kind>/meta.ts): their types and which an included row needs. Without them, the
   * layout's result columns are the fields checked, each required, as in every kind.
   */
  fields?: readonly RowField[];
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
 * The problems of one row, in column order, by the shared row checks the server applies, in its words: a field the
 * server would refuse (a result not a number, censored as "<0.5", unclear as "1,234", beyond what a number keeps,
 * below zero where the analyte cannot be; a replicate that is not a whole number; a sex other than F or M), a field
 * an included row needs left empty (the analysis refuses it in the same words), an exclusion without a reason.
 * A row with nothing entered has no problems (it is not sent).
 */
export function rowProblems(row: GridRow, rowIndex: number, layout: SpecimenLayout, rules: RowRules): CellProblem[] {
  if (isBlank(row, layout)) return [];
  const fields = checkedFields(layout, rules);
  const out: CellProblem[] = [];
  const missing = new Set(emptyRequired(fields, (f) => row[f.field], row['excluded'] === true));
  for (const f of fields) {
    const read = readField(f, row[f.field], rules);
    if ('error' in read) out.push(problem(rowIndex, f.field, fieldProblem(f, read.error)));
    else if (missing.has(f)) out.push(problem(rowIndex, f.field, emptyRequiredWords(f)));
  }
  if (lacksReason(row['excluded'], row['exclusionReason'])) out.push(problem(rowIndex, 'exclusionReason', EXCLUDED_WITHOUT_REASON));
  return out;
}

/** The kind's fields the grid shows, in the grid's column order; without them, its result columns, each required. */
function checkedFields(layout: SpecimenLayout, rules: RowRules): RowField[] {
  return layout.fields.flatMap((l): RowField[] => {
    const known = rules.fields?.find((f) => f.field === l.field);
    if (known) return [known];
    return !rules.fields && l.kind === 'result' ? [{ field: l.field, type: 'result', words: l.words, required: true }] : [];
  });
}

/** Every problem of every row, by row then column. */
export function allProblems(rows: readonly GridRow[], layout: SpecimenLayout, rules: RowRules): CellProblem[] {
  return rows.flatMap((row, i) => rowProblems(row, i, layout, rules));
}

/** The problem of one cell, if any (for the grid's cell class and tooltip). */
export function cellProblem(problems: readonly CellProblem[], rowIndex: number, field: string): CellProblem | undefined {
  return problems.find((p) => p.rowIndex === rowIndex && p.field === field);
}
