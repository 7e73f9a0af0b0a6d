import { ApiError } from '../../../core/http/api-error';
import { isVersionConflict } from '../version-conflict';
import { RowIssue, SentRows, issuesOnGrid } from './rows-to-send';
import { CONFLICT_TEXT, SaveStatus } from './save-status';

/** What a refused save means for the rows on screen. */
export interface Refusal {
  status: Extract<SaveStatus, 'invalid' | 'offline' | 'conflict' | 'failed'>;
  message: string;
  issues: RowIssue[];
  /** Try again by itself after a pause (the server could not be reached). */
  retryLater: boolean;
}

/** The first issues in words, and how many more there are. */
export function issueSummary(issues: readonly RowIssue[], fallback: string): string {
  if (issues.length === 0) return fallback;
  const first = issues.slice(0, 3).map((i) => i.message).join('; ');
  return issues.length > 3 ? `${first}; and ${issues.length - 3} more` : first;
}

/**
 * Reads a refused PUT: someone else saved first (conflict: keep the rows, never overwrite), a row the
 * server refused (invalid: named by grid row), no answer or a server fault (offline: retry later), or
 * another refusal in the server's words (failed: a signed study, a plan awaiting approval).
 */
export function refusalOf(err: ApiError, sent: SentRows): Refusal {
  if (isVersionConflict(err)) return { status: 'conflict', message: CONFLICT_TEXT, issues: [], retryLater: false };
  if (err.status === 400) {
    const issues = issuesOnGrid(err.issues, sent);
    return { status: 'invalid', message: issueSummary(issues, err.message), issues, retryLater: false };
  }
  if (err.status === 0 || err.status >= 500) return { status: 'offline', message: err.message, issues: [], retryLater: true };
  return { status: 'failed', message: err.message, issues: [], retryLater: false };
}
