import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, ValidatorFn, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatDialogModule } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { AnalyteBody, type Analyte } from '@shared/schemas/admin.schema';
import { ErrorBanner } from '../../../../ui/error-banner';
import { FieldErrorPipe } from '../../../../ui/field-error';
import { CatalogDialog } from '../../catalog/catalog-dialog';
import { AnalytesStore } from '../analytes-store';
import { formatDecisionLevels, parseDecisionLevels } from '../decision-levels';

const decisionLevelList: ValidatorFn = (control) =>
  parseDecisionLevels(control.value ?? '') === null
    ? { rule: 'Write numbers separated by commas, with a point for decimals, e.g. 5.6, 7.0' }
    : null;

/** Add or edit an analyte: unit, decimals, decision levels and the allowable bias with its source. */
@Component({
  selector: 'app-analyte-dialog',
  templateUrl: './analyte-dialog.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatCheckboxModule, MatButtonModule, ErrorBanner, FieldErrorPipe],
})
export class AnalyteDialog extends CatalogDialog<Analyte, AnalyteBody> {
  protected readonly store = inject(AnalytesStore);
  protected readonly schema = AnalyteBody;
  protected readonly form = new FormGroup({
    name: new FormControl(this.item?.name ?? '', { nonNullable: true, validators: [Validators.required] }),
    unit: new FormControl(this.item?.unit ?? '', { nonNullable: true, validators: [Validators.required] }),
    decimals: new FormControl<number | null>(this.item?.decimals ?? 2, [Validators.required, Validators.min(0), Validators.max(6)]),
    decisionLevels: new FormControl(formatDecisionLevels(this.item?.decisionLevels ?? []), { nonNullable: true, validators: [decisionLevelList] }),
    allowableBiasAbsolute: new FormControl<number | null>(this.item?.allowableBiasAbsolute ?? null),
    allowableBiasPercent: new FormControl<number | null>(this.item?.allowableBiasPercent ?? null),
    allowableBiasSource: new FormControl(this.item?.allowableBiasSource ?? '', { nonNullable: true, validators: [Validators.required] }),
    canBeNegative: new FormControl(this.item?.canBeNegative ?? false, { nonNullable: true }),
    active: new FormControl(this.item?.active ?? true, { nonNullable: true }),
  });

  protected body(): AnalyteBody {
    const v = this.form.getRawValue();
    return {
      name: v.name.trim(),
      unit: v.unit.trim(),
      decimals: v.decimals ?? Number.NaN,
      decisionLevels: parseDecisionLevels(v.decisionLevels) ?? [],
      allowableBiasAbsolute: v.allowableBiasAbsolute,
      allowableBiasPercent: v.allowableBiasPercent,
      allowableBiasSource: v.allowableBiasSource.trim(),
      canBeNegative: v.canBeNegative,
      active: v.active,
    };
  }
}
