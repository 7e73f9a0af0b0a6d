import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormArray, FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { scan, startWith, switchMap } from 'rxjs';
import { formatNumber, withUnit } from '@shared/types/findings-numbers';
import { FieldErrorPipe } from '../../../../ui/field-error';
import type { StudyCatalog } from '../../api/catalog-api';
import { IntervalMeasurementFields } from '../../intervals/setup/measurement-fields';
import { hasControl as has, joinKindFields, ownSettings as ownGroup } from '../../setup/kind-fields';
import type { SetupGroup } from '../../setup/setup-form-group';
import { RANGE_RULES } from './guidance';
import { pooledValue } from './own-settings';
import {
  type LevelGroup, type LevelsArray, MAX_LEVELS, MIN_LEVELS, RANGE_KEYS, evenFractions, levelGroup, levelName, rangeControls,
} from './settings-controls';

const levelsOf = (form: SetupGroup): LevelsArray | null => {
  const control = ownGroup(form).get('levels');
  return control instanceof FormArray ? (control as LevelsArray) : null;
};
const numberOf = (form: SetupGroup, key: string): number | null => {
  const value = ownGroup(form).get(key)?.value as unknown;
  return typeof value === 'number' && Number.isFinite(value) ? value : null;
};
/** Results the design plans: levels × replicates (null while the replicates are empty). */
const plannedOf = (form: SetupGroup): number | null => {
  const replicates = numberOf(form, 'replicates');
  const levels = levelsOf(form)?.length ?? 0;
  return replicates !== null && levels > 0 ? replicates * levels : null;
};

/**
 * The Setup fields of a reportable-range study: the instrument (required while these fields are shown), the reagent lot,
 * the unit and decimals; the claimed measuring interval, replicates per level and α; the levels table (5 to 11 rows, each
 * with a name and either an assigned value or the high pool's fraction in a mixture, with a button that fills N levels
 * evenly as fractions) with the two pools' values; and the allowable nonlinearity (absolute and/or %, the larger applying
 * at a level) with its source.
 *
 * The form is shared by every kind: these fields add the study's own settings to it when they are missing (a new study:
 * five levels named Level 1 to Level 5, 2 replicates, α = 0.05), with the kind's outlier and acceptance rules in place of
 * the defaults and the planned count following levels × replicates; when another kind is chosen they take all of that
 * back. A saved study's own settings come into the form with it (KindView.settingsControls).
 */
