import { DestroyRef, effect, inject, untracked } from '@angular/core';
import { AbstractControl, Validators } from '@angular/forms';
import { StudySettings } from '@shared/schemas';
import type { SetupGroup } from '../../setup/setup-form-group';

/**
 * Makes the given controls required while a kind's Setup fields are shown, and no longer once they go
 * (the form is shared by every kind). Call from a constructor.
 */
export function requireWhileShown(form: () => SetupGroup, controls: (form: SetupGroup) => AbstractControl[]): void {
  const apply = (f: SetupGroup, on: boolean): void => {
    for (const control of controls(f)) {
      if (on) control.addValidators(Validators.required);
      else control.removeValidators(Validators.required);
      control.updateValueAndValidity({ emitEvent: false });
    }
  };
  effect(() => {
    const f = form();
    untracked(() => apply(f, true));
  });
  inject(DestroyRef).onDestroy(() => apply(form(), false));
}

/** What a new study of an interval kind starts with in place of the comparison's plan. */
export interface IntervalPlan {
  confidenceLevel: number;
  plannedSpecimens: number;
  outlierRule: string;
  acceptanceRule: string;
}

type PlanKey = keyof IntervalPlan;
const PLAN_KEYS: PlanKey[] = ['confidenceLevel', 'plannedSpecimens', 'outlierRule', 'acceptanceRule'];

/**
 * A new study of an interval kind starts with the interval's plan (90% CIs, the number of individuals, its
 * outlier and acceptance rules) wherever the field still holds the shared default; when the user picks
 * another kind, the fields still holding these values go back to the defaults. Existing studies keep theirs.
 * Call from a constructor.
 */
export function startWithPlan(form: () => SetupGroup, plan: IntervalPlan): void {
  const defaults = StudySettings.parse({});
  const controls = (f: SetupGroup) => f.controls.settings.controls;
  effect(() => {
    const f = form();
    untracked(() => {
      if (!f.controls.kind.enabled) return;
      for (const key of PLAN_KEYS) {
        const control = controls(f)[key] as AbstractControl;
        if (control.value === defaults[key]) control.setValue(plan[key]);
      }
    });
  });
  inject(DestroyRef).onDestroy(() => {
    const f = form();
    if (!f.controls.kind.enabled) return;
    for (const key of PLAN_KEYS) {
      const control = controls(f)[key] as AbstractControl;
      if (control.value === plan[key]) control.setValue(defaults[key]);
    }
  });
}
