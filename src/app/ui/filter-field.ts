import { ChangeDetectionStrategy, Component, input, model } from '@angular/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';

/** A search box over a table: `<app-filter-field [(value)]="view.filter" label="Filter users" />`. */
@Component({
  selector: 'app-filter-field',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatFormFieldModule, MatInputModule, MatIconModule],
  template: `
    <mat-form-field class="filter" subscriptSizing="dynamic">
      <mat-label>{{ label() }}</mat-label>
      <mat-icon matPrefix aria-hidden="true">search</mat-icon>
      <input matInput type="search" [value]="value()" (input)="value.set($any($event.target).value)" data-testid="filter" />
      @if (hint()) {
        <mat-hint>{{ hint() }}</mat-hint>
      }
    </mat-form-field>
  `,
  styles: `
    .filter {
      width: min(360px, 100%);
    }
  `,
})
export class FilterField {
  readonly value = model('');
  readonly label = input('Filter');
  readonly hint = input('');
}
