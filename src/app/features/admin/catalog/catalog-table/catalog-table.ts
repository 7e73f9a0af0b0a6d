import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { ErrorBanner } from '../../../../ui/error-banner';
import { FilterField } from '../../../../ui/filter-field';
import { TableView } from '../../../../ui/table-view';

/** One column of a catalog table: its header, the text of a cell, and (optionally) what it sorts by. */
export interface CatalogColumn<T> {
  id: string;
  header: string;
  cell: (row: T) => string;
  sortValue?: (row: T) => string | number | null;
}

/** A catalog page's body: its heading, a filter, the add button, and a sortable table with an edit button per row. */
@Component({
  selector: 'app-catalog-table',
  templateUrl: './catalog-table.html',
  styleUrl: '../catalog-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatTableModule, MatSortModule, MatButtonModule, MatIconModule, MatProgressBarModule, ErrorBanner, FilterField],
})
export class CatalogTable<T extends { id: number; name: string }> {
  readonly heading = input.required<string>();
  /** What one entry is called, e.g. "analyte". */
  readonly noun = input.required<string>();
  readonly items = input.required<readonly T[]>();
  readonly columns = input.required<readonly CatalogColumn<T>[]>();
  readonly loading = input(false);
  readonly error = input<string | null>(null);
  readonly add = output<void>();
  readonly edit = output<T>();

  protected readonly addLabel = computed(() => `Add ${/^[aeiou]/i.test(this.noun()) ? 'an' : 'a'} ${this.noun()}`);
  protected readonly columnIds = computed(() => [...this.columns().map((c) => c.id), 'actions']);
  protected readonly view = new TableView<T>(
    this.items,
    (row) => this.columns().map((c) => c.cell(row)).join(' '),
    (row, id) => {
      const column = this.columns().find((c) => c.id === id);
      return column ? (column.sortValue ?? column.cell)(row) : null;
    },
  );
}
