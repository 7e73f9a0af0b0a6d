import type { ApiIssue } from '@shared/schemas';
import { GridRow, SpecimenLayout, isBlank, toInput } from './specimen-layout';

/** The body rows of a PUT, and for each sent row the grid row it came from. */
export interface SentRows {
  rows: Record<string, unknown>[];
  gridIndex: number[];
}

/** Every row with something in it, in grid order; blank rows are not sent. */
export function rowsToSend(rows: readonly GridRow[], layout: SpecimenLayout): SentRows {
  const out: SentRows = { rows: [], gridIndex: [] };
  rows.forEach((row, i) => {
    if (isBlank(row, layout)) return;
    out.rows.push(toInput(row, layout));
    out.gridIndex.push(i);
  });
  return out;
}

/** A server issue on a sent row, placed on its grid row. */
export interface RowIssue {
  rowIndex: number | null;
  field: string | null;
  message: string;
}

/**
 * Reads the server's issues (path "rows.13.candidate", message "row 14: …") as grid rows: when blank
 * rows were left out, the row number in the message is rewritten to the grid's own numbering.
 */
export function issuesOnGrid(issues: readonly ApiIssue[], sent: SentRows): RowIssue[] {
  return issues.map((issue) => {
    const match = /^rows\.(\d+)(?:\.(\w+))?/.exec(issue.path);
    const sentIndex = match ? Number(match[1]) : NaN;
    const rowIndex = sent.gridIndex[sentIndex] ?? null;
    if (rowIndex === null) return { rowIndex: null, field: null, message: issue.message };
    return { rowIndex, field: match?.[2] ?? null, message: issue.message.replace(/^row \d+/i, `row ${rowIndex + 1}`) };
  });
}
