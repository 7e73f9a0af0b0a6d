import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import type { SpecimenRows, UploadPreview } from '@shared/schemas';
import { ApiError } from '../../../../core/http/api-error';
import { ErrorBanner } from '../../../../ui/error-banner';
import { PluralPipe } from '../../../../ui/plural';
import { SpecimensApi } from '../../api/specimens-api';
import type { SpecimenLayout } from '../specimen-layout';
import { defaultMode, importWarnings, labelCheckOf, mappableFields, mappingProblems, startingMapping } from './upload-mapping';

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
  imports: [MatDialogModule, MatButtonModule, MatFormFieldModule, MatSelectModule, MatRadioModule, MatIconModule, MatProgressBarModule, ErrorBanner, PluralPipe],
})
export class UploadDialog {
  protected readonly data = inject<UploadDialogData>(MAT_DIALOG_DATA);
  private readonly api = inject(SpecimensApi);
  private readonly dialog = inject<MatDialogRef<UploadDialog, SpecimenRows>>(MatDialogRef);
  protected readonly fields = mappableFields(this.data.layout);
  protected readonly preview = signal<UploadPreview | null>(null);
  protected readonly mapping = signal<Record<string, string>>({});
  /** The user's choice of replace or append, once made. */
  private readonly chosenMode = signal<'replace' | 'append' | null>(null);
  /** What the label column would repeat, per the server's check of the file. */
  protected readonly labelCheck = computed(() => {
    const preview = this.preview();
    return preview ? labelCheckOf(preview, this.mapping()) : null;
  });
  /**
   * Adding is the safe choice when the grid already holds rows, unless the file repeats most of the study's labels:
   * then it is most likely the same rows again, and replacing them is. Either is one click away.
   */
  protected readonly mode = computed(() => this.chosenMode() ?? defaultMode(this.data.rowCount, this.labelCheck()));
  protected readonly warnings = computed(() => {
    const preview = this.preview();
    return preview ? importWarnings(this.fields, preview, this.mapping()) : [];
  });
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
        this.chosenMode.set(null);
        this.mapping.set(startingMapping(this.fields, preview.suggestedMapping, preview.columns));
      },
      error: (err: ApiError) => {
        this.busy.set(false);
        this.problem.set(err.message);
      },
    });
    input.value = '';
  }

  protected chooseMode(mode: 'replace' | 'append'): void {
    this.chosenMode.set(mode);
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
