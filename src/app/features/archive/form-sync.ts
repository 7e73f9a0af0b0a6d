import { effect } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormGroup } from '@angular/forms';
import { debounceTime, filter, map } from 'rxjs';

/** A search form's fields, every one held as text (empty = not searched). */
export type TextFields = Record<string, string>;

/** The search in force as the form's text fields. */
export function fieldsOf<V extends TextFields>(blank: V, current: object): V {
  const source = current as Record<string, unknown>;
  const out: TextFields = {};
  for (const key of Object.keys(blank)) out[key] = source[key] === undefined || source[key] === null ? '' : String(source[key]);
  return out as V;
}

/** The form's text fields as search values: blank ones left out, the named ones as numbers. */
export function searchOf<F>(value: Partial<TextFields>, numeric: readonly string[] = []): F {
  const out: Record<string, string | number> = {};
  for (const [key, raw] of Object.entries(value)) {
    const text = String(raw ?? '').trim();
    if (text) out[key] = numeric.includes(key) ? Number(text) : text;
  }
  return out as F;
}

/**
 * Keeps a search form and the address in step (call in a constructor): the form shows the search in
 * force (unless it already means it), and a valid edit, after a short pause, is handed to `changed`.
 */
export function syncForm<V extends TextFields, F>(
  form: FormGroup, blank: V, current: () => object, changed: (search: F) => void, numeric: readonly string[] = [],
): void {
  effect(() => {
    const wanted = fieldsOf(blank, current());
    // Leave the form alone when it already means this search (e.g. "lot " while the address says "lot").
    const shown = fieldsOf(blank, searchOf<object>(form.getRawValue(), numeric));
    if (JSON.stringify(wanted) !== JSON.stringify(shown)) form.setValue(wanted, { emitEvent: false });
  });
  form.valueChanges
    .pipe(debounceTime(350), filter(() => form.valid), map((value: Partial<TextFields>) => searchOf<F>(value, numeric)), takeUntilDestroyed())
    .subscribe(changed);
}
