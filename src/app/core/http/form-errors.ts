import { AbstractControl, FormGroup } from '@angular/forms';
import type { ApiIssue } from '@shared/schemas';
import { ApiError } from './api-error';

/** Finds the control an issue path names: 'email', 'roles', 'decisionLevels.2' (falls back to 'decisionLevels'). */
function controlFor(form: FormGroup, path: string): AbstractControl | null {
  const parts = path.split('.').filter((part) => part !== '');
  while (parts.length > 0) {
    const control = form.get(parts);
    if (control) return control;
    parts.pop();
  }
  return null;
}

/**
 * Puts each issue's message on its form control as the `server` error, so the field shows it.
 * Returns the text for the page's banner: the error itself plus issues that match no field.
 */
export function showIssues(form: FormGroup, message: string, issues: readonly ApiIssue[]): string {
  const unmatched: string[] = [];
  for (const issue of issues) {
    const control = controlFor(form, issue.path);
    if (control) {
      control.setErrors({ ...control.errors, server: issue.message });
      control.markAsTouched();
    } else {
      unmatched.push(issue.message);
    }
  }
  return [message, ...unmatched].join(' ');
}

/** showIssues() for an ApiError as the HTTP layer delivers it. */
export function showApiError(form: FormGroup, error: ApiError): string {
  return showIssues(form, error.message, error.issues);
}
