import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, untracked } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { ReactiveFormsModule, Validators } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { startWith, switchMap } from 'rxjs';
import { DayDates } from '../../../../ui/day-dates';
import { FieldErrorPipe } from '../../../../ui/field-error';
import type { StudyCatalog } from '../../api/catalog-api';
import { DIFFERENCE_LABELS, REGRESSION_LABELS, usesDemingRatio } from '../../study-text';
import type { SetupGroup } from '../../setup/setup-form-group';

/** The Setup fields of a method comparison: the two methods, the goals, and the difference and regression. */
@Component({
  selector: 'app-comparison-setup-fields',
  templateUrl: './comparison-setup-fields.html',
  styleUrl: '../../setup/setup-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, FieldErrorPipe, DayDates],
})
export class ComparisonSetupFields {
  readonly form = input.required<SetupGroup>();
  readonly catalog = input<StudyCatalog | null>(null);

  protected readonly differences = Object.entries(DIFFERENCE_LABELS);
  protected readonly regressions = Object.entries(REGRESSION_LABELS);
  protected readonly instruments = computed(() => (this.catalog()?.instruments ?? []).filter((i) => i.active || this.isChosen(i.id)));
  private readonly regression = toSignal(
    toObservable(this.form).pipe(
      switchMap((form) => form.controls.settings.controls.regression.valueChanges.pipe(startWith(form.controls.settings.controls.regression.value))),
    ),
  );
  protected readonly showRatio = computed(() => usesDemingRatio(this.regression() ?? 'passing-bablok'));
  protected readonly settings = computed(() => this.form().controls.settings.controls);

  constructor() {
    // A comparison needs both instruments; the requirement leaves with these fields.
    effect(() => {
      const form = this.form();
      untracked(() => this.require(form, true));
    });
    inject(DestroyRef).onDestroy(() => this.require(this.form(), false));
  }

  private require(form: SetupGroup, on: boolean): void {
    for (const control of [form.controls.comparativeInstrumentId, form.controls.candidateInstrumentId]) {
      if (on) control.addValidators(Validators.required);
      else control.removeValidators(Validators.required);
      control.updateValueAndValidity({ emitEvent: false });
    }
  }

  private isChosen(id: number): boolean {
    const v = this.form().getRawValue();
    return v.comparativeInstrumentId === id || v.candidateInstrumentId === id;
  }
}
