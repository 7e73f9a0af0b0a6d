import { ChangeDetectionStrategy, Component, computed, effect, inject, untracked } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { catchError, of } from 'rxjs';
import { ArchiveApi } from '../archive-api';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import type { AuditQuery } from '@shared/schemas';
import { DayDates } from '../../../ui/day-dates';
import { ErrorBanner } from '../../../ui/error-banner';
import { labZone } from '../../../ui/lab-time';
import { PluralPipe } from '../../../ui/plural';
import { DATE_ORDER_ERROR, datesInOrder, rangeBackwards } from '../date-range';
import { syncForm } from '../form-sync';
import { ACTION_CHOICES } from '../history-actions';
import type { HistoryFilter } from '../history-api';
import { HistoryTimeline } from '../history-timeline/history-timeline';
import { HistoryRecheck } from './history-recheck';
import { withChange } from '../query-params';
import { routeQuery } from '../route-query';
import { HISTORY_KEYS, HISTORY_PAGE_SIZE, historyFilterFrom } from './history-query';
import { LabHistoryStore } from './lab-history-store';

const BLANK = { userId: '', action: '', studyId: '', from: '', to: '' };

/** History: everything recorded in the laboratory, newest first, filtered by what happened, study and dates. */
@Component({
  selector: 'app-lab-history-page',
  templateUrl: './lab-history-page.html',
  styleUrls: ['./lab-history-page.scss', '../print.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
  providers: [LabHistoryStore],
  imports: [
    ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatButtonModule, MatIconModule, MatPaginatorModule,
    MatProgressBarModule, ErrorBanner, HistoryTimeline, HistoryRecheck, PluralPipe, DayDates,
  ],
})
export class LabHistoryPage {
  protected readonly store = inject(LabHistoryStore);
  private readonly address = routeQuery<AuditQuery, (typeof HISTORY_KEYS)[number]>(historyFilterFrom, HISTORY_KEYS);
  protected readonly filter = this.address.query;
  protected readonly choices = ACTION_CHOICES;
  protected readonly people = toSignal(inject(ArchiveApi).people().pipe(catchError(() => of([]))), { initialValue: [] });
  protected readonly orderError = DATE_ORDER_ERROR;
  /** Date filters and times are the laboratory's. */
  protected readonly zone = labZone();
  protected readonly form = inject(FormBuilder).nonNullable.group(BLANK, { validators: [datesInOrder('from', 'to')] });
  protected readonly pageSize = computed(() => this.filter().pageSize ?? HISTORY_PAGE_SIZE);
  protected readonly pageIndex = computed(() => (this.filter().page ?? 1) - 1);

  constructor() {
    effect(() => {
      const filter = { pageSize: HISTORY_PAGE_SIZE, ...this.filter() };
      untracked(() => this.store.search(filter));
    });
    syncForm(this.form, BLANK, () => this.filter(), (search: HistoryFilter) => this.searched(search), ['studyId', 'userId']);
  }

  protected backwards(): boolean {
    return rangeBackwards(this.form, 'from');
  }

  protected searched(fields: HistoryFilter): void {
    this.go(withChange<AuditQuery>({ pageSize: this.filter().pageSize }, fields));
  }

  protected paged(event: PageEvent): void {
    this.go({ ...this.filter(), page: event.pageIndex + 1, pageSize: event.pageSize === HISTORY_PAGE_SIZE ? undefined : event.pageSize });
  }

  /** Reads the page again (a re-check added an event to the history). */
  protected reread(): void {
    this.store.search({ pageSize: HISTORY_PAGE_SIZE, ...this.filter() });
  }

  protected clear(): void {
    this.form.reset();
  }

  private go(filter: HistoryFilter): void {
    this.address.go(filter);
  }
}
