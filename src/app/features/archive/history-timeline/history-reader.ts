import { Signal, computed, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { Observable, catchError, map, of, startWith, switchMap } from 'rxjs';
import type { HistoryEvent } from '@shared/schemas';
import { ApiError } from '../../../core/http/api-error';

/** A history as read so far: its events, whether a read is under way, and the server's words when it failed. */
export interface HistoryRead {
  events: HistoryEvent[];
  loading: boolean;
  error: string | null;
}

const LOADING: HistoryRead = { events: [], loading: true, error: null };

/**
 * Reads a history (a study's, a release's) for a timeline: again whenever `key` changes or `reload()` is called, a newer
 * read replacing an older one still under way. Call in an injection context (a component's field initialiser).
 */
export function historyReader<K>(key: Signal<K>, read: (key: K) => Observable<HistoryEvent[]>): { history: Signal<HistoryRead>; reload: () => void } {
  const reloads = signal(0);
  const asked = computed(() => ({ key: key(), reloads: reloads() }));
  const history = toSignal(
    toObservable(asked).pipe(
      switchMap((ask) =>
        read(ask.key).pipe(
          map((events): HistoryRead => ({ events, loading: false, error: null })),
          catchError((err: ApiError) => of<HistoryRead>({ events: [], loading: false, error: `The history could not be read: ${err.message}` })),
          startWith(LOADING),
        ),
      ),
    ),
    { initialValue: LOADING },
  );
  return { history, reload: () => reloads.update((n) => n + 1) };
}
