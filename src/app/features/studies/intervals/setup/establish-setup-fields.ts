import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { ReactiveFormsModule } from '@angular/forms';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { startWith, switchMap } from 'rxjs';
import { FieldErrorPipe } from '../../../../ui/field-error';
import type { StudyCatalog } from '../../api/catalog-api';
import type { SetupGroup } from '../../setup/setup-form-group';
import { METHOD_WORDS } from '../findings/interval-wording';
import { IntervalMeasurementFields } from './measurement-fields';
import { PERCENTILE_CHOICES, samePercentiles } from './percentile-choices';
import { ESTABLISH_PLAN } from './interval-plans';
import { requireWhileShown, startWithPlan } from './require-fields';

type PartitionField = 'sex' | 'ageBand';

/** The Setup fields of establishing a reference interval: who the reference individuals are, the percentiles, the method and the partitions. */
@Component({
  selector: 'app-establish-setup-fields',
  templateUrl: './establish-setup-fields.html',
  styleUrls: ['../../setup/setup-form.scss', './interval-setup.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatCheckboxModule, FieldErrorPipe, IntervalMeasurementFields],
})
export class EstablishSetupFields {
  readonly form = input.required<SetupGroup>();
  readonly catalog = input<StudyCatalog | null>(null);

  protected readonly choices = PERCENTILE_CHOICES;
  protected readonly samePercentiles = samePercentiles;
  protected readonly methods = [
    { value: 'nonparametric', label: 'Nonparametric (ranks)' },
    { value: 'robust', label: 'Robust (biweight)' },
    { value: 'parametric', label: 'Parametric after Box–Cox' },
  ];
  protected readonly partitionChoices: { value: PartitionField; label: string }[] = [
    { value: 'sex', label: 'Sex' },
    { value: 'ageBand', label: 'Age band' },
  ];
  protected readonly settings = computed(() => this.form().controls.settings.controls);
  private readonly method = toSignal(
    toObservable(this.form).pipe(switchMap((f) => f.controls.settings.controls.intervalMethod.valueChanges.pipe(startWith(f.controls.settings.controls.intervalMethod.value)))),
  );
  protected readonly methodText = computed(() => METHOD_WORDS[this.method() ?? 'nonparametric']);
  private readonly partitions = toSignal(
    toObservable(this.form).pipe(switchMap((f) => f.controls.settings.controls.partitionFields.valueChanges.pipe(startWith(f.controls.settings.controls.partitionFields.value)))),
  );

  constructor() {
    requireWhileShown(this.form, (f) => [f.controls.settings.controls.populationDescription]);
    startWithPlan(this.form, ESTABLISH_PLAN);
  }

  protected partitioned(field: PartitionField): boolean {
    return (this.partitions() ?? []).includes(field);
  }

  protected togglePartition(field: PartitionField, on: boolean): void {
    const control = this.settings().partitionFields;
    const others = control.value.filter((f) => f !== field);
    control.setValue(on ? (['sex', 'ageBand'] as PartitionField[]).filter((f) => f === field || others.includes(f)) : others);
    control.markAsDirty();
    this.form().markAsDirty();
  }
}
