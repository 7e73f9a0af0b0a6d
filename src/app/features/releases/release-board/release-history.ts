import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { ErrorBanner } from '../../../ui/error-banner';
import { historyReader } from '../../archive/history-timeline/history-reader';
import { HistoryTimeline } from '../../archive/history-timeline/history-timeline';
import { ReleaseApi } from '../release-api';

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
  private readonly reader = historyReader(
    computed(() => ({ id: this.releaseId(), stamp: this.stamp() })),
    ({ id }) => this.api.history(id),
  );
  protected readonly history = this.reader.history;

  reload(): void {
    this.reader.reload();
  }
}
