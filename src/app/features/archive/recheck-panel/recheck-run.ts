import { Signal, computed, signal } from '@angular/core';
import { Observable } from 'rxjs';
import { ApiError } from '../../../core/http/api-error';

interface RunState<T> {
  running: boolean;
  report: T | null;
  error: string | null;
}

/** One re-check a person can start: running, its last report, or the server's words when it was refused. */
export class RecheckRun<T> {
  private readonly state = signal<RunState<T>>({ running: false, report: null, error: null });
  readonly running = computed(() => this.state().running);
  readonly report: Signal<T | null> = computed(() => this.state().report);
  readonly error = computed(() => this.state().error);

  /** `done` runs after a report arrived (the server recorded the re-check in the history). */
  constructor(
    private readonly request: () => Observable<T>,
    private readonly done: () => void = () => undefined,
  ) {}

  start(): void {
    if (this.state().running) return;
    this.state.set({ running: true, report: null, error: null });
    this.request().subscribe({
      next: (report) => {
        this.state.set({ running: false, report, error: null });
        this.done();
      },
      error: (err: ApiError) => this.state.set({ running: false, report: null, error: err.message }),
    });
  }
}
