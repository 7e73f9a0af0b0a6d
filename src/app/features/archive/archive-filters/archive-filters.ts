import { ChangeDetectionStrategy, Component, inject, input, output } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { catchError, of } from 'rxjs';
import { STUDY_KIND_LABELS, STUDY_STATE_LABELS } from '../../../../../shared/schemas';
import { ArchiveApi } from '../archive-api';
import { ArchiveFilter } from '../archive-query';
import { DATE_ORDER_ERROR, datesInOrder, rangeBackwards } from '../date-range';
import { syncForm } from '../form-sync';
import { VERDICT_CHOICES } from '../verdict-view';

const BLANK = { q: '', kind: '', analyteId: '', instrumentId: '', state: '', verdict: '', signedFrom: '', signedTo: '', createdFrom: '', createdTo: '' };

/** The archive's search form: typing and choosing search at once (after a short pause); the address keeps the search. */
@Component({
  selector: 'app-archive-filters',
  templateUrl: './archive-filters.html',
  styleUrl: './archive-filters.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatButtonModule, MatIconModule],
})
export class ArchiveFilters {
  /** The search in force (from the address). */
  readonly filter = input.required<ArchiveFilter>();
  /** A new search: every field of the form (the page keeps its own sort and page size). */
  readonly changed = output<ArchiveFilter>();

  private readonly api = inject(ArchiveApi);
  protected readonly analytes = toSignal(this.api.analytes().pipe(catchError(() => of([]))), { initialValue: [] });
  protected readonly instruments = toSignal(this.api.instruments().pipe(catchError(() => of([]))), { initialValue: [] });
  protected readonly kinds = Object.entries(STUDY_KIND_LABELS);
  protected readonly states = Object.entries(STUDY_STATE_LABELS);
  protected readonly verdicts = VERDICT_CHOICES;
  protected readonly orderError = DATE_ORDER_ERROR;
  protected readonly form = inject(FormBuilder).nonNullable.group(BLANK, {
    validators: [datesInOrder('signedFrom', 'signedTo'), datesInOrder('createdFrom', 'createdTo')],
  });

  constructor() {
    syncForm(this.form, BLANK, () => this.filter(), (search: ArchiveFilter) => this.changed.emit(search), ['analyteId', 'instrumentId']);
  }

  protected backwards(fromKey: 'signedFrom' | 'createdFrom'): boolean {
    return rangeBackwards(this.form, fromKey);
  }

  protected clear(): void {
    this.form.reset();
  }
}
