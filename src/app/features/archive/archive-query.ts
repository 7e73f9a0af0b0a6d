import { ArchiveQuery } from '@shared/schemas';
import { RawParams, httpParams, readQuery } from './query-params';

/** The archive search as a page holds it: every field optional, empty ones left out of the address. */
export type ArchiveFilter = Partial<ArchiveQuery>;

/** The archive's keys in the address bar (signers are chosen from GET /api/v1/people). */
export const ARCHIVE_KEYS = [
  'kind', 'analyteId', 'instrumentId', 'state', 'verdict', 'signerId', 'signedFrom', 'signedTo', 'createdFrom', 'createdTo', 'q',
  'sort', 'order', 'page', 'pageSize',
] as const satisfies readonly (keyof ArchiveQuery)[];

export const ARCHIVE_PAGE_SIZE = 25;
export const ARCHIVE_URL = '/api/v1/archive';

export function archiveFilterFrom(params: RawParams): ArchiveFilter {
  return readQuery<ArchiveQuery>(ArchiveQuery.shape, ARCHIVE_KEYS, params);
}

/** The list download: the same filters and order, every match rather than one page. */
export function archiveExportUrl(filter: ArchiveFilter): string {
  const { page: _page, pageSize: _size, ...rest } = filter;
  const params = httpParams(rest).toString();
  return `${ARCHIVE_URL}/export.xlsx${params ? `?${params}` : ''}`;
}
