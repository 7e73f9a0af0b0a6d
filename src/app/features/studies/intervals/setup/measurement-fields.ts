import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { FieldErrorPipe } from '../../../../ui/field-error';
import type { StudyCatalog } from '../../api/catalog-api';
import type { SetupGroup } from '../../setup/setup-form-group';
import { requireWhileShown } from './require-fields';

/**
 * What a study on one instrument measures on: the instrument (required while shown), the reagent lot, the unit and
 * decimals. Used by the reference-interval kinds and by precision; `instrumentHint` says what the instrument is for.
 */
@Component({
  selector: 'app-interval-measurement-fields',
  styleUrl: '../../setup/setup-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, FieldErrorPipe],
  template: `
    <section class="section" aria-labelledby="setup-measurement" [formGroup]="form()">
      <h2 id="setup-measurement">Measurement</h2>
      <div class="form-grid">
        <mat-form-field>
          <mat-label>Instrument</mat-label>
          <mat-select formControlName="instrumentId" data-testid="setup-instrument">
            @for (i of instruments(); track i.id) {
              <mat-option [value]="i.id">{{ i.name }}</mat-option>
            }
          </mat-select>
          <mat-hint>{{ instrumentHint() }}</mat-hint>
          <mat-error>{{ form().controls.instrumentId.errors | fieldError: 'The instrument' }}</mat-error>
        </mat-form-field>
        <ng-container formGroupName="settings">
          <mat-form-field>
            <mat-label>Reagent lot</mat-label>
            <input matInput formControlName="reagentLot" data-testid="setup-reagent-lot" />
            <mat-error>{{ settings().reagentLot.errors | fieldError: 'The reagent lot' }}</mat-error>
          </mat-form-field>
          <mat-form-field>
            <mat-label>Unit</mat-label>
            <input matInput formControlName="unit" data-testid="setup-unit" />
            <mat-error>{{ settings().unit.errors | fieldError: 'The unit' }}</mat-error>
          </mat-form-field>
          <mat-form-field>
            <mat-label>Decimals shown</mat-label>
            <input matInput type="number" min="0" max="6" step="1" formControlName="decimals" />
            <mat-error>{{ settings().decimals.errors | fieldError: 'Decimals' }}</mat-error>
          </mat-form-field>
        </ng-container>
      </div>
    </section>
  `,
})
export class IntervalMeasurementFields {
  readonly form = input.required<SetupGroup>();
  readonly catalog = input<StudyCatalog | null>(null);
  readonly instrumentHint = input('The analyser that measured the reference individuals');

  protected readonly settings = computed(() => this.form().controls.settings.controls);
  protected readonly instruments = computed(() =>
    (this.catalog()?.instruments ?? []).filter((i) => i.active || i.id === this.form().controls.instrumentId.value),
  );

  constructor() {
    requireWhileShown(this.form, (f) => [f.controls.instrumentId]);
  }
}
