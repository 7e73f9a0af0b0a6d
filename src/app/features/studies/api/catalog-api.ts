import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, forkJoin } from 'rxjs';
import type { Analyte, Instrument } from '@shared/schemas';

export interface StudyCatalog {
  analytes: Analyte[];
  instruments: Instrument[];
}

/** The analyte and instrument catalog, as the study pages read it (every role may read it). */
@Injectable({ providedIn: 'root' })
export class StudyCatalogApi {
  private readonly http = inject(HttpClient);

  catalog(): Observable<StudyCatalog> {
    return forkJoin({
      analytes: this.http.get<Analyte[]>('/api/v1/analytes'),
      instruments: this.http.get<Instrument[]>('/api/v1/instruments'),
    });
  }
}
