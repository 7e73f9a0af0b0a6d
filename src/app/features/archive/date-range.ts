import { AbstractControl, ValidationErrors, ValidatorFn } from '@angular/forms';

export const DATE_ORDER_ERROR = 'The first date is after the second.';

const errorKey = (fromKey: string) => `order:${fromKey}`;

/** A form-group check that one yyyy-mm-dd field is not after another (the error is named after the first field). */
export function datesInOrder(fromKey: string, toKey: string): ValidatorFn {
  return (group: AbstractControl): ValidationErrors | null => {
    const from = String(group.get(fromKey)?.value ?? '');
    const to = String(group.get(toKey)?.value ?? '');
    return from && to && from > to ? { [errorKey(fromKey)]: true } : null;
  };
}

/** True when the range that starts at `fromKey` runs backwards. */
export function rangeBackwards(group: AbstractControl, fromKey: string): boolean {
  return group.hasError(errorKey(fromKey));
}
