import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import type { Analyte, AnalyteBody } from '@shared/schemas';
import { CatalogPage } from '../../catalog/catalog-page';
import { CatalogColumn, CatalogTable } from '../../catalog/catalog-table/catalog-table';
import { AnalyteDialog } from '../analyte-dialog/analyte-dialog';
import { allowableBiasText } from '../analyte-text';
import { AnalytesStore } from '../analytes-store';
import { formatDecisionLevels } from '../decision-levels';

const COLUMNS: readonly CatalogColumn<Analyte>[] = [
  { id: 'name', header: 'Name', cell: (a) => a.name },
  { id: 'unit', header: 'Unit', cell: (a) => a.unit },
  { id: 'decimals', header: 'Decimals', cell: (a) => String(a.decimals), sortValue: (a) => a.decimals },
  { id: 'levels', header: 'Decision levels', cell: (a) => formatDecisionLevels(a.decisionLevels) || '—', sortValue: (a) => a.decisionLevels[0] ?? null },
  { id: 'bias', header: 'Allowable bias', cell: allowableBiasText, sortValue: (a) => a.allowableBiasPercent ?? a.allowableBiasAbsolute },
  { id: 'source', header: 'Source of the goal', cell: (a) => a.allowableBiasSource },
  { id: 'active', header: 'In use', cell: (a) => (a.active ? 'Yes' : 'No') },
];

/** Admin › Analytes: the catalog every study picks its analyte from. */
@Component({
  selector: 'app-analyte-list',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [CatalogTable],
  template: `
    <app-catalog-table class="page" heading="Analytes" noun="analyte" [items]="store.items()" [columns]="columns"
      [loading]="store.loading()" [error]="store.error()" (add)="add()" (edit)="edit($event)" />
  `,
})
export class AnalyteList extends CatalogPage<Analyte, AnalyteBody> {
  readonly store = inject(AnalytesStore);
  protected readonly dialog = AnalyteDialog;
  protected readonly columns = COLUMNS;
}
