import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { AuditQuery, ChainCheckReport, HistoryEvent, HistoryPage } from '@shared/schemas';
import { studyUrl } from './archive-api';
import { httpParams } from './query-params';

/** The history filters as a page holds them: every field optional. */
export type HistoryFilter = Partial<AuditQuery>;

/** The history routes: one study's events, or the laboratory's, in words already. */
@Injectable({ providedIn: 'root' })
export class HistoryApi {
  private readonly http = inject(HttpClient);

  study(id: number): Observable<HistoryEvent[]> {
    return this.http.get<HistoryEvent[]>(studyUrl(id, '/history'));
  }

  laboratory(filter: HistoryFilter): Observable<HistoryPage> {
    return this.http.get<HistoryPage>('/api/v1/audit', { params: httpParams(filter) });
  }

  /** Re-checks the laboratory's history chain and the chain of events with no laboratory (recorded; changes nothing). */
  checkChains(): Observable<ChainCheckReport> {
    return this.http.post<ChainCheckReport>('/api/v1/audit/chain-check', {});
  }
}
