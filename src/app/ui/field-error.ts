import { Pipe, PipeTransform } from '@angular/core';
import { ValidationErrors } from '@angular/forms';

/** The words for one field's first error; a server or schema message wins over the built-in checks. */
export function fieldError(errors: ValidationErrors | null | undefined, label = 'This field'): string {
  if (!errors) return '';
  if (typeof errors['server'] === 'string') return errors['server'];
  if (typeof errors['rule'] === 'string') return errors['rule'];
  if (errors['required']) return `${label} is required.`;
  if (errors['email']) return 'Enter a valid e-mail address.';
  if (errors['minlength']) return `Use at least ${errors['minlength'].requiredLength} characters.`;
  if (errors['maxlength']) return `Use at most ${errors['maxlength'].requiredLength} characters.`;
  if (errors['min']) return `Use ${errors['min'].min} or more.`;
  if (errors['max']) return `Use ${errors['max'].max} or less.`;
  if (errors['mismatch']) return 'The two passwords are not the same.';
  if (errors['matDatepickerParse']) return 'Write a day as yyyy-mm-dd, such as 2026-11-30.';
  return `${label} is not valid.`;
}

/** `{{ form.controls.email.errors | fieldError: 'E-mail' }}` inside a mat-error. */
@Pipe({ name: 'fieldError' })
export class FieldErrorPipe implements PipeTransform {
  transform(errors: ValidationErrors | null | undefined, label?: string): string {
    return fieldError(errors, label);
  }
}
