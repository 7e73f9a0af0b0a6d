import { DestroyRef, Injectable, computed, inject, signal } from '@angular/core';
import { Observable, Subject, catchError, map, of, switchMap, tap } from 'rxjs';
import type { Release } from '@shared/schemas';
import { ApiError } from '../../../core/http/api-error';
import { ReleaseApi } from '../release-api';

interface BoardState {
  release: Release | null;
  loading: boolean;
  /** Why the release could not be read. */
  error: string | null;
  /** A change on its way (start, link, unlink, waive). */
  busy: boolean;
  /** The server's words when a change was refused. */
  refusal: string | null;
}

/** One release as its board shows it; every change answers the whole release, which replaces the one shown. */
@Injectable()
export class ReleaseBoardStore {
  private readonly api = inject(ReleaseApi);
  private readonly state = signal<BoardState>({ release: null, loading: false, error: null, busy: false, refusal: null });
  private readonly ids = new Subject<{ id: number; quiet: boolean }>();

  readonly release = computed(() => this.state().release);
  readonly loading = computed(() => this.state().loading);
  readonly error = computed(() => this.state().error);
  readonly busy = computed(() => this.state().busy);
  readonly refusal = computed(() => this.state().refusal);

  constructor() {
    const subscription = this.ids
      .pipe(
        tap(({ quiet }) => this.state.update((s) => (quiet ? s : { release: null, loading: true, error: null, busy: false, refusal: null }))),
        switchMap(({ id }) =>
          this.api.get(id).pipe(
            map((release) => ({ release, error: null as string | null })),
            catchError((err: ApiError) => of({ release: null, error: err.message })),
          ),
        ),
      )
      .subscribe(({ release, error }) =>
        this.state.update((s) => (release ? { ...s, release, loading: false, error: null } : { ...s, release: s.release, loading: false, error })),
      );
    inject(DestroyRef).onDestroy(() => subscription.unsubscribe());
  }

  open(id: number): void {
    this.ids.next({ id, quiet: false });
  }

  /** Reads the release again without clearing the page (e.g. after a due date moved). */
  refresh(): void {
    const id = this.state().release?.id;
    if (id) this.ids.next({ id, quiet: true });
  }

  adopt(release: Release): void {
    this.state.update((s) => ({ ...s, release, error: null, refusal: null }));
  }

  /** Sends one change; the answer replaces the release shown, a refusal is kept in words. */
  change(request: Observable<Release>, done: (release: Release) => void = () => undefined): void {
    if (this.state().busy) return;
    this.state.update((s) => ({ ...s, busy: true, refusal: null }));
    request.subscribe({
      next: (release) => {
        this.state.update((s) => ({ ...s, release, busy: false, refusal: null }));
        done(release);
      },
      error: (err: ApiError) => this.state.update((s) => ({ ...s, busy: false, refusal: err.message })),
    });
  }
}
