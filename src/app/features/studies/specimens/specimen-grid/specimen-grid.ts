import {
  ChangeDetectionStrategy, Component, Injector, ViewEncapsulation, afterNextRender, computed, effect, inject, input, output, signal,
} from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatTooltipModule } from '@angular/material/tooltip';
import { AgGridAngular } from 'ag-grid-angular';
import type {
  CellEditRequestEvent, CellPosition, ColDef, GetRowIdParams, GridApi, GridReadyEvent, TabToNextCellParams,
} from 'ag-grid-community';
import { GRID_THEME } from '../grid-setup';
import type { PasteOutcome } from '../apply-paste';
import { firstDifference } from '../row-edits';
import { ColumnHeading, GridContext, SPECIMEN_ROW_CLASSES, specimenColumns } from '../specimen-columns';
import { GridRow } from '../specimen-layout';
import { SpecimensStore } from '../specimens-store';
import { GridCommand, SHORTCUTS, gridCommand } from './grid-keys';
import { enterAddsRow, tabTarget } from './grid-navigation';
import { repeatMarks } from './repeat-marks';

/**
 * The specimen rows as a spreadsheet-like grid. Typing edits a cell, Enter and Tab move on (Enter on the
 * last row adds a row; Tab at the end of a row goes on to the next row's first field); a block copied from
 * a spreadsheet is pasted at the focused cell (ag-grid's community edition has no paste of its own, so the
 * wrapper handles the `paste` event unless a cell editor is open). Ctrl+Z and Ctrl+Y step through the
 * store's history. The grid never writes into the rows itself (`readOnlyEdit`): every edit goes to the
 * store as a new list, which keeps the history's snapshots intact. Cells with a problem are marked by the
 * page's `problemAt`, repeated labels as soon as they are entered, excluded rows struck through.
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
  /** Header names and tooltips of the result columns (unit, method, instrument). */
  readonly headings = input<Record<string, ColumnHeading>>({});
  readonly pasted = output<PasteOutcome>();
  /** Rows were deleted: how many, and the rows as they were before (for Undo). */
  readonly deleted = output<{ count: number; before: GridRow[] }>();

  protected readonly store = inject(SpecimensStore);
  private readonly injector = inject(Injector);
  private api: GridApi<GridRow> | null = null;
  protected readonly theme = GRID_THEME;
  protected readonly shortcuts = SHORTCUTS;
  protected readonly selected = signal(0);
  protected readonly columns = computed(() => specimenColumns(this.store.layout, this.editable(), this.headings()));
  protected readonly defaultColDef: ColDef<GridRow> = { suppressKeyboardEvent: (p) => p.event.altKey, resizable: true };
  protected readonly rowClassRules = SPECIMEN_ROW_CLASSES;
  /** Rows whose label another included row carries, with the words of the mark. */
  private readonly repeats = computed(() => repeatMarks(this.store.rows()));
  protected readonly context: GridContext = {
    problemAt: (row, field) => this.problemAt()(row, field),
    repeatAt: (row) => this.repeats().get(row) ?? null,
  };
  protected readonly rowId = (p: GetRowIdParams<GridRow>): string => String(p.data.uid);

  /** Tab follows the fields row after row (never stopping on the row number or tick box); past the ends it leaves the grid. */
  protected readonly tabToNextCell = (p: TabToNextCellParams<GridRow>): CellPosition | boolean => {
    const from = p.previousCellPosition;
    const fields = this.store.layout.fields.map((f) => f.field);
    const to = tabTarget({ rowIndex: from.rowIndex, field: from.column.getColId() }, p.backwards, fields, this.store.rows().length);
    const column = to ? p.api.getColumn(to.field) : null;
    return to && column ? { rowIndex: to.rowIndex, column, rowPinned: null } : false;
  };

  constructor() {
    // Problems and repeated labels change with the rows and with the server's answer: re-mark the visible cells.
    effect(() => {
      this.problemAt();
      this.repeats();
      this.api?.refreshCells({ force: true });
    });
  }

  protected ready(event: GridReadyEvent<GridRow>): void {
    this.api = event.api;
  }

  /** An edit the grid asks for (typing, the tick box): the store makes it, as one step of the history. */
  protected cellChanged(event: CellEditRequestEvent<GridRow>): void {
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
    if (!this.editable()) return;
    if (event.key === 'Enter' && !event.altKey && !event.ctrlKey && !event.metaKey && !event.shiftKey) {
      this.enterPressed(event);
      return;
    }
    const command = gridCommand(event);
    if (!command) return;
    // While a cell editor is open, Ctrl+Z and Ctrl+Y belong to its text.
    if ((command === 'undo' || command === 'redo') && (this.api?.getEditingCells().length ?? 0) > 0) return;
    event.preventDefault();
    event.stopPropagation();
    this.run(command);
  }

  /**
   * Enter on a cell of the last row: once the grid has handed over the value just typed (its events come a
   * moment later), a row is added below a row that holds something, and the focus moves to the same column.
   */
  private enterPressed(event: KeyboardEvent): void {
    const focused = this.api?.getFocusedCell();
    // The path as dispatched: the grid may already have removed the cell's editor (the target) by now.
    const inCell = event.composedPath().some((node) => node instanceof Element && node.getAttribute('role') === 'gridcell');
    if (!focused || !inCell || focused.rowIndex !== this.store.rows().length - 1) return;
    const colId = focused.column.getColId();
    const rowIndex = focused.rowIndex;
    setTimeout(() => {
      if (!enterAddsRow(rowIndex, this.store.rows(), this.store.layout)) return;
      this.store.insertRow(rowIndex + 1);
      this.focus(rowIndex + 1, colId);
    });
  }

  /** Undo or redo one step, and put the focus on the first cell it changed. */
  private step(command: 'undo' | 'redo'): void {
    this.api?.stopEditing(true);
    const before = this.store.rows();
    const done = command === 'undo' ? this.store.undo() : this.store.redo();
    if (!done) return;
    const at = firstDifference(before, this.store.rows(), this.store.layout.fields.map((f) => f.field));
    if (at) this.focus(at.rowIndex, at.field);
  }

  protected run(command: GridCommand): void {
    if (command === 'undo' || command === 'redo') {
      this.step(command);
      return;
    }
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
