import { AbstractControl, FormControl, FormGroup, ValidationErrors, ValidatorFn, Validators } from '@angular/forms';
import type { ZodType } from 'zod';
import { kindMeta } from '@shared/kinds/kinds';
import type { StudyKind } from '@shared/schemas';
import { CreateStudyBody, StudySettings } from '@shared/schemas';
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

/**
 * The controls of a kind's own settings (those StudySettings lacks, such as a precision study's materials), built from
 * the stored settings with the kind's defaults where a key is missing: a kind's view may give it (KindView.settingsControls).
 */
export type OwnSettingsControls = (stored: Readonly<Record<string, unknown>>) => Record<string, AbstractControl>;

/** The settings group with its own settings' keys as well (their controls are the kind's). */
export type OpenSettingsGroup = FormGroup<Record<string, AbstractControl>>;

/** True for a setting every study carries (StudySettings); the others are a kind's own. */
export const isCommonSetting = (key: string): boolean => Object.hasOwn(StudySettings.shape, key);

/** The shared schema's rule, with plain words for a number left empty. */
export function settingsRule(schema: ZodType): ValidatorFn {
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

/** A control checked with a schema of one setting (the setting as the Setup form holds it). */
export function ruleControl<T>(schema: ZodType, value: T): FormControl<T> {
  return new FormControl(value, { nonNullable: true, validators: [settingsRule(schema)] });
}

/** A control of one of a kind's own settings, checked with the kind's own schema (its KindMeta.settings) when it names the key. */
export function ownSettingControl(kind: string, key: string, value: unknown): FormControl<unknown> {
  const schema = kindMeta(kind).settings?.shape[key] as ZodType | undefined;
  return schema ? ruleControl(schema, value) : new FormControl(value, { nonNullable: true });
}

/** The controls of the kind's own settings among the values: the kind's (`own`), else one checked control per key. */
function ownControls(values: SetupValues, own?: OwnSettingsControls): Record<string, AbstractControl> {
  const stored = values.settings as unknown as Record<string, unknown>;
  const controls = own?.(stored) ?? {};
  for (const key of Object.keys(stored)) {
    if (!isCommonSetting(key) && !controls[key]) controls[key] = ownSettingControl(values.kind, key, stored[key]);
  }
  return controls;
}

/**
 * The Setup form of the values: one control per setting every study carries, checked with the shared schema, and the
 * kind's own settings' controls (`own`, the kind view's settingsControls; or one control per own key of the values).
 */
export function buildSetupForm(values: SetupValues, own?: OwnSettingsControls): SetupGroup {
  const settings = {} as Controls<SettingsValues>;
  for (const key of Object.keys(values.settings) as (keyof SettingsValues)[]) {
    if (isCommonSetting(key)) (settings as Record<string, FormControl>)[key] = settingsControl(key, values.settings[key]);
  }
  Object.assign(settings, ownControls(values, own));
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

/**
 * Puts a study's values into the form: the own settings of another kind leave, the kind's own are built afresh from the
 * values (so a list such as the materials has as many entries as the values, with the kind's defaults for what they lack),
 * then every control takes its value. In a read-only (disabled) form they come disabled.
 */
export function resetSetupForm(form: SetupGroup, values: SetupValues, own?: OwnSettingsControls): void {
  const settings = form.controls.settings as unknown as OpenSettingsGroup;
  for (const key of Object.keys(settings.controls)) {
    if (!isCommonSetting(key)) settings.removeControl(key, { emitEvent: false });
  }
  const stored: Record<string, unknown> = { ...values.settings };
  for (const [key, control] of Object.entries(ownControls(values, own))) {
    stored[key] = control.value;
    if (settings.disabled) control.disable({ emitEvent: false });
    settings.setControl(key, control, { emitEvent: false });
  }
  form.reset({ ...values, settings: stored as unknown as SettingsValues });
}

/** The form's values in the model's shape (date fields left empty become null). */
export function readSetup(form: SetupGroup): SetupValues {
  const { reason: _, ...raw } = form.getRawValue();
  const settings = { ...raw.settings, runsFrom: raw.settings.runsFrom || null, runsTo: raw.settings.runsTo || null };
  return { ...raw, settings };
}
