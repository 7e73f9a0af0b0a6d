import { Injectable, inject } from '@angular/core';
import type { HistoryEvent } from '@shared/schemas';
import { HistoryApi, HistoryFilter } from '../history-api';
import { PagedSearch } from '../paged-search';

/** One page of the laboratory's history, newest first, as the server filters and pages it. */
@Injectable()
export class LabHistoryStore extends PagedSearch<HistoryFilter, HistoryEvent> {
  constructor() {
    const api = inject(HistoryApi);
    super((filter) => api.laboratory(filter));
  }
}
