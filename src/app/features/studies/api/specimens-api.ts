import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { ImportBody, SpecimenRows, UploadPreview } from '@shared/schemas';

/** What PUT /specimens takes: the whole list of rows, with the version they were edited from. */
export interface PutSpecimens {
  version: number;
  rows: Record<string, unknown>[];
}

/** The specimen-row and upload routes of one study. */
@Injectable({ providedIn: 'root' })
export class SpecimensApi {
  private readonly http = inject(HttpClient);

  get(studyId: number): Observable<SpecimenRows> {
    return this.http.get<SpecimenRows>(`/api/v1/studies/${studyId}/specimens`);
  }

  put(studyId: number, body: PutSpecimens): Observable<SpecimenRows> {
    return this.http.put<SpecimenRows>(`/api/v1/studies/${studyId}/specimens`, body);
  }

  upload(studyId: number, file: File): Observable<UploadPreview> {
    const form = new FormData();
    form.append('file', file, file.name);
    return this.http.post<UploadPreview>(`/api/v1/studies/${studyId}/uploads`, form);
  }

  import(studyId: number, uploadId: number, body: ImportBody): Observable<SpecimenRows> {
    return this.http.post<SpecimenRows>(`/api/v1/studies/${studyId}/uploads/${uploadId}/import`, body);
  }
}
