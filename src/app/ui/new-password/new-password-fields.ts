import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { FieldErrorPipe } from '../field-error';
import { NewPasswordGroup } from './new-password-group';

/** The "new password" and "repeat it" fields, with the rules spelled out under the first. */
@Component({
  selector: 'app-new-password-fields',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, FieldErrorPipe],
  template: `
    <ng-container [formGroup]="group()">
      <mat-form-field class="full-width">
        <mat-label>{{ label() }}</mat-label>
        <input matInput type="password" formControlName="password" autocomplete="new-password" data-testid="new-password" />
        <mat-hint>At least 12 characters; not a well-known password.</mat-hint>
        <mat-error>{{ group().controls.password.errors | fieldError: 'A password' }}</mat-error>
      </mat-form-field>
      <mat-form-field class="full-width repeat">
        <mat-label>Repeat the password</mat-label>
        <input matInput type="password" formControlName="repeat" autocomplete="new-password" data-testid="repeat-password" />
        <mat-error>{{ group().controls.repeat.errors | fieldError: 'The repeated password' }}</mat-error>
      </mat-form-field>
    </ng-container>
  `,
  styles: `
    .repeat {
      margin-top: 12px;
    }
  `,
})
export class NewPasswordFields {
  readonly group = input.required<NewPasswordGroup>();
  readonly label = input('New password');
}
