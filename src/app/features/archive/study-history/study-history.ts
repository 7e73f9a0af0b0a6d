import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { ErrorBanner } from '../../../ui/error-banner';
import { HistoryApi } from '../history-api';
import { historyReader } from '../history-timeline/history-reader';
import { HistoryTimeline } from '../history-timeline/history-timeline';

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
  private readonly reader = historyReader(this.studyId, (id) => this.api.study(id));
  protected readonly history = this.reader.history;

  /** Reads the history again, e.g. after a re-check added an event. */
  reload(): void {
    this.reader.reload();
  }
}
