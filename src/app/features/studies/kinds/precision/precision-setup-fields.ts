import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormArray, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { scan, startWith, switchMap } from 'rxjs';
import { FieldErrorPipe } from '../../../../ui/field-error';
import type { StudyCatalog } from '../../api/catalog-api';
import { IntervalMeasurementFields } from '../../intervals/setup/measurement-fields';
import { hasControl as has, joinKindFields, ownSettings as ownGroup } from '../../setup/kind-fields';
import type { SetupGroup } from '../../setup/setup-form-group';
import { PRECISION_RULES } from './guidance';
import { MAX_MATERIALS, type MaterialGroup, type MaterialsArray, PRECISION_KEYS, materialGroup, precisionControls } from './settings-controls';

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

  constructor() {
    joinKindFields(this.form, { kind: 'precision', controls: () => precisionControls({}), rules: PRECISION_RULES, planned: plannedOf });
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
}
