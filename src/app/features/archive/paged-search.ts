import { DestroyRef, Signal, computed, inject, signal } from '@angular/core';
import { Observable, Subject, catchError, map, of, switchMap, tap } from 'rxjs';
import { ApiError } from '../../core/http/api-error';

interface PageState<T> {
  items: T[];
  total: number;
  loading: boolean;
  error: string | null;
}

/**
 * One page of a server-side search: the items, the total, loading and the server's words on failure.
 * A newer search cancels an older one. Create it in an injection context (a store's constructor).
 */
export class PagedSearch<F, T> {
  private readonly state = signal<PageState<T>>({ items: [], total: 0, loading: false, error: null });
  private readonly searches = new Subject<F>();

  readonly items: Signal<T[]> = computed(() => this.state().items);
  readonly total = computed(() => this.state().total);
  readonly loading = computed(() => this.state().loading);
  readonly error = computed(() => this.state().error);

  constructor(fetch: (filter: F) => Observable<{ items: T[]; total: number }>) {
    const subscription = this.searches
      .pipe(
        tap(() => this.state.update((s) => ({ ...s, loading: true, error: null }))),
        switchMap((filter) =>
          fetch(filter).pipe(
            map((page): PageState<T> => ({ items: page.items, total: page.total, loading: false, error: null })),
            catchError((err: ApiError) => of<PageState<T>>({ items: [], total: 0, loading: false, error: err.message })),
          ),
        ),
      )
      .subscribe((next) => this.state.set(next));
    inject(DestroyRef).onDestroy(() => subscription.unsubscribe());
  }

  search(filter: F): void {
    this.searches.next(filter);
  }
}
