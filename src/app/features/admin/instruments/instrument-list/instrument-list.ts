import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import type { Instrument, InstrumentBody } from '@shared/schemas';
import { CatalogPage } from '../../catalog/catalog-page';
import { CatalogColumn, CatalogTable } from '../../catalog/catalog-table/catalog-table';
import { InstrumentDialog } from '../instrument-dialog/instrument-dialog';
import { InstrumentsStore } from '../instruments-store';

const COLUMNS: readonly CatalogColumn<Instrument>[] = [
  { id: 'name', header: 'Name', cell: (i) => i.name },
  { id: 'model', header: 'Make and model', cell: (i) => i.model || '—' },
  { id: 'serial', header: 'Serial number', cell: (i) => i.serial || '—' },
  { id: 'location', header: 'Location', cell: (i) => i.location || '—' },
  { id: 'active', header: 'In use', cell: (i) => (i.active ? 'Yes' : 'No') },
];

/** Admin › Instruments: the analysers a study compares. */
@Component({
  selector: 'app-instrument-list',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [CatalogTable],
  template: `
    <app-catalog-table class="page" heading="Instruments" noun="instrument" [items]="store.items()" [columns]="columns"
      [loading]="store.loading()" [error]="store.error()" (add)="add()" (edit)="edit($event)" />
  `,
})
export class InstrumentList extends CatalogPage<Instrument, InstrumentBody> {
  readonly store = inject(InstrumentsStore);
  protected readonly dialog = InstrumentDialog;
  protected readonly columns = COLUMNS;
}
