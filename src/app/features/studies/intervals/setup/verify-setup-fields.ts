import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { startWith, switchMap } from 'rxjs';
import { POPULATION_MAX } from '@shared/schemas';
import { ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { FieldErrorPipe } from '../../../../ui/field-error';
import type { StudyCatalog } from '../../api/catalog-api';
import type { SetupGroup } from '../../setup/setup-form-group';
import { IntervalMeasurementFields } from './measurement-fields';
import { VERIFY_PLAN } from './interval-plans';
import { requireWhileShown, startWithPlan } from './require-fields';

/**
 * The Setup fields of verifying a stated reference interval (transference): who the local individuals are (the
 * report's "Reference population"; words only, so changing them leaves the findings current), the stated limits and
 * where they come from.
 */
@Component({
  selector: 'app-verify-setup-fields',
  styleUrls: ['../../setup/setup-form.scss', './interval-setup.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, FieldErrorPipe, IntervalMeasurementFields],
  template: `
    <app-interval-measurement-fields [form]="form()" [catalog]="catalog()" />
    <div [formGroup]="form()">
      <section class="section" aria-labelledby="setup-local-population" formGroupName="settings">
        <h2 id="setup-local-population">Local reference individuals</h2>
        <mat-form-field class="full-width">
          <mat-label>Reference population</mat-label>
          <textarea matInput rows="2" formControlName="populationDescription" data-testid="setup-population"></textarea>
          <mat-hint>Who the local individuals are (age, sex, where recruited) and who was left out, e.g. healthy adult blood donors, 18–65 y; the report prints it.</mat-hint>
          <mat-hint align="end" class="count">{{ populationLength() }} / {{ populationMax }}</mat-hint>
          <mat-error>{{ settings().populationDescription.errors | fieldError: 'The reference population' }}</mat-error>
        </mat-form-field>
      </section>
      <section class="section" aria-labelledby="setup-stated" formGroupName="settings">
        <h2 id="setup-stated">Stated interval</h2>
        <div class="form-grid">
          <mat-form-field>
            <mat-label>Stated lower limit</mat-label>
            <input matInput type="number" step="any" formControlName="statedLower" data-testid="setup-stated-lower" />
            <mat-error>{{ settings().statedLower.errors | fieldError: 'The stated lower limit' }}</mat-error>
          </mat-form-field>
          <mat-form-field>
            <mat-label>Stated upper limit</mat-label>
            <input matInput type="number" step="any" formControlName="statedUpper" data-testid="setup-stated-upper" />
            <mat-error>{{ settings().statedUpper.errors | fieldError: 'The stated upper limit' }}</mat-error>
          </mat-form-field>
        </div>
        <mat-form-field class="full-width">
          <mat-label>Source of the stated interval</mat-label>
          <textarea matInput rows="2" formControlName="statedSource" data-testid="setup-stated-source"></textarea>
          <mat-hint>For example the manufacturer's insert (with its edition), a published study, or another laboratory.</mat-hint>
          <mat-error>{{ settings().statedSource.errors | fieldError: 'The source' }}</mat-error>
        </mat-form-field>
      </section>
    </div>
  `,
})
export class VerifySetupFields {
  readonly form = input.required<SetupGroup>();
  readonly catalog = input<StudyCatalog | null>(null);
  protected readonly settings = computed(() => this.form().controls.settings.controls);
  protected readonly populationMax = POPULATION_MAX;
  private readonly population = toSignal(
    toObservable(this.form).pipe(switchMap((f) => f.controls.settings.controls.populationDescription.valueChanges.pipe(startWith(f.controls.settings.controls.populationDescription.value)))),
  );
  protected readonly populationLength = computed(() => (this.population() ?? '').length);

  constructor() {
    requireWhileShown(this.form, (f) => {
      const s = f.controls.settings.controls;
      return [s.statedLower, s.statedUpper, s.statedSource];
    });
    startWithPlan(this.form, VERIFY_PLAN);
  }
}
