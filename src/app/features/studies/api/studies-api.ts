import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type {
  CreateStudyBody, Study, StudyListQuery, StudyPage, UpdateStudyBody, Worklist,
} from '@shared/schemas';

/** A list query as the page holds it: every field optional, empty ones left out of the URL. */
export type StudyQuery = Partial<StudyListQuery>;

/** The study routes of /api/v1 (relative URLs, so Angular adds the XSRF header). */
@Injectable({ providedIn: 'root' })
export class StudiesApi {
  private readonly http = inject(HttpClient);

  worklist(): Observable<Worklist> {
    return this.http.get<Worklist>('/api/v1/worklist');
  }

  list(query: StudyQuery): Observable<StudyPage> {
    let params = new HttpParams();
    for (const [key, value] of Object.entries(query)) {
      if (value !== undefined && value !== null && value !== '') params = params.set(key, String(value));
    }
    return this.http.get<StudyPage>('/api/v1/studies', { params });
  }

  get(id: number): Observable<Study> {
    return this.http.get<Study>(`/api/v1/studies/${id}`);
  }

  create(body: CreateStudyBody): Observable<Study> {
    return this.http.post<Study>('/api/v1/studies', body);
  }

  update(id: number, body: UpdateStudyBody): Observable<Study> {
    return this.http.patch<Study>(`/api/v1/studies/${id}`, body);
  }
}
