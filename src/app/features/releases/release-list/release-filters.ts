import { ChangeDetectionStrategy, Component, computed, inject, input, output } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormBuilder } from '@angular/forms';
import { catchError, of } from 'rxjs';
import { CHANGE_TYPE_LABELS, RELEASE_STATE_LABELS } from '@shared/schemas';
import { datesInOrder } from '../../archive/date-range';
import { syncForm } from '../../archive/form-sync';
import { DayRange, SearchChoice, SearchFilters } from '../../archive/search-filters/search-filters';
import { StudyCatalogApi } from '../../studies/api/catalog-api';
import { ReleaseFilter } from '../release-query';

const BLANK = { q: '', changeType: '', state: '', analyteId: '', instrumentId: '', signedFrom: '', signedTo: '' };
type Field = keyof typeof BLANK;

/** One chooser of the form, on one of its fields (its test id is "release-filter-…"). */
interface Chooser { key: Field; id: `filter-${string}`; label: string; any: string; choices: SearchChoice[] }

const pairs = (labels: Record<string, string>): SearchChoice[] => Object.entries(labels).map(([value, label]) => ({ value, label }));
const RANGES = [{ from: 'signedFrom', to: 'signedTo', id: 'signed', legend: 'Signed between' }] as const satisfies readonly DayRange[];

/** The releases search form: typing and choosing search at once (after a short pause); the address keeps the search. */
@Component({
  selector: 'app-release-filters',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [SearchFilters],
  template: `
    <app-search-filters [form]="form" label="Search the releases" textLabel="Title, lot or code" prefix="release"
      [choosers]="choosers()" [ranges]="ranges" />
  `,
})
export class ReleaseFilters {
  /** The search in force (from the address). */
  readonly filter = input.required<ReleaseFilter>();
  /** A new search: every field of the form (the page keeps its own sort and page size). */
  readonly changed = output<ReleaseFilter>();

  private readonly catalog = toSignal(inject(StudyCatalogApi).catalog().pipe(catchError(() => of(null))), { initialValue: null });
  protected readonly choosers = computed<Chooser[]>(() => [
    { key: 'changeType', id: 'filter-change-type', label: 'Change', any: 'Any change', choices: pairs(CHANGE_TYPE_LABELS) },
    { key: 'state', id: 'filter-state', label: 'State', any: 'Any state', choices: pairs(RELEASE_STATE_LABELS) },
    {
      key: 'analyteId', id: 'filter-analyte', label: 'Analyte', any: 'Any analyte',
      choices: (this.catalog()?.analytes ?? []).map((a) => ({ value: String(a.id), label: `${a.name} (${a.unit})` })),
    },
    {
      key: 'instrumentId', id: 'filter-instrument', label: 'Instrument', any: 'Any instrument',
      choices: (this.catalog()?.instruments ?? []).map((i) => ({ value: String(i.id), label: i.name })),
    },
  ]);
  protected readonly ranges = RANGES;
  protected readonly form = inject(FormBuilder).nonNullable.group(BLANK, { validators: RANGES.map((r) => datesInOrder(r.from, r.to)) });

  constructor() {
    syncForm(this.form, BLANK, () => this.filter(), (search: ReleaseFilter) => this.changed.emit(search), ['analyteId', 'instrumentId']);
  }
}
