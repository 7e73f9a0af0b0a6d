import { AbstractControl, FormArray, FormControl, FormGroup, ValidatorFn } from '@angular/forms';
import { PrecisionMaterial, PrecisionSettings } from '@shared/kinds/precision/meta';
import { ruleControl } from '../../setup/setup-form-group';
import { precisionOwn } from './own-settings';

/** The most materials one study takes (the shared schema's limit). */
export const MAX_MATERIALS = 6;

/** One material as its block of the Setup form holds it (numbers may be empty). */
export interface MaterialValues {
  name: string;
  claimRepeatability: number | null;
  claimWithinLab: number | null;
  claimAs: 'sd' | 'cv';
  assignedValue: number | null;
  assignedUncertainty: number | null;
  assignedSource: string;
}
export type MaterialGroup = FormGroup<{ [K in keyof MaterialValues]: FormControl<MaterialValues[K]> }>;
export type MaterialsArray = FormArray<MaterialGroup>;

/** The keys of a precision study's own settings, as the Setup form holds them. */
export const PRECISION_KEYS = ['materials', 'days', 'replicates', 'alpha', 'controlLot'] as const;

export const emptyMaterial = (): MaterialValues => ({
  name: '', claimRepeatability: null, claimWithinLab: null, claimAs: 'sd', assignedValue: null, assignedUncertainty: null, assignedSource: '',
});

/** Sets a control's `rule` error to the message (or clears it), leaving it be when nothing changes. */
function putRule(control: AbstractControl, message: string | undefined): void {
  if (message === undefined) {
    if (control.errors !== null) control.setErrors(null);
  } else if (control.errors?.['rule'] !== message) control.setErrors({ rule: message });
}

/**
 * A material is checked whole with the shared schema (PrecisionMaterial), and each message goes under the field its
 * path names: "Give the material a name", "The within-laboratory claim cannot be smaller than the repeatability claim".
 * The fields have no checks of their own, so the words are the server's.
 */
const materialRule: ValidatorFn = (control) => {
  const group = control as MaterialGroup;
  const result = PrecisionMaterial.safeParse(group.getRawValue());
  const issues = result.success ? [] : result.error.issues;
  for (const [key, field] of Object.entries(group.controls)) putRule(field, issues.find((i) => i.path[0] === key)?.message);
  return null;
};

/** What is wrong with the list as a whole (at least one, at most 6, each its own name), in the shared schema's words. */
const materialsRule: ValidatorFn = (control) => {
  const result = PrecisionSettings.shape.materials.safeParse((control as MaterialsArray).getRawValue());
  const whole = result.success ? undefined : result.error.issues.find((i) => i.path.length === 0);
  return whole ? { rule: whole.message } : null;
};

/** One material's block, from stored values (what they lack is empty). */
export function materialGroup(values: Partial<MaterialValues> = {}): MaterialGroup {
  const v = { ...emptyMaterial(), ...values };
  const control = <K extends keyof MaterialValues>(key: K) => new FormControl<MaterialValues[K]>(v[key] ?? emptyMaterial()[key], { nonNullable: true });
  return new FormGroup(
    {
      name: control('name'), claimRepeatability: control('claimRepeatability'), claimWithinLab: control('claimWithinLab'), claimAs: control('claimAs'),
      assignedValue: control('assignedValue'), assignedUncertainty: control('assignedUncertainty'), assignedSource: control('assignedSource'),
    },
    { validators: [materialRule] },
  );
}

/**
 * The Setup form's controls of a precision study's own settings (KindView.settingsControls), from the stored ones: the
 * materials as one block each (one empty block when none is stored), the days, replicates and α checked with the
 * shared schema, and the control lot; what is missing takes the kind's defaults (5 days × 5 replicates, α = 0.05).
 */
export function precisionControls(stored: Readonly<Record<string, unknown>>): Record<string, AbstractControl> {
  const own = precisionOwn(stored);
  const materials: Partial<MaterialValues>[] = own.materials.length > 0 ? own.materials : [{}];
  const shape = PrecisionSettings.shape;
  return {
    materials: new FormArray(materials.map((m) => materialGroup(m)), { validators: [materialsRule] }),
    days: ruleControl<number | null>(shape.days, own.days),
    replicates: ruleControl<number | null>(shape.replicates, own.replicates),
    alpha: ruleControl<number | null>(shape.alpha, own.alpha),
    controlLot: ruleControl(shape.controlLot, own.controlLot),
  };
}
