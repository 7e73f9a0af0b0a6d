import { Injectable, inject } from '@angular/core';
import type { ReleaseSummary } from '@shared/schemas';
import { PagedSearch } from '../../archive/paged-search';
import { ReleaseApi } from '../release-api';
import { ReleaseFilter } from '../release-query';

/** One page of the releases as the server filters, sorts and pages them. */
@Injectable()
export class ReleaseListStore extends PagedSearch<ReleaseFilter, ReleaseSummary> {
  constructor() {
    const api = inject(ReleaseApi);
    super((filter) => api.list(filter));
  }
}
