import { Injectable, computed, inject, signal } from '@angular/core';
import type { Worklist } from '@shared/schemas';
import { ApiError } from '../../../core/http/api-error';
import { StudiesApi } from '../../studies/api/studies-api';

interface WorklistState {
  worklist: Worklist | null;
  loading: boolean;
  error: string | null;
}

/** The signed-in user's worklist: their drafts, studies returned to them, studies awaiting their signature, recently signed. */
@Injectable()
export class WorklistStore {
  private readonly api = inject(StudiesApi);
  private readonly state = signal<WorklistState>({ worklist: null, loading: false, error: null });
  readonly worklist = computed(() => this.state().worklist);
  readonly loading = computed(() => this.state().loading);
  readonly error = computed(() => this.state().error);

  load(): void {
    this.state.update((s) => ({ ...s, loading: true, error: null }));
    this.api.worklist().subscribe({
      next: (worklist) => this.state.set({ worklist, loading: false, error: null }),
      error: (err: ApiError) => this.state.update((s) => ({ ...s, loading: false, error: err.message })),
    });
  }
}
