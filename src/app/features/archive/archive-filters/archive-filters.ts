import { ChangeDetectionStrategy, Component, computed, inject, input, output } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormBuilder } from '@angular/forms';
import { catchError, of } from 'rxjs';
import { STUDY_KIND_LABELS, STUDY_STATE_LABELS } from '@shared/schemas';
import { ArchiveApi } from '../archive-api';
import { ArchiveFilter } from '../archive-query';
import { datesInOrder } from '../date-range';
import { syncForm } from '../form-sync';
import { DayRange, SearchChoice, SearchFilters } from '../search-filters/search-filters';
import { VERDICT_CHOICES } from '../verdict-view';

const BLANK = { q: '', kind: '', analyteId: '', instrumentId: '', state: '', verdict: '', signerId: '', signedFrom: '', signedTo: '', createdFrom: '', createdTo: '' };
type Field = keyof typeof BLANK;

/** One chooser of the form, on one of its fields. */
interface Chooser { key: Field; id: string; label: string; any: string; choices: SearchChoice[] }

const pairs = (labels: Record<string, string>): SearchChoice[] => Object.entries(labels).map(([value, label]) => ({ value, label }));
const RANGES = [
  { from: 'signedFrom', to: 'signedTo', id: 'signed', legend: 'Signed between' },
  { from: 'createdFrom', to: 'createdTo', id: 'created', legend: 'Created between' },
] as const satisfies readonly DayRange[];

/** The archive's search form: typing and choosing search at once (after a short pause); the address keeps the search. */
@Component({
  selector: 'app-archive-filters',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [SearchFilters],
  template: `
    <app-search-filters [form]="form" label="Search the archive" textLabel="Title, purpose or verification code" prefix="archive"
      [choosers]="choosers()" [ranges]="ranges" />
  `,
})
export class ArchiveFilters {
  /** The search in force (from the address). */
  readonly filter = input.required<ArchiveFilter>();
  /** A new search: every field of the form (the page keeps its own sort and page size). */
  readonly changed = output<ArchiveFilter>();

  private readonly api = inject(ArchiveApi);
  protected readonly analytes = toSignal(this.api.analytes().pipe(catchError(() => of([]))), { initialValue: [] });
  protected readonly instruments = toSignal(this.api.instruments().pipe(catchError(() => of([]))), { initialValue: [] });
  protected readonly people = toSignal(this.api.people().pipe(catchError(() => of([]))), { initialValue: [] });
  protected readonly choosers = computed<Chooser[]>(() => [
    { key: 'kind', id: 'kind', label: 'Kind', any: 'Any kind', choices: pairs(STUDY_KIND_LABELS) },
    {
      key: 'analyteId', id: 'analyte', label: 'Analyte', any: 'Any analyte',
      choices: this.analytes().map((a) => ({ value: String(a.id), label: `${a.name} (${a.unit})` })),
    },
    {
      key: 'instrumentId', id: 'instrument', label: 'Instrument', any: 'Any instrument',
      choices: this.instruments().map((i) => ({ value: String(i.id), label: i.name })),
    },
    { key: 'state', id: 'state', label: 'State', any: 'Any state', choices: pairs(STUDY_STATE_LABELS) },
    { key: 'verdict', id: 'verdict', label: 'Verdict', any: 'Any verdict', choices: VERDICT_CHOICES.map((v) => ({ value: v.key, label: v.word, icon: v.icon })) },
    { key: 'signerId', id: 'signer', label: 'Signed by', any: 'Anyone', choices: this.people().map((p) => ({ value: String(p.id), label: p.name })) },
  ]);
  protected readonly ranges = RANGES;
  protected readonly form = inject(FormBuilder).nonNullable.group(BLANK, {
    validators: RANGES.map((r) => datesInOrder(r.from, r.to)),
  });

  constructor() {
    syncForm(this.form, BLANK, () => this.filter(), (search: ArchiveFilter) => this.changed.emit(search), ['analyteId', 'instrumentId', 'signerId']);
  }
}
