import { Injectable, computed, inject, signal } from '@angular/core';
import { Observable, Subject, catchError, tap, throwError } from 'rxjs';
import type { Study, UpdateStudyBody } from '@shared/schemas';
import { AuthStore } from '../../../core/auth/auth-store';
import { ApiError } from '../../../core/http/api-error';
import { StudiesApi } from '../api/studies-api';
import { isVersionConflict } from '../version-conflict';

export const STUDY_CONFLICT_TEXT = 'Someone else changed this study; reload to see their change.';

interface StudyState {
  study: Study | null;
  loading: boolean;
  error: string | null;
  /** True after a save answered 409: the page offers to reload and never overwrites. */
  conflict: boolean;
}

/** One study as its page holds it: load, refresh quietly, and save changes with the version they were made from. */
@Injectable()
export class StudyStore {
  private readonly api = inject(StudiesApi);
  private readonly auth = inject(AuthStore);
  private readonly state = signal<StudyState>({ study: null, loading: false, error: null, conflict: false });
  private readonly moves = new Subject<{ from: number; to: number }>();
  /** The study's version moved by a change made on this page (rows and settings share one version). */
  readonly versionMoves = this.moves.asObservable();

  readonly study = computed(() => this.state().study);
  readonly loading = computed(() => this.state().loading);
  readonly error = computed(() => this.state().error);
  readonly conflict = computed(() => this.state().conflict);
  /** Rows and settings change only in a draft, and only for the roles that enter studies. */
  readonly editable = computed(() => this.state().study?.state === 'draft' && this.auth.hasAnyRole(['technologist', 'director']));

  load(id: number): void {
    this.state.update((s) => ({ ...s, loading: true, error: null }));
    this.api.get(id).subscribe({
      next: (study) => this.state.set({ study, loading: false, error: null, conflict: false }),
      error: (err: ApiError) => this.state.update((s) => ({ ...s, loading: false, error: err.message })),
    });
  }

  /** Reads the study again (its findings state, n and version change when rows are saved); errors are ignored. */
  refresh(): void {
    const id = this.study()?.id;
    if (id === undefined) return;
    this.api.get(id).subscribe({ next: (study) => this.state.update((s) => ({ ...s, study })), error: () => undefined });
  }

  /** Sends a change with the version on screen; a version conflict sets `conflict`; errors are rethrown. */
  save(change: Omit<UpdateStudyBody, 'version'>): Observable<Study> {
    const study = this.study();
    if (!study) return throwError(() => new ApiError(0, 'The study is not loaded yet.'));
    return this.api.update(study.id, { ...change, version: study.version }).pipe(
      tap((saved) => {
        this.state.update((s) => ({ ...s, study: saved, conflict: false }));
        this.moves.next({ from: study.version, to: saved.version });
      }),
      catchError((err: ApiError) => {
        if (isVersionConflict(err)) this.state.update((s) => ({ ...s, conflict: true }));
        return throwError(() => err);
      }),
    );
  }

  /**
   * Rows saved on this page moved the version from `from` to `to`: follow it (unless the study on screen
   * is at another version), then read the study again for its new n and findings state.
   */
  followVersion(from: number, to: number): void {
    this.state.update((s) => (s.study && s.study.version === from ? { ...s, study: { ...s.study, version: to } } : s));
    this.refresh();
  }

  /** Takes a study the server answered elsewhere (e.g. after a sign-off step). */
  adopt(study: Study): void {
    this.state.update((s) => ({ ...s, study }));
  }
}
