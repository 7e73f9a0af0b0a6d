import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { AmendBody, PlanApprovalBody, ReturnBody, SignBody, Signature, Study, SubmitBody } from '@shared/schemas';

/** Where a study's PDF is: the signed one's exact bytes, or a fresh preview marked DRAFT. */
export const reportUrl = (studyId: number): string => `/api/v1/studies/${studyId}/report.pdf`;

/** The sign-off routes of one study (relative URLs, so Angular adds the XSRF header). */
@Injectable({ providedIn: 'root' })
export class SignoffApi {
  private readonly http = inject(HttpClient);

  signatures(studyId: number): Observable<Signature[]> {
    return this.http.get<Signature[]>(`/api/v1/studies/${studyId}/signatures`);
  }

  /** Submits a draft for sign-off, with the technologist's note for the director (empty for none). */
  submit(studyId: number, body: SubmitBody): Observable<Study> {
    return this.http.post<Study>(`/api/v1/studies/${studyId}/submit`, body);
  }

  returnToDraft(studyId: number, body: ReturnBody): Observable<Study> {
    return this.http.post<Study>(`/api/v1/studies/${studyId}/return`, body);
  }

  sign(studyId: number, body: SignBody): Observable<Study> {
    return this.http.post<Study>(`/api/v1/studies/${studyId}/sign`, body);
  }

  approvePlan(studyId: number, body: PlanApprovalBody): Observable<Study> {
    return this.http.post<Study>(`/api/v1/studies/${studyId}/plan-approval`, body);
  }

  /** Answers the new draft that supersedes the signed study. */
  amend(studyId: number, body: AmendBody): Observable<Study> {
    return this.http.post<Study>(`/api/v1/studies/${studyId}/amend`, body);
  }
}
