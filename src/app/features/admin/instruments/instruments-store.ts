import { Injectable, inject } from '@angular/core';
import type { Instrument, InstrumentBody } from '@shared/schemas';
import { CatalogStore } from '../catalog/catalog-store';
import { InstrumentsApi } from './instruments-api';

@Injectable({ providedIn: 'root' })
export class InstrumentsStore extends CatalogStore<Instrument, InstrumentBody> {
  protected readonly api = inject(InstrumentsApi);
}
