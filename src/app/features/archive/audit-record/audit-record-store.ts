import { DestroyRef, Injectable, computed, inject, signal } from '@angular/core';
import { Subject, catchError, forkJoin, map, of, switchMap, tap } from 'rxjs';
import type { Signature, Study } from '@shared/schemas';
import { ApiError } from '../../../core/http/api-error';
import { ArchiveApi } from '../archive-api';

interface RecordState {
  study: Study | null;
  signatures: Signature[];
  loading: boolean;
  error: string | null;
}

/** One study's audit record: the study and its signatures, read together; opening another study cancels the first. */
@Injectable()
export class AuditRecordStore {
  private readonly api = inject(ArchiveApi);
  private readonly state = signal<RecordState>({ study: null, signatures: [], loading: false, error: null });
  private readonly ids = new Subject<number>();

  readonly study = computed(() => this.state().study);
  readonly signatures = computed(() => this.state().signatures);
  /** The sign-off signature (accepted or not accepted), the one the PDF and the re-checks are bound to. */
  readonly signOff = computed(() => this.state().signatures.filter((s) => s.meaning !== 'plan-approved').at(-1) ?? null);
  readonly loading = computed(() => this.state().loading);
  readonly error = computed(() => this.state().error);

  constructor() {
    const subscription = this.ids
      .pipe(
        tap(() => this.state.set({ study: null, signatures: [], loading: true, error: null })),
        switchMap((id) =>
          forkJoin({ study: this.api.study(id), signatures: this.api.signatures(id) }).pipe(
            map(({ study, signatures }): RecordState => ({ study, signatures, loading: false, error: null })),
            catchError((err: ApiError) => of<RecordState>({ study: null, signatures: [], loading: false, error: err.message })),
          ),
        ),
      )
      .subscribe((next) => this.state.set(next));
    inject(DestroyRef).onDestroy(() => subscription.unsubscribe());
  }

  open(id: number): void {
    this.ids.next(id);
  }
}
