import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, untracked } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { kindMeta } from '@shared/kinds/kinds';
import { ErrorBanner } from '../../../../ui/error-banner';
import { kindView } from '../../kinds';
import { StudyStore } from '../../study/study-store';
import type { PasteOutcome } from '../apply-paste';
import { RowRules, allProblems } from '../row-validation';
import { SaveState } from '../save-state/save-state';
import { resultHeadings } from '../specimen-columns';
import { GridRow, isBlank } from '../specimen-layout';
import { SpecimenGrid } from '../specimen-grid/specimen-grid';
import { SpecimensStore } from '../specimens-store';
import { UploadDialog, UploadDialogData } from '../upload-dialog/upload-dialog';
import { pasteSummary, problemSummary } from './specimens-text';

/** The Specimens tab: the rows of the study in a grid, saved by themselves, with their problems in words. */
@Component({
  selector: 'app-specimens-tab',
  templateUrl: './specimens-tab.html',
  styleUrl: './specimens-tab.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, ErrorBanner, SaveState, SpecimenGrid],
})
export class SpecimensTab {
  protected readonly study = inject(StudyStore);
  protected readonly store = inject(SpecimensStore);
  private readonly dialogs = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly editable = this.study.editable;

  /** The analyte's sign rule, the decimal mark the rows are written with (the study's) and the kind's fields, as the server reads them. */
  private readonly rules = computed((): RowRules => {
    const study = this.study.study();
    return { canBeNegative: study?.canBeNegative ?? true, decimalMark: this.store.decimalMark(), ...(study ? { fields: kindMeta(study.kind).rowFields } : {}) };
  });
  protected readonly problems = computed(() => allProblems(this.store.rows(), this.store.layout, this.rules()));
  protected readonly summary = computed(() => problemSummary(this.problems()));
  /** The result columns' headers: method and unit, with the instrument on hover. */
  protected readonly headings = computed(() => resultHeadings(this.study.study()));
  /** Rows with anything entered (an empty row is not saved). */
  protected readonly counted = computed(() => this.store.rows().filter((row) => !isBlank(row, this.store.layout)).length);
  /** Local checks first; a cell the server refused, and no local check explains, shows the server's words. */
  protected readonly problemAt = computed(() => {
    const marks = new Map<string, string>();
    for (const issue of this.store.issues()) if (issue.rowIndex !== null && issue.field) marks.set(`${issue.rowIndex}:${issue.field}`, issue.message);
    for (const p of this.problems()) marks.set(`${p.rowIndex}:${p.field}`, p.text);
    return (rowIndex: number, field: string): string | null => marks.get(`${rowIndex}:${field}`) ?? null;
  });

  constructor() {
    effect(() => {
      const study = this.study.study();
      if (study) untracked(() => this.store.ensureLoaded(study.id, kindView(study.kind).layout));
    });
    const warn = (event: BeforeUnloadEvent): void => {
      if (this.store.dirty()) event.preventDefault();
    };
    window.addEventListener('beforeunload', warn);
    inject(DestroyRef).onDestroy(() => window.removeEventListener('beforeunload', warn));
  }

  protected pasted(outcome: PasteOutcome): void {
    this.snackBar.open(pasteSummary(outcome), 'Close', { duration: 5000 });
  }

  protected deleted(change: { count: number; before: GridRow[] }): void {
    const ref = this.snackBar.open(`${change.count === 1 ? 'One row' : `${change.count} rows`} deleted.`, 'Undo', { duration: 8000 });
    ref.onAction().subscribe(() => this.store.undoDeletion(change.before));
  }

  protected reload(): void {
    const id = this.study.study()?.id;
    if (id !== undefined) this.store.load(id, this.store.layout).subscribe({ error: () => undefined });
  }

  protected upload(): void {
    const study = this.study.study();
    if (!study) return;
    const data: UploadDialogData = { studyId: study.id, version: this.store.version(), layout: this.store.layout, rowCount: this.counted() };
    this.dialogs
      .open(UploadDialog, { data, width: '880px', maxWidth: '95vw' })
      .afterClosed()
      .subscribe((answer) => answer && this.store.imported(answer));
  }
}
