import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import type { SpecimenRows, UploadPreview } from '../../../../../../shared/schemas';
import { ApiError } from '../../../../core/http/api-error';
import { ErrorBanner } from '../../../../ui/error-banner';
import { SpecimensApi } from '../../api/specimens-api';
import type { SpecimenLayout } from '../specimen-layout';
import { mappableFields, mappingProblems, startingMapping } from './upload-mapping';

export interface UploadDialogData {
  studyId: number;
  version: number;
  layout: SpecimenLayout;
  /** Rows with something in them now in the grid. */
  rowCount: number;
}

/** Import rows from a file: choose it, see its first rows, map its columns to fields, replace or append. */
@Component({
  selector: 'app-upload-dialog',
  templateUrl: './upload-dialog.html',
  styleUrl: './upload-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatDialogModule, MatButtonModule, MatFormFieldModule, MatSelectModule, MatRadioModule, MatIconModule, MatProgressBarModule, ErrorBanner],
})
export class UploadDialog {
  protected readonly data = inject<UploadDialogData>(MAT_DIALOG_DATA);
  private readonly api = inject(SpecimensApi);
  private readonly dialog = inject<MatDialogRef<UploadDialog, SpecimenRows>>(MatDialogRef);
  protected readonly fields = mappableFields(this.data.layout);
  protected readonly preview = signal<UploadPreview | null>(null);
  protected readonly mapping = signal<Record<string, string>>({});
  /** Adding is the safe choice when the grid already holds rows; replacing them is one click away. */
  protected readonly mode = signal<'replace' | 'append'>(this.data.rowCount > 0 ? 'append' : 'replace');
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly problems = computed(() => mappingProblems(this.fields, this.mapping()));

  protected choose(input: HTMLInputElement): void {
    const file = input.files?.[0];
    if (!file) return;
    this.busy.set(true);
    this.problem.set(null);
    this.api.upload(this.data.studyId, file).subscribe({
      next: (preview) => {
        this.busy.set(false);
        this.preview.set(preview);
        this.mapping.set(startingMapping(this.fields, preview.suggestedMapping, preview.columns));
      },
      error: (err: ApiError) => {
        this.busy.set(false);
        this.problem.set(err.message);
      },
    });
    input.value = '';
  }

  protected map(field: string, column: string): void {
    this.mapping.update((m) => {
      const next = { ...m };
      if (column) next[field] = column;
      else delete next[field];
      return next;
    });
  }

  protected import(): void {
    const preview = this.preview();
    if (!preview || this.problems().length > 0) return;
    this.busy.set(true);
    this.problem.set(null);
    const body = { version: this.data.version, mapping: this.mapping(), mode: this.mode() };
    this.api.import(this.data.studyId, preview.uploadId, body).subscribe({
      next: (rows) => this.dialog.close(rows),
      error: (err: ApiError) => {
        this.busy.set(false);
        const issues = err.issues.slice(0, 5).map((i) => i.message);
        const more = err.issues.length > 5 ? [`and ${err.issues.length - 5} more`] : [];
        this.problem.set([err.message, ...issues, ...more].join(' · '));
      },
    });
  }
}
