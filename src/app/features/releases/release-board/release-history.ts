import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { catchError, map, of, startWith, switchMap } from 'rxjs';
import type { HistoryEvent } from '../../../../../shared/schemas';
import { ApiError } from '../../../core/http/api-error';
import { ErrorBanner } from '../../../ui/error-banner';
import { HistoryTimeline } from '../../archive/history-timeline/history-timeline';
import { ReleaseApi } from '../release-api';

interface Loaded {
  events: HistoryEvent[];
  loading: boolean;
  error: string | null;
}

/** The release's own history as a timeline in words; read again whenever the release changes or `reload()` is called. */
@Component({
  selector: 'app-release-history',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatProgressBarModule, ErrorBanner, HistoryTimeline],
  template: `
    <section aria-labelledby="release-history-title" data-testid="release-history">
      <h2 id="release-history-title">History</h2>
      @if (history().loading) { <mat-progress-bar mode="indeterminate" aria-label="Reading the history" /> }
      <app-error-banner [message]="history().error" />
      @if (!history().loading && !history().error && history().events.length === 0) {
        <p class="muted">Nothing recorded yet.</p>
      }
      <app-history-timeline [events]="history().events" />
    </section>
  `,
})
export class ReleaseHistory {
  readonly releaseId = input.required<number>();
  /** The release's version and state: a change reads the history again. */
  readonly stamp = input<string>('');
  private readonly api = inject(ReleaseApi);
  private readonly reloads = signal(0);
  private readonly key = computed(() => `${this.releaseId()}:${this.stamp()}:${this.reloads()}`);
  protected readonly history = toSignal(
    toObservable(this.key).pipe(
      switchMap(() =>
        this.api.history(this.releaseId()).pipe(
          map((events): Loaded => ({ events, loading: false, error: null })),
          catchError((err: ApiError) => of<Loaded>({ events: [], loading: false, error: `The history could not be read: ${err.message}` })),
          startWith<Loaded>({ events: [], loading: true, error: null }),
        ),
      ),
    ),
    { initialValue: { events: [], loading: true, error: null } as Loaded },
  );

  reload(): void {
    this.reloads.update((n) => n + 1);
  }
}
