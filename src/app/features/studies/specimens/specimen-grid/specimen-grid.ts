import {
  ChangeDetectionStrategy, Component, Injector, ViewEncapsulation, afterNextRender, computed, effect, inject, input, output, signal,
} from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatTooltipModule } from '@angular/material/tooltip';
import { AgGridAngular } from 'ag-grid-angular';
import type { CellValueChangedEvent, ColDef, GetRowIdParams, GridApi, GridReadyEvent } from 'ag-grid-community';
import { GRID_THEME } from '../grid-setup';
import type { PasteOutcome } from '../apply-paste';
import { GridContext, specimenColumns } from '../specimen-columns';
import { GridRow } from '../specimen-layout';
import { SpecimensStore } from '../specimens-store';
import { GridCommand, SHORTCUTS, gridCommand } from './grid-keys';

/**
 * The specimen rows as a spreadsheet-like grid. Typing edits a cell, Enter and Tab move on; a block
 * copied from a spreadsheet is pasted at the focused cell (ag-grid's community edition has no paste of
 * its own, so the wrapper handles the `paste` event unless a cell editor is open). Cells with a problem
 * are marked by the page's `problemAt`.
 */
@Component({
  selector: 'app-specimen-grid',
  templateUrl: './specimen-grid.html',
  styleUrl: './specimen-grid.scss',
  encapsulation: ViewEncapsulation.None,
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [AgGridAngular, MatButtonModule, MatIconModule, MatTooltipModule],
})
export class SpecimenGrid {
  readonly editable = input(true);
  /** The problem of a cell in words, or null (local checks and the server's answer). */
  readonly problemAt = input.required<(rowIndex: number, field: string) => string | null>();
  readonly pasted = output<PasteOutcome>();
  /** Rows were deleted: how many, and the rows as they were before (for Undo). */
  readonly deleted = output<{ count: number; before: GridRow[] }>();

  protected readonly store = inject(SpecimensStore);
  private readonly injector = inject(Injector);
  private api: GridApi<GridRow> | null = null;
  protected readonly theme = GRID_THEME;
  protected readonly shortcuts = SHORTCUTS;
  protected readonly selected = signal(0);
  protected readonly columns = computed(() => specimenColumns(this.store.layout, this.editable()));
  protected readonly defaultColDef: ColDef<GridRow> = { suppressKeyboardEvent: (p) => p.event.altKey, resizable: true };
  protected readonly context: GridContext = { problemAt: (row, field) => this.problemAt()(row, field) };
  protected readonly rowId = (p: GetRowIdParams<GridRow>): string => String(p.data.uid);

  constructor() {
    // Problems change with the rows and with the server's answer: re-mark the visible cells.
    effect(() => {
      this.problemAt();
      this.api?.refreshCells({ force: true });
    });
  }

  protected ready(event: GridReadyEvent<GridRow>): void {
    this.api = event.api;
  }

  protected cellChanged(event: CellValueChangedEvent<GridRow>): void {
    const field = event.colDef.field;
    if (!field || !event.data) return;
    const value = typeof event.newValue === 'boolean' ? event.newValue : String(event.newValue ?? '');
    this.store.setCell(event.data.uid, field, value);
  }

  protected selectionChanged(): void {
    this.selected.set(this.api?.getSelectedRows().length ?? 0);
  }

  /** A block pasted on the grid: written from the focused cell (or after the last row). */
  protected paste(event: ClipboardEvent): void {
    if (!this.editable() || !this.api || this.api.getEditingCells().length > 0) return;
    const text = event.clipboardData?.getData('text/plain') ?? '';
    if (text === '') return;
    event.preventDefault();
    const focused = this.api.getFocusedCell();
    const colId = focused?.column.getColId();
    const fields = this.store.layout.fields;
    const field = fields.some((f) => f.field === colId) ? (colId as string) : fields[0].field;
    const outcome = this.store.paste({ rowIndex: focused?.rowIndex ?? this.store.rows().length, field }, text);
    this.pasted.emit(outcome);
  }

  protected key(event: KeyboardEvent): void {
    const command = gridCommand(event);
    if (!command || !this.editable()) return;
    event.preventDefault();
    event.stopPropagation();
    this.run(command);
  }

  protected run(command: GridCommand): void {
    const focused = this.api?.getFocusedCell();
    const index = focused?.rowIndex ?? null;
    const colId = focused?.column.getColId() ?? this.store.layout.fields[0].field;
    const rows = this.store.rows();
    if (command === 'insert-row') {
      const at = index === null ? rows.length : index + 1;
      this.store.insertRow(at);
      this.focus(at, this.store.layout.fields[0].field);
    } else if (command === 'delete-rows') {
      const chosen = this.api?.getSelectedRows() ?? [];
      const doomed = chosen.length > 0 ? chosen : index !== null && rows[index] ? [rows[index]] : [];
      if (doomed.length === 0) return;
      this.store.deleteRows(new Set(doomed.map((r) => r.uid)));
      this.deleted.emit({ count: doomed.length, before: rows });
      this.selected.set(0);
    } else if (index !== null && rows[index]) {
      const delta = command === 'move-up' ? -1 : 1;
      this.store.moveRow(rows[index].uid, delta);
      this.focus(Math.min(Math.max(0, index + delta), rows.length - 1), colId);
    }
  }

  private focus(rowIndex: number, colId: string): void {
    afterNextRender(() => {
      this.api?.ensureIndexVisible(rowIndex);
      this.api?.setFocusedCell(rowIndex, colId);
    }, { injector: this.injector });
  }
}
