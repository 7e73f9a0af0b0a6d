import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { DayDates } from '../../../ui/day-dates';
import { labZone } from '../../../ui/lab-time';
import { DATE_ORDER_ERROR, rangeBackwards } from '../date-range';

/** One choice of a chooser, with an optional icon. */
export interface SearchChoice { value: string; label: string; icon?: string }
/** One chooser of a search form: its field, the id its test id ends with, its label, the words for "not searched", its choices. */
export interface SearchChooser { key: string; id: string; label: string; any: string; choices: SearchChoice[] }
/** A from–to range of the laboratory's days: its two fields, the id its test ids carry, and its legend. */
export interface DayRange { from: string; to: string; id: string; legend: string }

/**
 * The fields of a list's search form (the archive, the releases): the words box (`q`), the choosers, the day ranges
 * (with the order check's words) and "Clear the search". The owner keeps the form, its checks and the address in step;
 * test ids are `<prefix>-q`, `<prefix>-<chooser id>`, `<prefix>-<range id>-from|to` and `<prefix>-clear`.
 */
@Component({
  selector: 'app-search-filters',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatButtonModule, MatIconModule, DayDates],
  templateUrl: './search-filters.html',
  styleUrl: './search-filters.scss',
})
export class SearchFilters {
  readonly form = input.required<FormGroup>();
  /** What the search form searches, for screen readers ("Search the archive"). */
  readonly label = input.required<string>();
  /** The words box's label. */
  readonly textLabel = input.required<string>();
  readonly prefix = input.required<string>();
  readonly choosers = input<readonly SearchChooser[]>([]);
  readonly ranges = input<readonly DayRange[]>([]);

  /** Date filters mean the laboratory's days. */
  protected readonly zone = labZone();
  protected readonly orderError = DATE_ORDER_ERROR;

  protected backwards(fromKey: string): boolean {
    return rangeBackwards(this.form(), fromKey);
  }

  protected clear(): void {
    this.form().reset();
  }
}
