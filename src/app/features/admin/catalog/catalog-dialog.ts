import { Directive, inject, signal } from '@angular/core';
import { FormGroup } from '@angular/forms';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import type { ZodType } from 'zod';
import { ApiError } from '../../../core/http/api-error';
import { showApiError, showIssues } from '../../../core/http/form-errors';
import { schemaIssues } from '../../../ui/schema-rule';
import { CatalogStore } from './catalog-store';

/**
 * The create-or-edit dialog of a catalog entry. The body is checked with the API's own schema first,
 * so the fields show the server's words before anything is sent; the server's issues land the same way.
 */
@Directive()
export abstract class CatalogDialog<T extends { id: number }, B> {
  /** The entry being edited, or null for a new one (the dialog's data). */
  protected readonly item = inject<T | null>(MAT_DIALOG_DATA, { optional: true }) ?? null;
  private readonly dialog = inject<MatDialogRef<unknown, T>>(MatDialogRef);
  protected readonly problem = signal<string | null>(null);
  protected readonly busy = signal(false);

  protected abstract readonly store: CatalogStore<T, B>;
  protected abstract readonly schema: ZodType;
  protected abstract readonly form: FormGroup;
  /** The request body from the form's current values. */
  protected abstract body(): B;

  protected save(): void {
    this.problem.set(null);
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    const body = this.body();
    const issues = schemaIssues(this.schema, body);
    if (issues.length > 0) {
      this.problem.set(showIssues(this.form, 'Check the marked fields.', issues));
      return;
    }
    this.busy.set(true);
    const request = this.item ? this.store.update(this.item.id, body) : this.store.create(body);
    request.subscribe({
      next: (saved) => this.dialog.close(saved),
      error: (err: ApiError) => {
        this.busy.set(false);
        this.problem.set(showApiError(this.form, err));
      },
    });
  }
}
