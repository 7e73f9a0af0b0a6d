import { Injectable } from '@angular/core';
import type { Instrument, InstrumentBody } from '@shared/schemas';
import { CatalogApi } from '../catalog/catalog-api';

@Injectable({ providedIn: 'root' })
export class InstrumentsApi extends CatalogApi<Instrument, InstrumentBody> {
  protected readonly path = '/api/v1/instruments';
}
