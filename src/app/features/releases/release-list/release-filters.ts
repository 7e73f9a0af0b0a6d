import { ChangeDetectionStrategy, Component, computed, inject, input, output } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { catchError, of } from 'rxjs';
import { CHANGE_TYPE_LABELS, RELEASE_STATE_LABELS } from '../../../../../shared/schemas';
import { DayDates } from '../../../ui/day-dates';
import { labZone } from '../../../ui/lab-time';
import { DATE_ORDER_ERROR, datesInOrder, rangeBackwards } from '../../archive/date-range';
import { syncForm } from '../../archive/form-sync';
import { StudyCatalogApi } from '../../studies/api/catalog-api';
import { ReleaseFilter } from '../release-query';

const BLANK = { q: '', changeType: '', state: '', analyteId: '', instrumentId: '', signedFrom: '', signedTo: '' };
type Field = keyof typeof BLANK;

interface Choice { value: string; label: string }
interface Chooser { key: Field; id: string; label: string; any: string; choices: Choice[] }

const pairs = (labels: Record<string, string>): Choice[] => Object.entries(labels).map(([value, label]) => ({ value, label }));

/** The releases search form: typing and choosing search at once (after a short pause); the address keeps the search. */
@Component({
  selector: 'app-release-filters',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatButtonModule, MatIconModule, DayDates],
  templateUrl: './release-filters.html',
  styleUrl: '../../archive/archive-filters/archive-filters.scss',
})
export class ReleaseFilters {
  /** The search in force (from the address). */
  readonly filter = input.required<ReleaseFilter>();
  /** A new search: every field of the form (the page keeps its own sort and page size). */
  readonly changed = output<ReleaseFilter>();

  protected readonly zone = labZone();
  private readonly catalog = toSignal(inject(StudyCatalogApi).catalog().pipe(catchError(() => of(null))), { initialValue: null });
  protected readonly choosers = computed<Chooser[]>(() => [
    { key: 'changeType', id: 'change-type', label: 'Change', any: 'Any change', choices: pairs(CHANGE_TYPE_LABELS) },
    { key: 'state', id: 'state', label: 'State', any: 'Any state', choices: pairs(RELEASE_STATE_LABELS) },
    {
      key: 'analyteId', id: 'analyte', label: 'Analyte', any: 'Any analyte',
      choices: (this.catalog()?.analytes ?? []).map((a) => ({ value: String(a.id), label: `${a.name} (${a.unit})` })),
    },
    {
      key: 'instrumentId', id: 'instrument', label: 'Instrument', any: 'Any instrument',
      choices: (this.catalog()?.instruments ?? []).map((i) => ({ value: String(i.id), label: i.name })),
    },
  ]);
  protected readonly orderError = DATE_ORDER_ERROR;
  protected readonly form = inject(FormBuilder).nonNullable.group(BLANK, { validators: [datesInOrder('signedFrom', 'signedTo')] });

  constructor() {
    syncForm(this.form, BLANK, () => this.filter(), (search: ReleaseFilter) => this.changed.emit(search), ['analyteId', 'instrumentId']);
  }

  protected backwards(): boolean {
    return rangeBackwards(this.form, 'signedFrom');
  }

  protected clear(): void {
    this.form.reset();
  }
}
