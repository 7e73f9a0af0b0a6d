import { AbstractControl, FormControl, FormGroup, ValidatorFn, Validators } from '@angular/forms';
import { NewPassword } from '@shared/schemas/common.schema';
import { schemaRule } from '../schema-rule';

export type NewPasswordGroup = FormGroup<{ password: FormControl<string>; repeat: FormControl<string> }>;

/** Marks `repeat` with `mismatch` while it differs from `password` (and clears only that mark). */
const repeatMatches: ValidatorFn = (group: AbstractControl) => {
  const password = group.get('password')?.value as string;
  const repeat = group.get('repeat');
  if (!repeat) return null;
  const { mismatch: _old, ...others } = repeat.errors ?? {};
  const differs = repeat.value !== '' && repeat.value !== password;
  const errors = differs ? { ...others, mismatch: true } : others;
  repeat.setErrors(Object.keys(errors).length > 0 ? errors : null);
  return null;
};

/** A new password (the server's own rules) and its repetition. */
export function newPasswordGroup(): NewPasswordGroup {
  return new FormGroup(
    {
      password: new FormControl('', { nonNullable: true, validators: [Validators.required, schemaRule(NewPassword)] }),
      repeat: new FormControl('', { nonNullable: true, validators: [Validators.required] }),
    },
    { validators: repeatMatches },
  );
}
