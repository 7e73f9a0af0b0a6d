import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { LaboratorySettings } from '@shared/schemas';

/** The laboratory's rules as the server keeps them, with its name. */
export type Laboratory = LaboratorySettings & { name: string };

/** GET and PUT /api/v1/laboratory (saving is for administrators). */
@Injectable({ providedIn: 'root' })
export class LaboratoryApi {
  private readonly http = inject(HttpClient);

  get(): Observable<Laboratory> {
    return this.http.get<Laboratory>('/api/v1/laboratory');
  }

  save(body: LaboratorySettings): Observable<Laboratory> {
    return this.http.put<Laboratory>('/api/v1/laboratory', body);
  }
}
