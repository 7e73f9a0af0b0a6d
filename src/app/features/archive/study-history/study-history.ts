import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { combineLatest, catchError, map, of, startWith, switchMap } from 'rxjs';
import type { HistoryEvent } from '../../../../../shared/schemas';
import { ApiError } from '../../../core/http/api-error';
import { ErrorBanner } from '../../../ui/error-banner';
import { HistoryApi } from '../history-api';
import { HistoryTimeline } from '../history-timeline/history-timeline';

interface Loaded {
  events: HistoryEvent[];
  loading: boolean;
  error: string | null;
}

/**
 * A study's history as a timeline in words: when (in the laboratory's zone), who, what, and the
 * detail lines. Mount it anywhere with `<app-study-history [studyId]="id" />`.
 */
@Component({
  selector: 'app-study-history',
  templateUrl: './study-history.html',
  styleUrl: './study-history.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, ErrorBanner, HistoryTimeline],
})
export class StudyHistory {
  readonly studyId = input.required<number>();
  private readonly api = inject(HistoryApi);
  private readonly reloads = signal(0);
  protected readonly history = toSignal(
    combineLatest([toObservable(this.studyId), toObservable(this.reloads)]).pipe(
      switchMap(([id]) =>
        this.api.study(id).pipe(
          map((events): Loaded => ({ events, loading: false, error: null })),
          catchError((err: ApiError) => of<Loaded>({ events: [], loading: false, error: `The history could not be read: ${err.message}` })),
          startWith<Loaded>({ events: [], loading: true, error: null }),
        ),
      ),
    ),
    { initialValue: { events: [], loading: true, error: null } as Loaded },
  );

  /** Reads the history again, e.g. after a re-check added an event. */
  reload(): void {
    this.reloads.update((n) => n + 1);
  }
}
