import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { StudyPlan } from '@shared/schemas';

/** A method comparison's plan by simulation: read it (GET /studies/:id/plan), run it (POST /studies/:id/plan-runs). */
@Injectable({ providedIn: 'root' })
export class PlanApi {
  private readonly http = inject(HttpClient);

  get(studyId: number): Observable<StudyPlan> {
    return this.http.get<StudyPlan>(`/api/v1/studies/${studyId}/plan`);
  }

  run(studyId: number): Observable<StudyPlan> {
    return this.http.post<StudyPlan>(`/api/v1/studies/${studyId}/plan-runs`, {});
  }
}
