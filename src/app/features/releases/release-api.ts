import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type {
  ChangeType, CreateReleaseBody, DueItem, HistoryEvent, DueQuery, LinkStudyBody, Release, ReleaseIntegrityReport, ReleasePage, ReleaseQuery,
  ReleaseSignBody, ReleaseTemplate, StartFromDueBody, UpdateDueBody, UpdateReleaseBody, UpdateTemplateBody, WaiverBody,
} from '@shared/schemas';

/** Where a release's records are read and changed (relative URLs, so Angular adds the XSRF header to the writes). */
export const releaseUrl = (id: number, rest = ''): string => `/api/v1/releases/${id}${rest}`;

const params = (query: object): HttpParams => {
  let p = new HttpParams();
  for (const [k, v] of Object.entries(query)) if (v !== undefined && v !== null && v !== '') p = p.set(k, String(v));
  return p;
};

/** Releases (one change to a method, its requirements, waivers and the director's signature), templates and due items. */
@Injectable({ providedIn: 'root' })
export class ReleaseApi {
  private readonly http = inject(HttpClient);

  list(query: Partial<ReleaseQuery> = {}): Observable<ReleasePage> {
    return this.http.get<ReleasePage>('/api/v1/releases', { params: params(query) });
  }

  /** The export of the releases a search finds (a workbook), for the director and the quality officer. */
  exportUrl(query: Partial<ReleaseQuery> = {}): string {
    const p = params(query).toString();
    return `/api/v1/releases/export.xlsx${p ? `?${p}` : ''}`;
  }

  get(id: number): Observable<Release> {
    return this.http.get<Release>(releaseUrl(id));
  }

  create(body: CreateReleaseBody): Observable<Release> {
    return this.http.post<Release>('/api/v1/releases', body);
  }

  update(id: number, body: UpdateReleaseBody): Observable<Release> {
    return this.http.patch<Release>(releaseUrl(id), body);
  }

  /** Link an existing study to a requirement, or start a new draft study for it (pre-filled from the release). */
  link(id: number, body: LinkStudyBody): Observable<Release> {
    return this.http.post<Release>(releaseUrl(id, '/studies'), body);
  }

  unlink(id: number, studyId: number): Observable<Release> {
    return this.http.delete<Release>(releaseUrl(id, `/studies/${studyId}`));
  }

  waive(id: number, body: WaiverBody): Observable<Release> {
    return this.http.post<Release>(releaseUrl(id, '/waivers'), body);
  }

  sign(id: number, body: ReleaseSignBody): Observable<Release> {
    return this.http.post<Release>(releaseUrl(id, '/sign'), body);
  }

  /** The signed PDF (stored at signing), or a DRAFT preview before. */
  pdfUrl(id: number): string {
    return releaseUrl(id, '/report.pdf');
  }

  checkIntegrity(id: number): Observable<ReleaseIntegrityReport> {
    return this.http.post<ReleaseIntegrityReport>(releaseUrl(id, '/integrity-check'), {});
  }

  /** The release's own history (created, linked, waived, signed, needs review), oldest first. */
  history(id: number): Observable<HistoryEvent[]> {
    return this.http.get<HistoryEvent[]>(releaseUrl(id, '/history'));
  }

  templates(): Observable<ReleaseTemplate[]> {
    return this.http.get<ReleaseTemplate[]>('/api/v1/release-templates');
  }

  saveTemplate(changeType: ChangeType, body: UpdateTemplateBody): Observable<ReleaseTemplate> {
    return this.http.put<ReleaseTemplate>(`/api/v1/release-templates/${changeType}`, body);
  }

  due(query: Partial<DueQuery> = {}): Observable<DueItem[]> {
    return this.http.get<DueItem[]>('/api/v1/due', { params: params(query) });
  }

  /** A director moves a due date, with the reason. */
  updateDue(id: number, body: UpdateDueBody): Observable<DueItem> {
    return this.http.patch<DueItem>(`/api/v1/due/${id}`, body);
  }

  /** Starts a draft study from a due item (linked to it); the answer names the study started. */
  startStudy(id: number, body: StartFromDueBody): Observable<DueItem> {
    return this.http.post<DueItem>(`/api/v1/due/${id}/start`, body);
  }
}
