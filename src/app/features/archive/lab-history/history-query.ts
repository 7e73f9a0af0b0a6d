import { AuditQuery } from '@shared/schemas';
import type { HistoryFilter } from '../history-api';
import { RawParams, readQuery } from '../query-params';

/** The laboratory history's keys in the address bar (people are chosen from GET /api/v1/people). */
export const HISTORY_KEYS = ['userId', 'action', 'studyId', 'from', 'to', 'page', 'pageSize'] as const satisfies readonly (keyof AuditQuery)[];
export const HISTORY_PAGE_SIZE = 50;

export function historyFilterFrom(params: RawParams): HistoryFilter {
  return readQuery<AuditQuery>(AuditQuery.shape, HISTORY_KEYS, params);
}
