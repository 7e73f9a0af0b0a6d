import { StudyListQuery } from '@shared/schemas';
import type { StudyQuery } from '../api/studies-api';

const KEYS = ['kind', 'analyteId', 'instrumentId', 'state', 'from', 'to', 'q', 'sort', 'order', 'page', 'pageSize'] as const;
export const DEFAULT_PAGE_SIZE = 25;

/**
 * The list query in the address bar, read with the API's own schema: a value the schema refuses is
 * dropped (as if absent), so a hand-edited address never breaks the page.
 */
export function queryFromParams(params: Record<string, string | undefined>): StudyQuery {
  const query: Record<string, unknown> = {};
  for (const key of KEYS) {
    const raw = params[key];
    if (raw === undefined || raw === '') continue;
    const field = StudyListQuery.shape[key];
    const parsed = field.safeParse(raw);
    if (parsed.success && parsed.data !== undefined) query[key] = parsed.data;
  }
  return query as StudyQuery;
}

/** The changed query as router query params: empty values become null (removed from the address). */
export function paramsFromQuery(query: StudyQuery): Record<string, string | null> {
  const out: Record<string, string | null> = {};
  for (const key of KEYS) {
    const value = query[key];
    out[key] = value === undefined || value === null || value === '' ? null : String(value);
  }
  return out;
}

/** A filter change: the other filters stay, and the list goes back to its first page. */
export function withFilter(query: StudyQuery, change: StudyQuery): StudyQuery {
  return { ...query, ...change, page: undefined };
}
