import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, untracked } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { AbstractControl, FormArray, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { scan, startWith, switchMap } from 'rxjs';
import { StudySettings } from '../../../../../../shared/schemas';
import { FieldErrorPipe } from '../../../../ui/field-error';
import type { StudyCatalog } from '../../api/catalog-api';
import { IntervalMeasurementFields } from '../../intervals/setup/measurement-fields';
import type { OpenSettingsGroup, SetupGroup } from '../../setup/setup-form-group';
import { PRECISION_RULES } from './guidance';
import { MAX_MATERIALS, type MaterialGroup, type MaterialsArray, PRECISION_KEYS, materialGroup, precisionControls } from './settings-controls';

const KIND = 'precision';
const ownGroup = (form: SetupGroup): OpenSettingsGroup => form.controls.settings as unknown as OpenSettingsGroup;
/** Whether the group has the control, enabled or not (FormGroup.contains says false for a disabled one, so a signed study showed no materials). */
const has = (group: OpenSettingsGroup, key: string): boolean => Object.hasOwn(group.controls, key);
const materialsOf = (form: SetupGroup): MaterialsArray | null => {
  const control = ownGroup(form).get('materials');
  return control instanceof FormArray ? (control as MaterialsArray) : null;
};
/** Results the design plans: days × replicates × materials (null while a number is empty). */
const plannedOf = (form: SetupGroup): number | null => {
  const g = ownGroup(form);
  const days = g.get('days')?.value as number | null | undefined;
  const replicates = g.get('replicates')?.value as number | null | undefined;
  const materials = materialsOf(form)?.length ?? 0;
  return typeof days === 'number' && typeof replicates === 'number' && materials > 0 ? days * replicates * materials : null;
};

/**
 * The Setup fields of a precision verification: the instrument (required while these fields are shown), the reagent and
 * control lots, the unit and decimals, the design (days × replicates per material, α), and one block per material with
 * the manufacturer's repeatability and within-laboratory claims (as SDs in the unit or CVs in %) and, where known, its
 * assigned value with its standard uncertainty and source. 1 to 6 materials.
 *
 * The form is shared by every kind: these fields add the precision study's own settings to it when they are missing (a
 * new study: 5 days × 5 replicates, α = 0.05, one empty material), with the precision outlier and acceptance rules in
 * place of the defaults and the planned count following the design; when another kind is chosen they take all of that
 * back. A saved study's own settings come into the form with it (KindView.settingsControls).
 */
@Component({
  selector: 'app-precision-setup-fields',
  templateUrl: './precision-setup-fields.html',
  styleUrls: ['../../setup/setup-form.scss', './precision-setup-fields.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, IntervalMeasurementFields, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, FieldErrorPipe],
})
export class PrecisionSetupFields {
  readonly form = input.required<SetupGroup>();
  readonly catalog = input<StudyCatalog | null>(null);

  protected readonly maxMaterials = MAX_MATERIALS;
  /** Moves with every change of the settings (value, status, touched), so the blocks and their errors follow the form. */
  private readonly changes = toSignal(
    toObservable(this.form).pipe(
      switchMap((f) => f.controls.settings.events.pipe(startWith(null))),
      scan((n) => n + 1, 0),
    ),
    { initialValue: 0 },
  );
  protected readonly settings = computed(() => this.form().controls.settings.controls);
  protected readonly ready = computed(() => {
    this.changes();
    return PRECISION_KEYS.every((key) => has(ownGroup(this.form()), key));
  });
  protected readonly materials = computed<MaterialGroup[]>(() => {
    this.changes();
    return [...(materialsOf(this.form())?.controls ?? [])];
  });
  /** What is wrong with the list as a whole ("Give each material its own name"), in the shared schema's words. */
  protected readonly listError = computed(() => {
    this.changes();
    const errors = materialsOf(this.form())?.errors;
    return (errors?.['server'] as string | undefined) ?? (errors?.['rule'] as string | undefined) ?? null;
  });
  protected readonly unit = computed(() => {
    this.changes();
    return this.form().controls.settings.controls.unit.value.trim();
  });
  protected readonly editable = computed(() => {
    this.changes();
    return this.form().controls.settings.enabled;
  });
  /** The planned count the design gave last, so a count the user typed is left alone. */
  private lastPlanned: number | null = null;

  constructor() {
    effect(() => {
      const form = this.form();
      untracked(() => this.join(form));
    });
    effect((onCleanup) => {
      const form = this.form();
      const sub = form.controls.settings.valueChanges.subscribe(() => this.followDesign(form));
      onCleanup(() => sub.unsubscribe());
    });
    inject(DestroyRef).onDestroy(() => this.leave(this.form()));
  }

  /** Claim fields say what the number is: "Repeatability claim (SD, mmol/L)" or "(CV %)". */
  protected claimLabel(material: MaterialGroup, which: 'Repeatability' | 'Within-laboratory'): string {
    if (material.controls.claimAs.value === 'cv') return `${which} claim (CV %)`;
    return `${which} claim (SD${this.unit() ? `, ${this.unit()}` : ''})`;
  }

  protected addMaterial(): void {
    const materials = materialsOf(this.form());
    if (!materials || materials.disabled || materials.length >= MAX_MATERIALS) return;
    materials.markAsDirty();
    materials.push(materialGroup());
  }

  protected removeMaterial(index: number): void {
    const materials = materialsOf(this.form());
    if (!materials || materials.disabled || materials.length <= 1) return;
    materials.markAsDirty();
    materials.removeAt(index);
  }

  /** Adds the own settings a new study lacks, and gives a new study the precision rules and planned count. */
  private join(form: SetupGroup): void {
    const settings = ownGroup(form);
    const missing = Object.entries(precisionControls({})).filter(([key]) => !has(settings, key));
    for (const [key, control] of missing) {
      if (settings.disabled) control.disable({ emitEvent: false });
      settings.addControl(key, control as AbstractControl);
    }
    this.lastPlanned = plannedOf(form);
    if (!form.controls.kind.enabled) return;
    const s = form.controls.settings.controls;
    const defaults = StudySettings.parse({});
    if (s.outlierRule.value === defaults.outlierRule) s.outlierRule.setValue(PRECISION_RULES.outlierRule);
    if (s.acceptanceRule.value === defaults.acceptanceRule) s.acceptanceRule.setValue(PRECISION_RULES.acceptanceRule);
    if (s.plannedSpecimens.value === null) s.plannedSpecimens.setValue(this.lastPlanned);
  }

  /**
   * The planned count follows days × replicates × materials when the user changes them, while it holds what the design
   * gave before (or nothing); a count the user typed stays. A form put back to a saved study (pristine) only takes note.
   */
  private followDesign(form: SetupGroup): void {
    const planned = plannedOf(form);
    const before = this.lastPlanned;
    this.lastPlanned = planned;
    const control = form.controls.settings.controls.plannedSpecimens;
    if (form.pristine || planned === null || planned === before || !control.enabled) return;
    if (control.value === null || control.value === before) control.setValue(planned);
  }

  /** Another kind was chosen: the rules and count this kind gave go back to the defaults, and its own settings leave. */
  private leave(form: SetupGroup): void {
    if (form.controls.kind.value === KIND) return;
    const given = this.lastPlanned;
    if (form.controls.kind.enabled) {
      const s = form.controls.settings.controls;
      const defaults = StudySettings.parse({});
      if (s.outlierRule.value === PRECISION_RULES.outlierRule) s.outlierRule.setValue(defaults.outlierRule);
      if (s.acceptanceRule.value === PRECISION_RULES.acceptanceRule) s.acceptanceRule.setValue(defaults.acceptanceRule);
      if (given !== null && s.plannedSpecimens.value === given) s.plannedSpecimens.setValue(defaults.plannedSpecimens);
    }
    const settings = ownGroup(form);
    for (const key of PRECISION_KEYS) if (has(settings, key)) settings.removeControl(key);
  }
}
