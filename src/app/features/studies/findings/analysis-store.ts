import { DestroyRef, Injectable, computed, inject, signal } from '@angular/core';
import { Observable, Subscription, retry, switchMap, takeWhile, tap, timer } from 'rxjs';
import type { Analysis } from '@shared/schemas';
import { ApiError } from '../../../core/http/api-error';
import { AnalysesApi } from '../api/analyses-api';
import { StudyStore } from '../study/study-store';

/** How often a queued or running analysis is asked for its progress when the server cannot push it. */
export const POLL_MS = 500;

/** What the server pushes for an analysis (GET /api/v1/analyses/:id/events, event "state"). */
interface PushedState { id: number; state: Analysis['state']; progress: number }

interface AnalysisState {
  analysis: Analysis | null;
  starting: boolean;
  error: string | null;
}

export function isWorking(analysis: Analysis | null): boolean {
  return analysis?.state === 'queued' || analysis?.state === 'running';
}

/**
 * The analysis shown on the Findings tab: start one, or follow the study's latest. While it is queued or
 * running, the server pushes its progress and its end (server-sent events); the results are read once, when
 * it ends. Where events are not available (an old browser, a proxy, the server answering 503) the store
 * asks every POLL_MS instead. When it ends, the study is read again so its findings state is current.
 */
@Injectable()
export class AnalysisStore {
  private readonly api = inject(AnalysesApi);
  private readonly study = inject(StudyStore, { optional: true });
  private readonly state = signal<AnalysisState>({ analysis: null, starting: false, error: null });
  private polling: Subscription | null = null;

  readonly analysis = computed(() => this.state().analysis);
  readonly starting = computed(() => this.state().starting);
  readonly error = computed(() => this.state().error);
  readonly working = computed(() => this.state().starting || isWorking(this.state().analysis));

  constructor() {
    inject(DestroyRef).onDestroy(() => this.polling?.unsubscribe());
  }

  /** Queues a new analysis of the study's rows and settings, then follows it. */
  run(studyId: number): void {
    this.state.update((s) => ({ ...s, starting: true, error: null }));
    this.api.run(studyId).subscribe({
      next: (analysis) => {
        this.state.update((s) => ({ ...s, starting: false, analysis }));
        this.follow(analysis.id);
      },
      error: (err: ApiError) => this.state.update((s) => ({ ...s, starting: false, error: err.message })),
    });
  }

  /** Reads an analysis and, while it is queued or running, its progress. Nothing happens if it is already shown. */
  follow(analysisId: number): void {
    if (this.polling && !this.polling.closed && this.analysis()?.id === analysisId) return;
    this.polling?.unsubscribe();
    const follow = typeof EventSource === 'undefined' ? this.poll(analysisId) : this.listen(analysisId);
    this.polling = follow.subscribe({
      error: (err: ApiError) => this.state.update((s) => ({ ...s, error: err.message })),
    });
  }

  /**
   * Reads the analysis unless it is shown already; while it is queued or running, follows the pushed state,
   * and reads the whole analysis (with its results) once more at the end.
   */
  private listen(analysisId: number): Observable<Analysis> {
    return new Observable<Analysis>((subscriber) => {
      let source: EventSource | null = null;
      let inner: Subscription | null = null;
      const show = (analysis: Analysis) => {
        this.state.update((s) => ({ ...s, analysis, error: null }));
        subscriber.next(analysis);
      };
      const finish = () => {
        source?.close();
        this.study?.refresh();
        subscriber.complete();
      };
      const open = () => {
        source = new EventSource(`/api/v1/analyses/${analysisId}/events`);
        source.addEventListener('state', (event) => {
          const pushed = JSON.parse((event as MessageEvent<string>).data) as PushedState;
          if (pushed.state === 'done' || pushed.state === 'failed') {
            source?.close();
            read((analysis) => (isWorking(analysis) ? open() : (show(analysis), finish())));
            return;
          }
          const shown = this.analysis();
          if (shown?.id === analysisId) show({ ...shown, state: pushed.state, progress: pushed.progress });
        });
        source.onerror = () => {
          // Refused (503), cut or never opened: ask instead.
          source?.close();
          inner?.unsubscribe();
          inner = this.poll(analysisId).subscribe(subscriber);
        };
      };
      const read = (then: (analysis: Analysis) => void) => {
        inner?.unsubscribe();
        inner = this.api.get(analysisId).pipe(retry({ count: 4, delay: 1000 })).subscribe({ next: then, error: (err) => subscriber.error(err) });
      };
      const shown = this.analysis();
      if (shown?.id === analysisId && isWorking(shown)) open();
      else read((analysis) => {
        show(analysis);
        if (isWorking(analysis)) open();
        else finish();
      });
      return () => {
        source?.close();
        inner?.unsubscribe();
      };
    });
  }

  private poll(analysisId: number): Observable<Analysis> {
    return timer(0, POLL_MS).pipe(
      switchMap(() => this.api.get(analysisId).pipe(retry({ count: 4, delay: 1000 }))),
      takeWhile((analysis) => isWorking(analysis), true),
      tap((analysis) => {
        this.state.update((s) => ({ ...s, analysis, error: null }));
        if (!isWorking(analysis)) this.study?.refresh();
      }),
    );
  }
}
