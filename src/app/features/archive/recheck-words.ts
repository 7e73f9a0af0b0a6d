import type { ChainCheckReport, IntegrityReport, ReproduceReport } from '@shared/schemas';
import { plural } from '@shared/types/plural';

/** One line a re-check result opens with: an icon and words that say passed or failed on their own. */
export interface Outcome {
  passed: boolean;
  icon: string;
  word: string;
  headline: string;
}

const outcome = (passed: boolean, headline: string): Outcome => ({
  passed, icon: passed ? 'verified' : 'report', word: passed ? 'Passed' : 'Failed', headline,
});

export function integrityOutcome(report: IntegrityReport): Outcome {
  const failed = report.checks.filter((c) => !c.passed).length;
  const of = plural(report.checks.length, 'check');
  return report.passed && failed === 0
    ? outcome(true, `All ${of} passed: nothing changed since signing.`)
    : outcome(false, `${failed || 'Some'} of ${of} failed: the stored record no longer matches what was signed.`);
}

/** The history re-check: the laboratory's chain and the chain of events with no laboratory. */
export function chainOutcome(report: ChainCheckReport): Outcome {
  const failed = report.checks.filter((c) => !c.passed).length;
  return report.passed && failed === 0
    ? outcome(true, 'Both history chains are intact: no event was changed, removed or inserted.')
    : outcome(false, `${failed === 1 ? 'One history chain is' : 'Both history chains are'} broken: the history was changed outside Parallax.`);
}

export function reproduceOutcome(report: ReproduceReport): Outcome {
  const fields = plural(report.fieldsCompared, 'result field');
  return report.identical
    ? outcome(true, `Re-running the analysis gave identical results in all ${fields}.`)
    : outcome(false, `Re-running the analysis gave different values in ${report.differences.length.toLocaleString('en-US')} of ${fields}.`);
}

/** Which engine computed the stored results and which re-ran them, in words. */
export function engineLine(report: ReproduceReport): string {
  return report.sameEngine
    ? `Stored and re-run with the same engine version, ${report.currentEngine}.`
    : `Stored with engine ${report.storedEngine}; re-run with ${report.currentEngine}, a different version.`;
}

/** A stored or recomputed value as a table cell shows it. */
export function showValue(value: unknown): string {
  if (value === undefined) return '(absent)';
  if (value === null) return '(none)';
  if (typeof value === 'number') return String(value);
  if (typeof value === 'string') return value === '' ? '(empty)' : value;
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  return JSON.stringify(value);
}
