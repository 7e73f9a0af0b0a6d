import { Injectable } from '@angular/core';
import type { Analyte, AnalyteBody } from '@shared/schemas';
import { CatalogApi } from '../catalog/catalog-api';

@Injectable({ providedIn: 'root' })
export class AnalytesApi extends CatalogApi<Analyte, AnalyteBody> {
  protected readonly path = '/api/v1/analytes';
}
