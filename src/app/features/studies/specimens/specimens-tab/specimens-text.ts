import type { PasteOutcome } from '../apply-paste';
import type { CellProblem } from '../row-validation';
import { plural } from '@shared/types/plural';

/** What a paste did, in one sentence: "Pasted 40 rows (39 new); the header line was left out." */
export function pasteSummary(outcome: PasteOutcome): string {
  const parts = [`Pasted ${plural(outcome.written, 'row')}${outcome.added > 0 ? ` (${outcome.added} new)` : ''}`];
  if (outcome.skippedHeader) parts.push('the header line was left out');
  if (outcome.ignoredCells > 0) parts.push(`${plural(outcome.ignoredCells, 'cell')} beyond the last column ${outcome.ignoredCells === 1 ? 'was' : 'were'} left out`);
  return `${parts.join('; ')}.`;
}

export interface ProblemSummary {
  /** "2 problems" */
  title: string;
  /** The first problems by row, in words. */
  lines: string[];
  /** How many are not listed. */
  more: number;
}

/** The problems of the rows for the line above the grid; null when there are none. */
export function problemSummary(problems: readonly CellProblem[], shown = 6): ProblemSummary | null {
  if (problems.length === 0) return null;
  return {
    title: plural(problems.length, 'problem'),
    lines: problems.slice(0, shown).map((p) => p.message),
    more: Math.max(0, problems.length - shown),
  };
}
