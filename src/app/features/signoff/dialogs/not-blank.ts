import { AbstractControl, ValidationErrors } from '@angular/forms';

/** Required, and more than spaces: a comment or reason of blanks says nothing. */
export function notBlank(control: AbstractControl<string>): ValidationErrors | null {
  return (control.value ?? '').trim() === '' ? { required: true } : null;
}
