import { DestroyRef, Injectable, computed, inject, signal } from '@angular/core';
import { Subject, catchError, map, of, switchMap, tap } from 'rxjs';
import type { StudySummary } from '@shared/schemas';
import { ApiError } from '../../../core/http/api-error';
import { StudiesApi, StudyQuery } from '../api/studies-api';

interface StudyListState {
  items: StudySummary[];
  total: number;
  loading: boolean;
  error: string | null;
}

/** One page of the laboratory's studies, as the server filters, sorts and pages them; a newer query cancels an older one. */
@Injectable()
export class StudyListStore {
  private readonly api = inject(StudiesApi);
  private readonly state = signal<StudyListState>({ items: [], total: 0, loading: false, error: null });
  private readonly queries = new Subject<StudyQuery>();

  readonly items = computed(() => this.state().items);
  readonly total = computed(() => this.state().total);
  readonly loading = computed(() => this.state().loading);
  readonly error = computed(() => this.state().error);

  constructor() {
    const subscription = this.queries
      .pipe(
        tap(() => this.state.update((s) => ({ ...s, loading: true, error: null }))),
        switchMap((query) =>
          this.api.list(query).pipe(
            map((page) => ({ items: page.items, total: page.total, loading: false, error: null })),
            catchError((err: ApiError) => of({ ...this.state(), loading: false, error: err.message })),
          ),
        ),
      )
      .subscribe((next) => this.state.set(next));
    inject(DestroyRef).onDestroy(() => subscription.unsubscribe());
  }

  load(query: StudyQuery): void {
    this.queries.next(query);
  }
}
