import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MAT_FORM_FIELD_DEFAULT_OPTIONS, MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { map, startWith } from 'rxjs';
import type { Study } from '@shared/schemas';
import { CurveChart } from '../../../findings/charts/curve-chart';
import type { SetupGroup } from '../../../setup/setup-form-group';
import { establishPlan, type Population } from './establish-data';
import { settingSignal } from './setting-signal';

type Presumed = 'none' | 'normal' | 'log-normal';

/** The presumed population as its fields hold it, or what is wrong with it in words. */
export function presumedPopulation(v: { shape: Presumed; lower: number | null; upper: number | null }): { population: Population | null; problem: string | null } {
  if (v.shape === 'none') return { population: null, problem: null };
  if (v.lower === null || v.upper === null) return { population: null, problem: 'Give the presumed lower and upper limit to see widths in the unit.' };
  if (!(v.upper > v.lower)) return { population: null, problem: 'The presumed upper limit must be above the lower.' };
  if (v.shape === 'log-normal' && !(v.lower > 0)) return { population: null, problem: 'A log-normal population needs a lower limit above 0.' };
  return { population: { shape: v.shape, lower: v.lower, upper: v.upper }, problem: null };
}

/**
 * "What more individuals buy": for 120 to 400 reference individuals (and the planned number), each limit's rank-based CI
 * at the Setup's level (its ranks, coverage and expected span), and with a presumed population its expected width in the
 * unit (shared/stats/plan-establish, computed here; the presumed population is not saved).
 */
@Component({
  selector: 'app-establish-plan',
  styleUrl: './interval-plan.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  providers: [{ provide: MAT_FORM_FIELD_DEFAULT_OPTIONS, useValue: { subscriptSizing: 'dynamic' } }],
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatIconModule, CurveChart],
  templateUrl: './establish-plan.html',
})
export class EstablishPlan {
  readonly form = input.required<SetupGroup>();
  readonly study = input<Study | null>(null);
  readonly readonly = input(false);

  protected readonly presumed = new FormGroup({
    shape: new FormControl<Presumed>('none', { nonNullable: true }),
    lower: new FormControl<number | null>(null),
    upper: new FormControl<number | null>(null),
  });
  private readonly presumedValue = toSignal(this.presumed.valueChanges.pipe(startWith(null), map(() => this.presumed.getRawValue())), {
    initialValue: this.presumed.getRawValue(),
  });
  protected readonly population = computed(() => presumedPopulation(this.presumedValue()));

  private readonly planned = settingSignal(this.form, (f) => f.controls.settings.controls.plannedSpecimens);
  private readonly percentiles = settingSignal(this.form, (f) => f.controls.settings.controls.percentiles);
  private readonly level = settingSignal(this.form, (f) => f.controls.settings.controls.confidenceLevel);
  private readonly unitValue = settingSignal(this.form, (f) => f.controls.settings.controls.unit);
  private readonly decimals = settingSignal(this.form, (f) => f.controls.settings.controls.decimals);
  protected readonly unit = computed(() => this.unitValue() || this.study()?.analyteUnit || '');

  protected readonly plan = computed(() => {
    const percentiles = (this.percentiles() ?? []).filter((p) => p > 0 && p < 100);
    const level = this.level();
    if (percentiles.length === 0 || level === undefined || !(level > 0 && level < 1)) return null;
    return establishPlan({
      planned: this.planned() ?? null, percentiles, level, population: this.population().population, unit: this.unit(), decimals: this.decimals() ?? 1,
    });
  });
  protected readonly inUnit = computed(() => this.population().population !== null);
}
