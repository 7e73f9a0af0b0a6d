import { Injectable, inject } from '@angular/core';
import type { Analyte, AnalyteBody } from '@shared/schemas';
import { CatalogStore } from '../catalog/catalog-store';
import { AnalytesApi } from './analytes-api';

@Injectable({ providedIn: 'root' })
export class AnalytesStore extends CatalogStore<Analyte, AnalyteBody> {
  protected readonly api = inject(AnalytesApi);
}
