import { AbstractControl, FormControl, FormGroup, ValidationErrors, ValidatorFn, Validators } from '@angular/forms';
import type { StudyKind } from '../../../../../shared/schemas';
import { CreateStudyBody, StudySettings } from '../../../../../shared/schemas';
import { parseDecisionLevels } from '../../admin/analytes/decision-levels';
import { schemaRule } from '../../../ui/schema-rule';
import { SettingsValues, SetupValues } from './setup-model';

type Controls<T> = { [K in keyof T]: FormControl<T[K]> };
export type SettingsGroup = FormGroup<Controls<SettingsValues>>;
export type SetupGroup = FormGroup<{
  kind: FormControl<StudyKind>;
  title: FormControl<string>;
  purpose: FormControl<string>;
  analyteId: FormControl<number | null>;
  comparativeInstrumentId: FormControl<number | null>;
  candidateInstrumentId: FormControl<number | null>;
  instrumentId: FormControl<number | null>;
  settings: SettingsGroup;
  reason: FormControl<string>;
}>;

const levels: ValidatorFn = (control) =>
  parseDecisionLevels(control.value ?? '') === null ? { rule: 'Write numbers separated by commas, with a point for decimals, e.g. 2.8, 7.0' } : null;

/** "To" may not come before "from" (ISO dates compare as text). */
const runOrder: ValidatorFn = (group: AbstractControl): ValidationErrors | null => {
  const from = group.get('runsFrom')?.value as string | null;
  const to = group.get('runsTo');
  if (!to) return null;
  const wrong = !!from && !!to.value && to.value < from;
  const { order: _, ...others } = to.errors ?? {};
  if (wrong) to.setErrors({ ...others, order: true, rule: 'The last run day cannot come before the first' });
  else if (to.errors?.['order']) to.setErrors(Object.keys(others).length ? others : null);
  return null;
};

/** The shared schema's rule, with plain words for a number left empty. */
function settingsRule(schema: Parameters<typeof schemaRule>[0]): ValidatorFn {
  const rule = schemaRule(schema);
  return (control) => {
    const errors = rule(control);
    return errors && control.value === null ? { rule: 'Enter a number here' } : errors;
  };
}

/** A settings field checked with the shared schema, so it says what the server would. */
function settingsControl<K extends keyof SettingsValues>(key: K, value: SettingsValues[K]): FormControl<SettingsValues[K]> {
  const validators: ValidatorFn[] = [];
  if (key === 'decisionLevels') validators.push(levels);
  else if (key !== 'runsFrom' && key !== 'runsTo') validators.push(settingsRule(StudySettings.shape[key as keyof typeof StudySettings.shape]));
  return new FormControl(value, { nonNullable: true, validators }) as FormControl<SettingsValues[K]>;
}

export function buildSetupForm(values: SetupValues): SetupGroup {
  const settings = {} as Controls<SettingsValues>;
  for (const key of Object.keys(values.settings) as (keyof SettingsValues)[]) {
    (settings as Record<string, FormControl>)[key] = settingsControl(key, values.settings[key]);
  }
  return new FormGroup({
    kind: new FormControl(values.kind, { nonNullable: true }),
    title: new FormControl(values.title, { nonNullable: true, validators: [Validators.required, schemaRule(CreateStudyBody.shape.title)] }),
    purpose: new FormControl(values.purpose, { nonNullable: true, validators: [Validators.maxLength(2000)] }),
    analyteId: new FormControl(values.analyteId, [Validators.required]),
    comparativeInstrumentId: new FormControl(values.comparativeInstrumentId),
    candidateInstrumentId: new FormControl(values.candidateInstrumentId),
    instrumentId: new FormControl(values.instrumentId),
    settings: new FormGroup(settings, { validators: [runOrder] }),
    reason: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(500)] }),
  });
}

/** The form's values in the model's shape (date fields left empty become null). */
export function readSetup(form: SetupGroup): SetupValues {
  const { reason: _, ...raw } = form.getRawValue();
  const settings = { ...raw.settings, runsFrom: raw.settings.runsFrom || null, runsTo: raw.settings.runsTo || null };
  return { ...raw, settings };
}
