import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatDialogModule } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { InstrumentBody, type Instrument } from '@shared/schemas/admin.schema';
import { ErrorBanner } from '../../../../ui/error-banner';
import { FieldErrorPipe } from '../../../../ui/field-error';
import { CatalogDialog } from '../../catalog/catalog-dialog';
import { InstrumentsStore } from '../instruments-store';

const text = (value: string | undefined, max: number) =>
  new FormControl(value ?? '', { nonNullable: true, validators: [Validators.maxLength(max)] });

/** Add or edit an instrument: its name, make and model, serial number and where it stands. */
@Component({
  selector: 'app-instrument-dialog',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatCheckboxModule, MatButtonModule, ErrorBanner, FieldErrorPipe],
  template: `
    <h2 mat-dialog-title>{{ item ? 'Edit ' + item.name : 'Add an instrument' }}</h2>
    <form [formGroup]="form" (ngSubmit)="save()" novalidate data-testid="instrument-form">
      <mat-dialog-content>
        <app-error-banner [message]="problem()" />
        <mat-form-field class="full-width">
          <mat-label>Name</mat-label>
          <input matInput formControlName="name" data-testid="instrument-name" />
          <mat-hint>What the laboratory calls it, e.g. "Chemistry line 2".</mat-hint>
          <mat-error>{{ form.controls.name.errors | fieldError: 'A name' }}</mat-error>
        </mat-form-field>
        <mat-form-field class="full-width">
          <mat-label>Make and model</mat-label>
          <input matInput formControlName="model" data-testid="instrument-model" />
          <mat-error>{{ form.controls.model.errors | fieldError: 'The model' }}</mat-error>
        </mat-form-field>
        <div class="form-grid">
          <mat-form-field>
            <mat-label>Serial number</mat-label>
            <input matInput formControlName="serial" data-testid="instrument-serial" />
            <mat-error>{{ form.controls.serial.errors | fieldError: 'The serial number' }}</mat-error>
          </mat-form-field>
          <mat-form-field>
            <mat-label>Location</mat-label>
            <input matInput formControlName="location" data-testid="instrument-location" />
            <mat-error>{{ form.controls.location.errors | fieldError: 'The location' }}</mat-error>
          </mat-form-field>
        </div>
        <mat-checkbox formControlName="active">In use (offered for new studies)</mat-checkbox>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        <button mat-flat-button type="submit" [disabled]="busy()" data-testid="instrument-save">Save</button>
      </mat-dialog-actions>
    </form>
  `,
})
export class InstrumentDialog extends CatalogDialog<Instrument, InstrumentBody> {
  protected readonly store = inject(InstrumentsStore);
  protected readonly schema = InstrumentBody;
  protected readonly form = new FormGroup({
    name: new FormControl(this.item?.name ?? '', { nonNullable: true, validators: [Validators.required, Validators.maxLength(120)] }),
    model: text(this.item?.model, 200),
    serial: text(this.item?.serial, 100),
    location: text(this.item?.location, 200),
    active: new FormControl(this.item?.active ?? true, { nonNullable: true }),
  });

  protected body(): InstrumentBody {
    const v = this.form.getRawValue();
    return { name: v.name.trim(), model: v.model.trim(), serial: v.serial.trim(), location: v.location.trim(), active: v.active };
  }
}
