import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type {
  Analyte, ArchivePage, Instrument, IntegrityReport, ReproduceReport, Signature, Study, Person,
} from '@shared/schemas';
import { ARCHIVE_URL, ArchiveFilter } from './archive-query';
import { httpParams } from './query-params';

/** Where a study's records are read (relative URLs, so Angular adds the XSRF header to the POSTs). */
export const studyUrl = (id: number, rest = ''): string => `/api/v1/studies/${id}${rest}`;

/** The archive search and a study's audit record: everything here reads; the two POSTs only re-check. */
@Injectable({ providedIn: 'root' })
export class ArchiveApi {
  private readonly http = inject(HttpClient);

  search(filter: ArchiveFilter): Observable<ArchivePage> {
    return this.http.get<ArchivePage>(ARCHIVE_URL, { params: httpParams(filter) });
  }

  analytes(): Observable<Analyte[]> {
    return this.http.get<Analyte[]>('/api/v1/analytes');
  }

  instruments(): Observable<Instrument[]> {
    return this.http.get<Instrument[]>('/api/v1/instruments');
  }

  /** The laboratory's people by name, for the signer and user filters. */
  people(): Observable<Person[]> {
    return this.http.get<Person[]>('/api/v1/people');
  }

  study(id: number): Observable<Study> {
    return this.http.get<Study>(studyUrl(id));
  }

  signatures(id: number): Observable<Signature[]> {
    return this.http.get<Signature[]>(studyUrl(id, '/signatures'));
  }

  checkIntegrity(id: number): Observable<IntegrityReport> {
    return this.http.post<IntegrityReport>(studyUrl(id, '/integrity-check'), {});
  }

  reproduce(id: number): Observable<ReproduceReport> {
    return this.http.post<ReproduceReport>(studyUrl(id, '/reproduce'), {});
  }
}
