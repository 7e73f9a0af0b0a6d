import { ReleaseQuery } from '@shared/schemas';
import { RawParams, readQuery } from '../archive/query-params';

/** The releases search as a page holds it: every field optional, empty ones left out of the address. */
export type ReleaseFilter = Partial<ReleaseQuery>;

/** The search form's fields (the page keeps sort, order and paging itself). */
export const RELEASE_FILTER_KEYS = [
  'q', 'changeType', 'state', 'analyteId', 'instrumentId', 'signedFrom', 'signedTo',
] as const satisfies readonly (keyof ReleaseQuery)[];

/** Every key the address bar holds. */
export const RELEASE_KEYS = [...RELEASE_FILTER_KEYS, 'sort', 'order', 'page', 'pageSize'] as const satisfies readonly (keyof ReleaseQuery)[];

export const RELEASE_PAGE_SIZE = 25;

export function releaseFilterFrom(params: RawParams): ReleaseFilter {
  return readQuery<ReleaseQuery>(ReleaseQuery.shape, RELEASE_KEYS, params);
}

/** The export takes the same filters and order, every match rather than one page. */
export function exportFilter(filter: ReleaseFilter): ReleaseFilter {
  const { page: _page, pageSize: _size, ...rest } = filter;
  return rest;
}
