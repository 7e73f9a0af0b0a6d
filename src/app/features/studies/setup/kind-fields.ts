import { DestroyRef, effect, inject, untracked, type Signal } from '@angular/core';
import type { AbstractControl } from '@angular/forms';
import { StudySettings } from '@shared/schemas';
import type { OpenSettingsGroup, SetupGroup } from './setup-form-group';

/** The settings group with the kind's own settings in it. */
export const ownSettings = (form: SetupGroup): OpenSettingsGroup => form.controls.settings as unknown as OpenSettingsGroup;

/** Whether the group has the control, enabled or not (FormGroup.contains says false for a disabled one, as in a signed study). */
export const hasControl = (group: OpenSettingsGroup, key: string): boolean => Object.hasOwn(group.controls, key);

/** What a kind's own Setup fields bring into the Setup form every kind shares. */
export interface KindFieldsPlan {
  kind: string;
  /** Its own settings' controls with their defaults, for a study that lacks them. */
  controls: () => Record<string, AbstractControl>;
  /** The outlier and acceptance rules it starts with in place of the comparison's. */
  rules: { outlierRule: string; acceptanceRule: string };
  /** The results its design plans, or null while a number of the design is empty (being retyped). */
  planned: (form: SetupGroup) => number | null;
  /** Anything else the fields do once they have joined a form. */
  joined?: (form: SetupGroup) => void;
}

/**
 * Joins a kind's own Setup fields to the shared form for as long as the component lives (call it in the component's
 * constructor). On joining, the own settings a new study lacks are added (disabled in a read-only form), and a new study
 * gets the kind's rules in place of the defaults and the planned count of its design. While the fields are shown, the
 * planned count follows the design when the user changes it, as long as it holds what the design gave before (or nothing):
 * a count the user typed stays, a form put back to a saved study (pristine) only takes note, and while a number of the
 * design is empty the last count is kept. When another kind is chosen, the rules and count the kind gave go back to the
 * defaults and its own settings leave the form.
 */
export function joinKindFields(form: Signal<SetupGroup>, plan: KindFieldsPlan): void {
  /** The planned count the design gave last, so a count the user typed is left alone. */
  let lastPlanned: number | null = null;
  const defaults = StudySettings.parse({});

  const join = (f: SetupGroup): void => {
    const settings = ownSettings(f);
    for (const [key, control] of Object.entries(plan.controls())) {
      if (hasControl(settings, key)) continue;
      if (settings.disabled) control.disable({ emitEvent: false });
      settings.addControl(key, control);
    }
    lastPlanned = plan.planned(f);
    plan.joined?.(f);
    if (!f.controls.kind.enabled) return;
    const s = f.controls.settings.controls;
    if (s.outlierRule.value === defaults.outlierRule) s.outlierRule.setValue(plan.rules.outlierRule);
    if (s.acceptanceRule.value === defaults.acceptanceRule) s.acceptanceRule.setValue(plan.rules.acceptanceRule);
    if (s.plannedSpecimens.value === null) s.plannedSpecimens.setValue(lastPlanned);
  };

  const followDesign = (f: SetupGroup): void => {
    const planned = plan.planned(f);
    if (planned === null) return;
    const before = lastPlanned;
    lastPlanned = planned;
    const control = f.controls.settings.controls.plannedSpecimens;
    if (f.pristine || planned === before || !control.enabled) return;
    if (control.value === null || control.value === before) control.setValue(planned);
  };

  const leave = (f: SetupGroup): void => {
    if (f.controls.kind.value === plan.kind) return;
    if (f.controls.kind.enabled) {
      const s = f.controls.settings.controls;
      if (s.outlierRule.value === plan.rules.outlierRule) s.outlierRule.setValue(defaults.outlierRule);
      if (s.acceptanceRule.value === plan.rules.acceptanceRule) s.acceptanceRule.setValue(defaults.acceptanceRule);
      if (lastPlanned !== null && s.plannedSpecimens.value === lastPlanned) s.plannedSpecimens.setValue(defaults.plannedSpecimens);
    }
    const settings = ownSettings(f);
    for (const key of Object.keys(plan.controls())) if (hasControl(settings, key)) settings.removeControl(key);
  };

  effect(() => {
    const f = form();
    untracked(() => join(f));
  });
  effect((onCleanup) => {
    const f = form();
    const sub = f.controls.settings.valueChanges.subscribe(() => followDesign(f));
    onCleanup(() => sub.unsubscribe());
  });
  inject(DestroyRef).onDestroy(() => leave(form()));
}
