import { Directive, OnInit, Type, inject } from '@angular/core';
import { MatDialog } from '@angular/material/dialog';
import { filter } from 'rxjs';
import { Notices } from '../../../core/notify/notices';
import { CatalogColumn } from './catalog-table/catalog-table';
import { CatalogStore } from './catalog-store';

/** The behaviour of a catalog page: load the list, open the dialog to add or edit, say what was saved. */
@Directive()
export abstract class CatalogPage<T extends { id: number; name: string }, B> implements OnInit {
  private readonly dialogs = inject(MatDialog);
  private readonly notices = inject(Notices);

  abstract readonly store: CatalogStore<T, B>;
  protected abstract readonly dialog: Type<unknown>;
  protected abstract readonly columns: readonly CatalogColumn<T>[];

  ngOnInit(): void {
    this.store.load();
  }

  protected add(): void {
    this.open(null);
  }

  protected edit(item: T): void {
    this.open(item);
  }

  private open(item: T | null): void {
    this.dialogs
      .open<unknown, T | null, T>(this.dialog, { data: item, width: '640px', maxWidth: '95vw' })
      .afterClosed()
      .pipe(filter((saved): saved is T => !!saved))
      .subscribe((saved) => this.notices.post(`${saved.name} is saved.`));
  }
}
