import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { UpdateReleaseBody, type Release } from '@shared/schemas';
import { ErrorBanner } from '../../../ui/error-banner';
import { FieldErrorPipe } from '../../../ui/field-error';
import { schemaRule } from '../../../ui/schema-rule';
import { DialogSend } from '../../signoff/dialogs/dialog-send';
import { ReleaseApi } from '../release-api';
import { requirementArray, requirementsOf } from '../requirement-rows/requirement-form';
import { RequirementRows } from '../requirement-rows/requirement-rows';

export interface EditReleaseData {
  release: Release;
  /** A director may change the requirements of an other change (the templates decide the rest). */
  editRequirements: boolean;
}

/** Changes an open release's title, reagent lot and note (and, for an other change, a director's requirements). */
@Component({
  selector: 'app-edit-release-dialog',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, ErrorBanner, FieldErrorPipe, RequirementRows],
  template: `
    <h2 mat-dialog-title>Edit the release</h2>
    <mat-dialog-content>
      <app-error-banner [message]="sender.problem()" />
      <form [formGroup]="form" (ngSubmit)="save()" id="edit-release-form" novalidate>
        <mat-form-field class="full-width">
          <mat-label>Title</mat-label>
          <input matInput formControlName="title" maxlength="200" data-testid="edit-title" />
          <mat-error>{{ form.controls.title.errors | fieldError: 'A title' }}</mat-error>
        </mat-form-field>
        <mat-form-field class="full-width">
          <mat-label>Reagent lot (optional)</mat-label>
          <input matInput formControlName="reagentLot" maxlength="100" data-testid="edit-lot" />
          <mat-error>{{ form.controls.reagentLot.errors | fieldError: 'The lot' }}</mat-error>
        </mat-form-field>
        <mat-form-field class="full-width">
          <mat-label>Note (optional)</mat-label>
          <textarea matInput rows="2" formControlName="note" maxlength="2000" data-testid="edit-note"></textarea>
          <mat-error>{{ form.controls.note.errors | fieldError: 'The note' }}</mat-error>
        </mat-form-field>
        @if (data.editRequirements) {
          <h3>Requirements</h3>
          <p class="muted">A requirement taken out unlinks its studies from this release; the studies themselves stay.</p>
          <app-requirement-rows [rows]="form.controls.requirements" />
        }
      </form>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" mat-dialog-close [disabled]="sender.busy()">Cancel</button>
      <button mat-flat-button type="submit" form="edit-release-form" [disabled]="sender.busy()" data-testid="edit-save">Save</button>
    </mat-dialog-actions>
  `,
})
export class EditReleaseDialog {
  protected readonly data = inject<EditReleaseData>(MAT_DIALOG_DATA);
  private readonly api = inject(ReleaseApi);
  protected readonly sender = new DialogSend<Release>(inject<MatDialogRef<EditReleaseDialog, Release>>(MatDialogRef));
  private readonly release = this.data.release;
  protected readonly form = new FormGroup({
    title: new FormControl(this.release.title, { nonNullable: true, validators: [schemaRule(UpdateReleaseBody.shape.title)] }),
    reagentLot: new FormControl(this.release.reagentLot, { nonNullable: true, validators: [Validators.maxLength(100)] }),
    note: new FormControl(this.release.note, { nonNullable: true, validators: [Validators.maxLength(2000)] }),
    requirements: requirementArray(this.data.editRequirements ? this.release.requirements : []),
  });

  protected save(): void {
    const v = this.form.getRawValue();
    const body: UpdateReleaseBody = {
      version: this.release.version,
      title: v.title.trim(),
      reagentLot: v.reagentLot.trim(),
      note: v.note.trim(),
      ...(this.data.editRequirements ? { requirements: requirementsOf(this.form.controls.requirements) } : {}),
    };
    this.sender.send(this.form, () => this.api.update(this.release.id, body));
  }
}
