import { ChangeDetectionStrategy, Component, computed, inject, input, output } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { catchError, of } from 'rxjs';
import { STUDY_KIND_LABELS, STUDY_STATE_LABELS } from '../../../../../shared/schemas';
import { DayDates } from '../../../ui/day-dates';
import { labZone } from '../../../ui/lab-time';
import { ArchiveApi } from '../archive-api';
import { ArchiveFilter } from '../archive-query';
import { DATE_ORDER_ERROR, datesInOrder, rangeBackwards } from '../date-range';
import { syncForm } from '../form-sync';
import { VERDICT_CHOICES } from '../verdict-view';

const BLANK = { q: '', kind: '', analyteId: '', instrumentId: '', state: '', verdict: '', signerId: '', signedFrom: '', signedTo: '', createdFrom: '', createdTo: '' };
type Field = keyof typeof BLANK;

interface Choice { value: string; label: string; icon?: string }
/** One chooser of the form: its field, its label, the words for "not searched", and its choices. */
interface Chooser { key: Field; id: string; label: string; any: string; choices: Choice[] }

const pairs = (labels: Record<string, string>): Choice[] => Object.entries(labels).map(([value, label]) => ({ value, label }));
const RANGES = [
  { from: 'signedFrom', to: 'signedTo', id: 'signed', legend: 'Signed between' },
  { from: 'createdFrom', to: 'createdTo', id: 'created', legend: 'Created between' },
] as const;

/** The archive's search form: typing and choosing search at once (after a short pause); the address keeps the search. */
@Component({
  selector: 'app-archive-filters',
  templateUrl: './archive-filters.html',
  styleUrl: './archive-filters.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatButtonModule, MatIconModule, DayDates],
})
export class ArchiveFilters {
  /** The search in force (from the address). */
  readonly filter = input.required<ArchiveFilter>();
  /** A new search: every field of the form (the page keeps its own sort and page size). */
  readonly changed = output<ArchiveFilter>();

  private readonly api = inject(ArchiveApi);
  /** Date filters mean the laboratory's days. */
  protected readonly zone = labZone();
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
  protected readonly orderError = DATE_ORDER_ERROR;
  protected readonly form = inject(FormBuilder).nonNullable.group(BLANK, {
    validators: RANGES.map((r) => datesInOrder(r.from, r.to)),
  });

  constructor() {
    syncForm(this.form, BLANK, () => this.filter(), (search: ArchiveFilter) => this.changed.emit(search), ['analyteId', 'instrumentId', 'signerId']);
  }

  protected backwards(fromKey: Field): boolean {
    return rangeBackwards(this.form, fromKey);
  }

  protected clear(): void {
    this.form.reset();
  }
}
