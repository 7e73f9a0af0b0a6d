import { DestroyRef, Injectable, computed, inject, signal } from '@angular/core';
import { Observable, Subscription, retry, switchMap, takeWhile, tap, timer } from 'rxjs';
import type { Analysis } from '../../../../../shared/schemas';
import { ApiError } from '../../../core/http/api-error';
import { AnalysesApi } from '../api/analyses-api';
import { StudyStore } from '../study/study-store';

/** How often a queued or running analysis is asked for its progress. */
export const POLL_MS = 500;

interface AnalysisState {
  analysis: Analysis | null;
  starting: boolean;
  error: string | null;
}

export function isWorking(analysis: Analysis | null): boolean {
  return analysis?.state === 'queued' || analysis?.state === 'running';
}

/**
 * The analysis shown on the Findings tab: start one, or follow the study's latest, asking for its
 * progress every POLL_MS while it is queued or running. When it ends, the study is read again so its
 * findings state is current.
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
    this.polling = this.poll(analysisId).subscribe({
      error: (err: ApiError) => this.state.update((s) => ({ ...s, error: err.message })),
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
