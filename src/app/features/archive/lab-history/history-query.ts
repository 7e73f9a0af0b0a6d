import { AuditQuery } from '../../../../../shared/schemas';
import type { HistoryFilter } from '../history-api';
import { RawParams, readQuery } from '../query-params';

/**
 * The laboratory history's keys in the address bar. The API also takes userId, but its events carry
 * only the person's name and the user list is for administrators, so the page does not offer it.
 */
export const HISTORY_KEYS = ['action', 'studyId', 'from', 'to', 'page', 'pageSize'] as const satisfies readonly (keyof AuditQuery)[];
export const HISTORY_PAGE_SIZE = 50;

export function historyFilterFrom(params: RawParams): HistoryFilter {
  return readQuery<AuditQuery>(AuditQuery.shape, HISTORY_KEYS, params);
}