@Component({
  selector: 'app-range-setup-fields',
  templateUrl: './range-setup-fields.html',
  styleUrls: ['../../setup/setup-form.scss', './range-setup-fields.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, IntervalMeasurementFields, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, FieldErrorPipe],
})
export class RangeSetupFields {
  readonly form = input.required<SetupGroup>();
  readonly catalog = input<StudyCatalog | null>(null);

  protected readonly minLevels = MIN_LEVELS;
  protected readonly maxLevels = MAX_LEVELS;
  /** How many levels the "fill evenly" button makes (5 to 11); not a setting, only the button's. */
  protected readonly evenCount = new FormControl<number | null>(MIN_LEVELS);
  /** Moves with every change of the settings (value, status, touched), so the rows and their errors follow the form. */
  private readonly changes = toSignal(
    toObservable(this.form).pipe(
      switchMap((f) => f.controls.settings.events.pipe(startWith(null))),
      scan((n) => n + 1, 0),
    ),
    { initialValue: 0 },
  );
  protected readonly settings = computed(() => {
    this.changes();
    return ownGroup(this.form()).controls;
  });
  protected readonly ready = computed(() => {
    this.changes();
    return RANGE_KEYS.every((key) => has(ownGroup(this.form()), key));
  });
  protected readonly levels = computed<LevelGroup[]>(() => {
    this.changes();
    return [...(levelsOf(this.form())?.controls ?? [])];
  });
  /** What is wrong with the list as a whole ("Give each level its own name"), in the shared schema's words. */
  protected readonly listError = computed(() => {
    this.changes();
    const errors = levelsOf(this.form())?.errors;
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
  /** "Assigned value (mmol/L)": a label with the unit when there is one. */
  protected readonly inUnit = (label: string): string => (this.unit() ? `${label} (${this.unit()})` : label);
  /** The goal in a sentence: which applies at a level when both are given, or what is missing. */
  protected readonly goalNote = computed(() => {
    this.changes();
    const absolute = numberOf(this.form(), 'allowableNonlinearity');
    const percent = numberOf(this.form(), 'allowableNonlinearityPercent');
    if (absolute !== null && percent !== null) {
      return `Both are given: at each level the larger of ${withUnit(String(absolute), this.unit())} and ${percent} % of the level applies.`;
    }
    if (absolute === null && percent === null) return 'Give one or both: the deviation from linearity at each level is judged against it.';
    return 'Give both to judge each level by the larger of the two.';
  });
  /** Beside a fraction: the value the pools make of it, in the study's decimals ("12.30"), or '' when it cannot be said. */
  protected fromPools(level: LevelGroup): string {
    this.changes();
    const value = pooledValue(level.controls.fraction.value, numberOf(this.form(), 'poolLow'), numberOf(this.form(), 'poolHigh'));
    if (value === null) return '';
    return formatNumber(value, this.form().controls.settings.controls.decimals.value ?? 1);
  }

  constructor() {
    joinKindFields(this.form, {
      kind: 'reportable-range', controls: () => rangeControls({}), rules: RANGE_RULES, planned: plannedOf,
      joined: (form) => this.evenCount.setValue(Math.min(MAX_LEVELS, Math.max(MIN_LEVELS, levelsOf(form)?.length ?? MIN_LEVELS))),
    });
  }

  protected addLevel(): void {
    const levels = levelsOf(this.form());
    if (!levels || levels.disabled || levels.length >= MAX_LEVELS) return;
    levels.markAsDirty();
    levels.push(levelGroup({ name: this.freeName(levels) }));
  }

  protected removeLevel(index: number): void {
    const levels = levelsOf(this.form());
    if (!levels || levels.disabled || levels.length <= MIN_LEVELS) return;
    levels.markAsDirty();
    levels.removeAt(index);
  }

  /**
   * Makes the table N levels spaced evenly as fractions of the high pool (0, 1/(N − 1), …, 1): the rows keep their names
   * (a row without one, or a new row, is named Level k), the assigned values are cleared.
   */
  protected fillEvenly(): void {
    const levels = levelsOf(this.form());
    const n = this.evenCount.value;
    if (!levels || levels.disabled || n === null || !Number.isInteger(n) || n < MIN_LEVELS || n > MAX_LEVELS) return;
    const fractions = evenFractions(n);
    while (levels.length > n) levels.removeAt(levels.length - 1, { emitEvent: false });
    while (levels.length < n) levels.push(levelGroup({ name: this.freeName(levels) }), { emitEvent: false });
    levels.controls.forEach((level, k) => {
      const name = level.controls.name.value.trim() === '' ? levelName(k) : level.controls.name.value;
      level.setValue({ name, assigned: null, fraction: fractions[k] }, { emitEvent: false });
    });
    levels.markAsDirty();
    levels.markAllAsTouched();
    levels.updateValueAndValidity();
  }

  protected evenCountValid(): boolean {
    const n = this.evenCount.value;
    return n !== null && Number.isInteger(n) && n >= MIN_LEVELS && n <= MAX_LEVELS;
  }

  /** The name of a row added at the end: "Level n" for the n it will be, or the next such name no row has. */
  private freeName(levels: LevelsArray): string {
    const taken = new Set(levels.controls.map((l) => l.controls.name.value.trim().toLowerCase()));
    let k = levels.length;
    while (taken.has(levelName(k).toLowerCase())) k++;
    return levelName(k);
  }
}
