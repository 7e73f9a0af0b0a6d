import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { Analysis } from '@shared/schemas';

/** Queue an analysis of a study, and read one analysis (its state, progress and results). */
@Injectable({ providedIn: 'root' })
export class AnalysesApi {
  private readonly http = inject(HttpClient);

  run(studyId: number): Observable<Analysis> {
    return this.http.post<Analysis>(`/api/v1/studies/${studyId}/analyses`, {});
  }

  get(analysisId: number): Observable<Analysis> {
    return this.http.get<Analysis>(`/api/v1/analyses/${analysisId}`);
  }
}
