import { Injectable, inject } from '@angular/core';
import type { ArchiveItem } from '@shared/schemas';
import { ArchiveApi } from './archive-api';
import { ArchiveFilter } from './archive-query';
import { PagedSearch } from './paged-search';

/** One page of the archive as the server filters, sorts and pages it. */
@Injectable()
export class ArchiveStore extends PagedSearch<ArchiveFilter, ArchiveItem> {
  constructor() {
    const api = inject(ArchiveApi);
    super((filter) => api.search(filter));
  }
}
