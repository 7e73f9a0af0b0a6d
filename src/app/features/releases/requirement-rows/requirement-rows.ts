import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { FormArray, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { STUDY_KIND_LABELS } from '@shared/schemas';
import { FieldErrorPipe } from '../../../ui/field-error';
import { RequirementGroup, requirementGroup } from './requirement-form';

/**
 * The requirements of a change, edited row by row: a name, the kinds of study that meet it and the rule it follows.
 * Used by the administrator's templates and by a director's own requirements for an other change.
 */
@Component({
  selector: 'app-requirement-rows',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, FieldErrorPipe],
  template: `
    <ol class="rows" data-testid="requirement-rows">
      @for (row of rows().controls; track row; let i = $index) {
        <li class="row" [attr.data-testid]="'requirement-row-' + i">
          <div class="fields">
            <mat-form-field class="label">
              <mat-label>Requirement {{ i + 1 }}</mat-label>
              <input matInput [formControl]="row.controls.label" maxlength="120" [attr.data-testid]="'requirement-label-' + i" />
              <mat-error [attr.data-testid]="'requirement-label-error-' + i">{{ row.controls.label.errors | fieldError: 'A name' }}</mat-error>
            </mat-form-field>
            <mat-form-field class="kinds">
              <mat-label>Met by a signed study of</mat-label>
              <mat-select multiple [formControl]="row.controls.kinds" [attr.data-testid]="'requirement-kinds-' + i">
                @for (k of kinds; track k[0]) { <mat-option [value]="k[0]">{{ k[1] }}</mat-option> }
              </mat-select>
              <mat-error [attr.data-testid]="'requirement-kinds-error-' + i">{{ row.controls.kinds.errors | fieldError: 'A kind' }}</mat-error>
            </mat-form-field>
            <mat-form-field class="rule">
              <mat-label>Rule it follows (optional)</mat-label>
              <textarea matInput rows="2" [formControl]="row.controls.rule" maxlength="500" [attr.data-testid]="'requirement-rule-' + i"></textarea>
              <mat-error>{{ row.controls.rule.errors | fieldError: 'The rule' }}</mat-error>
            </mat-form-field>
            <button mat-icon-button type="button" class="remove" (click)="remove(i)" [attr.aria-label]="'Remove requirement ' + (i + 1)"
              [attr.data-testid]="'requirement-remove-' + i">
              <mat-icon>delete</mat-icon>
            </button>
          </div>
          @if (row.controls.key.errors) {
            <p class="field-error" role="alert" [attr.data-testid]="'requirement-key-error-' + i">{{ row.controls.key.errors | fieldError }}</p>
          }
        </li>
      } @empty {
        <li class="muted none">No requirements yet.</li>
      }
    </ol>
    <button mat-stroked-button type="button" (click)="add()" [disabled]="rows().length >= max" data-testid="requirement-add">
      <mat-icon>add</mat-icon> Add a requirement
    </button>
  `,
  styles: `
    .rows { list-style: none; margin: 0 0 8px; padding: 0; }
    .row { border-bottom: 1px solid var(--mat-sys-outline-variant); padding-top: 8px; }
    .fields { display: grid; grid-template-columns: minmax(180px, 1fr) minmax(180px, 1fr) auto; gap: 0 12px; align-items: start; }
    .label { grid-column: 1; grid-row: 1; }
    .kinds { grid-column: 2; grid-row: 1; }
    .rule { grid-column: 1 / 3; grid-row: 2; }
    .remove { grid-column: 3; grid-row: 1; margin-top: 8px; }
    .none { padding: 8px 0; }
    @media (max-width: 800px) {
      .fields { grid-template-columns: 1fr auto; }
      .label, .kinds, .rule { grid-column: 1; grid-row: auto; }
      .remove { grid-column: 2; grid-row: 1; }
    }
  `,
})
export class RequirementRows {
  readonly rows = input.required<FormArray<RequirementGroup>>();
  protected readonly kinds = Object.entries(STUDY_KIND_LABELS);
  protected readonly max = 12;

  protected add(): void {
    this.rows().push(requirementGroup());
  }

  protected remove(index: number): void {
    this.rows().removeAt(index);
    this.rows().markAsDirty();
  }
}
