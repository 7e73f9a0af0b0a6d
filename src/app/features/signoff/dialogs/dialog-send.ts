import { signal } from '@angular/core';
import { FormGroup } from '@angular/forms';
import { MatDialogRef } from '@angular/material/dialog';
import { Observable } from 'rxjs';
import { ApiError } from '../../../core/http/api-error';
import { showApiError } from '../../../core/http/form-errors';

/**
 * The sending part of a sign-off dialog: checks the form, sends once, closes with the server's answer,
 * or puts each refusal on its field (the password) and the rest in words above the form.
 */
export class DialogSend<T> {
  readonly busy = signal(false);
  readonly problem = signal<string | null>(null);

  constructor(private readonly dialog: MatDialogRef<unknown, T>) {}

  /** Sends `request()` when the form is valid; returns false when it was not sent. */
  send(form: FormGroup, request: () => Observable<T>): boolean {
    this.problem.set(null);
    form.markAllAsTouched();
    if (form.invalid || this.busy()) return false;
    this.busy.set(true);
    request().subscribe({
      next: (answer) => {
        this.busy.set(false);
        this.dialog.close(answer);
      },
      error: (err: ApiError) => {
        this.busy.set(false);
        this.problem.set(showApiError(form, err));
      },
    });
    return true;
  }
}
