import { ChangeDetectionStrategy, Component, computed, effect, inject, untracked } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSortModule, Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { Subject, catchError, debounceTime, distinctUntilChanged, map, of } from 'rxjs';
import { STUDY_KIND_LABELS, STUDY_STATE_LABELS, StudyListQuery, type StudySummary } from '@shared/schemas';
import { AuthStore } from '../../../core/auth/auth-store';
import { DayDates } from '../../../ui/day-dates';
import { ErrorBanner } from '../../../ui/error-banner';
import { PrintLayout } from '../print-layout';
import { StudyCatalogApi } from '../api/catalog-api';
import type { StudyQuery } from '../api/studies-api';
import { laboratoryTime } from '@shared/types/lab-time';
import { FINDINGS_LABELS, kindLabel, stateLabel } from '../study-text';
import { DEFAULT_PAGE_SIZE, paramsFromQuery, queryFromParams, withFilter } from './study-query';
import { StudyListStore } from './study-list-store';

/** Studies: every study of the laboratory, filtered, sorted and paged by the server; the address holds the query. */
@Component({
  selector: 'app-study-list-page',
  templateUrl: './study-list-page.html',
  styleUrl: './study-list-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  providers: [StudyListStore],
  imports: [
    MatTableModule, MatSortModule, MatPaginatorModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatButtonModule,
    MatIconModule, MatProgressBarModule, RouterLink, ErrorBanner, PrintLayout, DayDates,
  ],
})
export class StudyListPage {
  protected readonly store = inject(StudyListStore);
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly auth = inject(AuthStore);
  protected readonly catalog = toSignal(inject(StudyCatalogApi).catalog().pipe(catchError(() => of(null))));
  protected readonly query = toSignal(this.route.queryParamMap.pipe(map((p) => queryFromParams(Object.fromEntries(p.keys.map((k) => [k, p.get(k) ?? undefined]))))), {
    initialValue: {} as StudyQuery,
  });
  protected readonly canCreate = computed(() => this.auth.hasAnyRole(['technologist', 'director']));
  protected readonly columns = ['title', 'kind', 'analyte', 'instruments', 'n', 'state', 'findings', 'updatedAt'];
  protected readonly kinds = Object.entries(STUDY_KIND_LABELS);
  protected readonly states = Object.entries(STUDY_STATE_LABELS);
  protected readonly kindText = kindLabel;
  protected readonly stateText = stateLabel;
  protected readonly findingsText = (s: StudySummary): string => FINDINGS_LABELS[s.findings];
  protected readonly pageSize = computed(() => this.query().pageSize ?? DEFAULT_PAGE_SIZE);
  protected readonly pageIndex = computed(() => (this.query().page ?? 1) - 1);
  protected readonly sort = computed(() => ({ active: this.query().sort ?? 'updatedAt', direction: this.query().order ?? 'desc' }));
  protected readonly timeZone = computed(() => this.auth.user()?.laboratory.timeZone ?? 'UTC');
  private readonly text = new Subject<string>();

  constructor() {
    effect(() => {
      const query = this.query();
      untracked(() => this.store.load(query));
    });
    this.text.pipe(debounceTime(300), distinctUntilChanged(), takeUntilDestroyed()).subscribe((q) => this.filter({ q: q.trim() || undefined }));
  }

  protected when(study: StudySummary): string {
    return laboratoryTime(study.updatedAt, this.timeZone(), { zone: false });
  }

  protected typed(value: string): void {
    this.text.next(value);
  }

  protected filter(change: StudyQuery): void {
    this.go(withFilter(this.query(), change));
  }

  protected sorted(sort: Sort): void {
    const active = StudyListQuery.shape.sort.safeParse(sort.active);
    this.go({ ...this.query(), sort: sort.direction && active.success ? active.data : undefined, order: sort.direction || undefined, page: undefined });
  }

  protected paged(event: PageEvent): void {
    this.go({ ...this.query(), page: event.pageIndex + 1, pageSize: event.pageSize === DEFAULT_PAGE_SIZE ? undefined : event.pageSize });
  }

  protected clear(): void {
    void this.router.navigate([], { relativeTo: this.route, queryParams: {} });
  }

  protected open(study: StudySummary): void {
    void this.router.navigate(['/studies', study.id]);
  }

  private go(query: StudyQuery): void {
    void this.router.navigate([], { relativeTo: this.route, queryParams: paramsFromQuery(query), queryParamsHandling: 'merge' });
  }
}
