import type { Signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import type { AbstractControl } from '@angular/forms';
import { startWith, switchMap } from 'rxjs';
import type { SetupGroup } from '../../../setup/setup-form-group';

/**
 * A Setup control's value as a signal that follows the form as the user types (call in an injection context). It is
 * undefined until the form input has come in.
 */
export function settingSignal<T>(form: Signal<SetupGroup>, pick: (f: SetupGroup) => AbstractControl<T>): Signal<T | undefined> {
  return toSignal(toObservable(form).pipe(switchMap((f) => pick(f).valueChanges.pipe(startWith(pick(f).value)))));
}
