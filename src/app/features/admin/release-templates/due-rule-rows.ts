import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { FormArray, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { STUDY_KIND_LABELS, type StudyKind } from '@shared/schemas';
import { FieldErrorPipe } from '../../../ui/field-error';
import { DueRuleGroup, dueRuleGroup } from '../../releases/requirement-rows/requirement-form';

/** A template's re-verification rules, row by row: a name, the months after go-live and the rule it follows. */
@Component({
  selector: 'app-due-rule-rows',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, FieldErrorPipe],
  template: `
    <ol class="rows" data-testid="due-rule-rows">
      @for (row of rows().controls; track row; let i = $index) {
        <li class="row" [attr.data-testid]="'due-rule-row-' + i">
          <div class="fields">
            <mat-form-field class="label">
              <mat-label>Re-verification {{ i + 1 }}</mat-label>
              <input matInput [formControl]="row.controls.label" maxlength="120" [attr.data-testid]="'due-rule-label-' + i" />
              <mat-error [attr.data-testid]="'due-rule-label-error-' + i">{{ row.controls.label.errors | fieldError: 'A name' }}</mat-error>
            </mat-form-field>
            <mat-form-field class="months">
              <mat-label>Months after go-live</mat-label>
              <input matInput type="number" min="1" max="60" step="1" [formControl]="row.controls.months" [attr.data-testid]="'due-rule-months-' + i" />
              <mat-error [attr.data-testid]="'due-rule-months-error-' + i">{{ row.controls.months.errors | fieldError: 'Months' }}</mat-error>
            </mat-form-field>
            <mat-form-field class="kinds">
              <mat-label>Re-verified by a study of (optional)</mat-label>
              <mat-select multiple [formControl]="row.controls.kinds" [attr.data-testid]="'due-rule-kinds-' + i">
                @for (k of kinds; track k[0]) { <mat-option [value]="k[0]">{{ k[1] }}</mat-option> }
              </mat-select>
            </mat-form-field>
            <mat-form-field class="rule">
              <mat-label>Rule it follows (optional)</mat-label>
              <textarea matInput rows="2" [formControl]="row.controls.rule" maxlength="500" [attr.data-testid]="'due-rule-rule-' + i"></textarea>
              <mat-error>{{ row.controls.rule.errors | fieldError: 'The rule' }}</mat-error>
            </mat-form-field>
            <button mat-icon-button type="button" class="remove" (click)="remove(i)" [attr.aria-label]="'Remove re-verification ' + (i + 1)"
              [attr.data-testid]="'due-rule-remove-' + i">
              <mat-icon>delete</mat-icon>
            </button>
          </div>
          @if (row.controls.key.errors) {
            <p class="field-error" role="alert" [attr.data-testid]="'due-rule-key-error-' + i">{{ row.controls.key.errors | fieldError }}</p>
          }
        </li>
      } @empty {
        <li class="muted none">No re-verification is set due by this change.</li>
      }
    </ol>
    <button mat-stroked-button type="button" (click)="add()" [disabled]="rows().length >= 12" data-testid="due-rule-add">
      <mat-icon>add</mat-icon> Add a re-verification
    </button>
  `,
  styles: `
    .rows { list-style: none; margin: 0 0 8px; padding: 0; }
    .row { border-bottom: 1px solid var(--mat-sys-outline-variant); padding-top: 8px; }
    .fields { display: grid; grid-template-columns: minmax(180px, 2fr) minmax(120px, 1fr) auto; gap: 0 12px; align-items: start; }
    .label { grid-column: 1; grid-row: 1; }
    .months { grid-column: 2; grid-row: 1; }
    .kinds { grid-column: 1 / 3; grid-row: 2; }
    .rule { grid-column: 1 / 3; grid-row: 3; }
    .remove { grid-column: 3; grid-row: 1; margin-top: 8px; }
    .none { padding: 8px 0; }
    @media (max-width: 800px) {
      .fields { grid-template-columns: 1fr auto; }
      .label, .months, .kinds, .rule { grid-column: 1; grid-row: auto; }
      .remove { grid-column: 2; grid-row: 1; }
    }
  `,
})
export class DueRuleRows {
  readonly rows = input.required<FormArray<DueRuleGroup>>();
  protected readonly kinds = Object.entries(STUDY_KIND_LABELS) as [StudyKind, string][];

  protected add(): void {
    this.rows().push(dueRuleGroup());
  }

  protected remove(index: number): void {
    this.rows().removeAt(index);
    this.rows().markAsDirty();
  }
}
