import { computed, signal } from '@angular/core';
import { Observable, tap } from 'rxjs';
import { ApiError } from '../../../core/http/api-error';

interface ListState<T> {
  items: T[];
  loading: boolean;
  error: string | null;
}

/** Signal state of one server list: load it, and keep it in step with each saved item. */
export abstract class ListStore<T extends { id: number }> {
  private readonly state = signal<ListState<T>>({ items: [], loading: false, error: null });
  readonly items = computed(() => this.state().items);
  readonly loading = computed(() => this.state().loading);
  readonly error = computed(() => this.state().error);

  protected abstract fetch(): Observable<T[]>;

  load(): void {
    this.state.update((s) => ({ ...s, loading: true, error: null }));
    this.fetch().subscribe({
      next: (items) => this.state.set({ items, loading: false, error: null }),
      error: (err: ApiError) => this.state.update((s) => ({ ...s, loading: false, error: err.message })),
    });
  }

  /** Sends a change; the item the server answers replaces its old copy (or joins the list). */
  protected save(request: Observable<T>): Observable<T> {
    return request.pipe(tap((item) => this.put(item)));
  }

  private put(item: T): void {
    this.state.update((s) => {
      const known = s.items.some((it) => it.id === item.id);
      const items = known ? s.items.map((it) => (it.id === item.id ? item : it)) : [...s.items, item];
      return { ...s, items };
    });
  }
}
