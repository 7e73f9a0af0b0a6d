import { AbstractControl, FormArray, FormControl, FormGroup, ValidatorFn } from '@angular/forms';
import { RANGE_LEVELS, RangeLevel, RangeSettings } from '@shared/kinds/reportable-range/meta';
import { settingsRule } from '../../setup/setup-form-group';
import { rangeOwn } from './own-settings';

/** The fewest levels a study is submitted with (the server's submission check) and the most the shared schema takes. */
export const MIN_LEVELS = RANGE_LEVELS.fewest;
export const MAX_LEVELS = RANGE_LEVELS.most;

/** One level as its row of the levels table holds it (the two numbers may be empty; one of them is given). */
export interface LevelValues {
  name: string;
  assigned: number | null;
  fraction: number | null;
}
export type LevelGroup = FormGroup<{ [K in keyof LevelValues]: FormControl<LevelValues[K]> }>;
export type LevelsArray = FormArray<LevelGroup>;

/** The keys of a reportable-range study's own settings, as the Setup form holds them. */
export const RANGE_KEYS = [
  'levels', 'poolLow', 'poolHigh', 'replicates', 'allowableNonlinearity', 'allowableNonlinearityPercent', 'nonlinearitySource', 'claimedLow', 'claimedHigh', 'alpha',
] as const;
type RangeKey = (typeof RANGE_KEYS)[number];

/** The name a level gets when the form makes it: "Level 3". */
export const levelName = (index: number): string => `Level ${index + 1}`;

/** Sets a control's `rule` error to the message (or clears it), leaving it be when nothing changes. */
function putRule(control: AbstractControl, message: string | undefined): void {
  if (message === undefined) {
    if (control.errors !== null) control.setErrors(null);
  } else if (control.errors?.['rule'] !== message) control.setErrors({ rule: message });
}

/**
 * A level is checked whole with the shared schema (RangeLevel), and each message goes under the field its path names:
 * "Give the level a name", "The mixing fraction must be from 0 to 1", "Give the level either an assigned value or a
 * mixing fraction, not both" (under the assigned value). The fields have no checks of their own, so the words are the server's.
 */
const levelRule: ValidatorFn = (control) => {
  const group = control as LevelGroup;
  const result = RangeLevel.safeParse(group.getRawValue());
  const issues = result.success ? [] : result.error.issues;
  for (const [key, field] of Object.entries(group.controls)) putRule(field, issues.find((i) => i.path[0] === key)?.message);
  return null;
};

/** What is wrong with the list as a whole (at most 11, each its own name), in the shared schema's words. */
const levelsRule: ValidatorFn = (control) => {
  const result = RangeSettings.shape.levels.safeParse((control as LevelsArray).getRawValue());
  const whole = result.success ? undefined : result.error.issues.find((i) => i.path.length === 0);
  return whole ? { rule: whole.message } : null;
};

/** One level's row, from stored values (what they lack is empty). */
export function levelGroup(values: Partial<LevelValues> = {}): LevelGroup {
  return new FormGroup(
    {
      name: new FormControl(values.name ?? '', { nonNullable: true }),
      assigned: new FormControl<number | null>(values.assigned ?? null),
      fraction: new FormControl<number | null>(values.fraction ?? null),
    },
    { validators: [levelRule] },
  ) as LevelGroup;
}

/**
 * n levels evenly spaced as fractions of the high pool: 0, 1/(n − 1), …, 1, each written to 4 decimals (1/3 → 0.3333;
 * quarters, fifths, eighths and tenths exactly).
 */
export function evenFractions(n: number): number[] {
  if (!Number.isInteger(n) || n < 2) return [];
  return Array.from({ length: n }, (_, k) => Number((k / (n - 1)).toFixed(4)));
}

/**
 * The settings' own rules that join two fields (both pools or neither, the high pool above the low one, the claimed high
 * end above the low one, pools for levels given as fractions), as the shared schema says them, keyed by the field its path
 * names. A field whose own value the schema refuses counts as its default here, so its own message stands alone.
 */
function crossIssues(controls: Record<RangeKey, AbstractControl>): Map<string, string> {
  const defaults = RangeSettings.parse({});
  const values: Record<string, unknown> = {};
  for (const key of RANGE_KEYS) {
    const value = controls[key].getRawValue();
    values[key] = key === 'levels' || RangeSettings.shape[key].safeParse(value).success ? value : defaults[key];
  }
  const result = RangeSettings.safeParse(values);
  const out = new Map<string, string>();
  for (const issue of result.success ? [] : result.error.issues) {
    const key = String(issue.path[0] ?? '');
    if (issue.path.length === 1 && issue.code === 'custom' && key !== 'levels' && !out.has(key)) out.set(key, issue.message);
  }
  return out;
}

/** A field checked with its own schema, then with the rules joining it to another field. */
function crossRule(key: RangeKey, controls: Partial<Record<RangeKey, AbstractControl>>): ValidatorFn {
  const own = settingsRule(RangeSettings.shape[key]);
  return (control) => {
    const errors = own(control);
    if (errors || RANGE_KEYS.some((k) => !controls[k])) return errors;
    const message = crossIssues(controls as Record<RangeKey, AbstractControl>).get(key);
    return message ? { rule: message } : null;
  };
}

/**
 * The Setup form's controls of a reportable-range study's own settings (KindView.settingsControls), from the stored ones:
 * the levels as one row each (a new study: 5 rows named Level 1 to Level 5, their values to give), the pools, replicates,
 * goal, claim and α checked with the shared schema, each field also with the rules that join it to another (a change to
 * one field checks the others again); what is missing takes the kind's defaults (2 replicates, α = 0.05).
 */
export function rangeControls(stored: Readonly<Record<string, unknown>>): Record<string, AbstractControl> {
  const own = rangeOwn(stored);
  const levels: Partial<LevelValues>[] = own.levels.length > 0 ? own.levels : Array.from({ length: MIN_LEVELS }, (_, i) => ({ name: levelName(i) }));
  const controls: Partial<Record<RangeKey, AbstractControl>> = {};
  controls.levels = new FormArray(levels.map((l) => levelGroup(l)), { validators: [levelsRule] });
  for (const key of RANGE_KEYS) {
    if (key !== 'levels') controls[key] = new FormControl(own[key], { nonNullable: true, validators: [crossRule(key, controls)] });
  }
  const all = controls as Record<RangeKey, AbstractControl>;
  for (const key of RANGE_KEYS) all[key].updateValueAndValidity({ emitEvent: false });
  // A change to one field can make or mend a joined rule of another: check the others again (without events, so this ends).
  for (const key of RANGE_KEYS) {
    all[key].valueChanges.subscribe(() => {
      for (const other of RANGE_KEYS) if (other !== key && other !== 'levels') all[other].updateValueAndValidity({ emitEvent: false });
    });
  }
  return all;
}
