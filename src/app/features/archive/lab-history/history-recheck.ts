import { ChangeDetectionStrategy, Component, computed, inject, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { ErrorBanner } from '../../../ui/error-banner';
import { HistoryApi } from '../history-api';
import { ZonedPipe, labZone } from '../../../ui/lab-time';
import { chainOutcome } from '../recheck-words';
import { CheckList } from '../recheck-panel/check-list';
import { RecheckOutcome } from '../recheck-panel/recheck-outcome';
import { RecheckRun } from '../recheck-panel/recheck-run';

/**
 * The History page's own re-check: every event of the laboratory's chain, and of the events that belong
 * to no laboratory, against the server's key, the signed newest event and the checkpoints.
 */
@Component({
  selector: 'app-history-recheck',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, ErrorBanner, ZonedPipe, RecheckOutcome, CheckList],
  template: `
    <section class="history-recheck" aria-labelledby="history-recheck-title" data-testid="history-recheck">
      <div class="head">
        <div>
          <h2 id="history-recheck-title">Re-check the history</h2>
          <p class="muted">
            Confirms that no event was changed, removed or inserted since it was written, here and in the events that
            belong to no laboratory (sign-ins of unknown e-mails). It reads only, and is recorded as an event.
          </p>
        </div>
        <button mat-stroked-button type="button" (click)="run.start()" [disabled]="run.running()" data-testid="check-chains">
          <mat-icon>fact_check</mat-icon> Re-check the history
        </button>
      </div>
      @if (run.running()) { <mat-progress-bar mode="indeterminate" aria-label="Re-checking the history" /> }
      <app-error-banner [message]="run.error()" />
      @if (run.report(); as report) {
        <app-recheck-outcome [outcome]="outcome()!" data-testid="chains-outcome" />
        <app-check-list [checks]="report.checks" />
        <p class="muted small">Checked {{ report.checkedAt | zoned: zone() : 'seconds' }}.</p>
      }
    </section>
  `,
  styles: `
    .history-recheck { border: 1px solid var(--mat-sys-outline-variant); border-radius: 12px; padding: 12px 16px; margin: 0 0 16px; }
    .head { display: flex; gap: 16px; align-items: flex-start; justify-content: space-between; flex-wrap: wrap; }
    h2 { font: var(--mat-sys-title-medium); margin: 0 0 4px; }
    p { margin: 0; }
    .small { font: var(--mat-sys-body-small); margin-top: 8px; }
    mat-progress-bar { margin-top: 12px; }
  `,
})
export class HistoryRecheck {
  /** A re-check finished: the server recorded it, so the list may show a new event. */
  readonly checked = output<void>();
  protected readonly zone = labZone();
  protected readonly run = new RecheckRun(() => this.api.checkChains(), () => this.checked.emit());
  private readonly api = inject(HistoryApi);
  protected readonly outcome = computed(() => {
    const report = this.run.report();
    return report && chainOutcome(report);
  });
}
