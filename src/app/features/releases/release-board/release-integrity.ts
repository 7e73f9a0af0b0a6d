import { ChangeDetectionStrategy, Component, computed, inject, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { BoardRequirement, ReleaseIntegrityReport } from '@shared/schemas';
import { plural } from '@shared/types/plural';
import { ErrorBanner } from '../../../ui/error-banner';
import { ZonedPipe, labZone } from '../../../ui/lab-time';
import { CheckList } from '../../archive/recheck-panel/check-list';
import { RecheckOutcome } from '../../archive/recheck-panel/recheck-outcome';
import { RecheckRun } from '../../archive/recheck-panel/recheck-run';
import type { Outcome } from '../../archive/recheck-words';
import { ReleaseApi } from '../release-api';

/** The release's re-check in one line: passed only when its own checks and every component study's pass. */
export function releaseIntegrityOutcome(report: ReleaseIntegrityReport): Outcome {
  const failedOwn = report.checks.filter((c) => !c.passed).length;
  const failedParts = report.components.filter((c) => !c.passed || c.checks.some((k) => !k.passed)).length;
  const passed = report.passed && failedOwn === 0 && failedParts === 0;
  const parts = plural(report.components.length, 'component study', 'component studies');
  return passed
    ? { passed, icon: 'verified', word: 'Passed', headline: `The release and its ${parts} are as they were signed.` }
    : {
      passed, icon: 'report', word: 'Failed',
      headline: `${plural(failedOwn, 'check')} of the release and ${plural(failedParts, 'component study', 'component studies')} failed: the stored record no longer matches what was signed.`,
    };
}

/** The integrity re-check of a signed release (director, quality): each check of its own, then each component study's. */
@Component({
  selector: 'app-release-integrity',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, ErrorBanner, ZonedPipe, CheckList, RecheckOutcome],
  template: `
    <section class="card" aria-labelledby="integrity-title" data-testid="release-integrity">
      <h2 id="integrity-title">Integrity</h2>
      <p class="muted">
        Recomputes the release's content hash over the signatures of its studies and the signed PDF's hash, and re-checks each component
        study. It only reads; it is recorded in the history.
      </p>
      <button mat-stroked-button type="button" (click)="run.start()" [disabled]="!signed() || run.running()" data-testid="release-integrity-check">
        <mat-icon>fact_check</mat-icon> Check integrity
      </button>
      @if (!signed()) { <p class="muted small">Only a signed release has a signature to check against.</p> }
      @if (run.running()) { <mat-progress-bar mode="indeterminate" aria-label="Checking integrity" /> }
      <app-error-banner [message]="run.error()" />
      @if (run.report(); as report) {
        <app-recheck-outcome [outcome]="outcome()!" data-testid="release-integrity-outcome" />
        <app-check-list [checks]="report.checks" />
        @for (c of report.components; track c.studyId) {
          <h3 [attr.data-testid]="'integrity-component-' + c.studyId">
            <mat-icon aria-hidden="true">{{ c.passed ? 'check_circle' : 'cancel' }}</mat-icon>
            {{ label(c.requirement) }} · study {{ c.studyId }}: {{ c.passed ? 'passed' : 'failed' }}
          </h3>
          <app-check-list [checks]="c.checks" />
        }
        <p class="muted small">Checked {{ report.checkedAt | zoned: zone() : 'seconds' }}.</p>
      }
    </section>
  `,
  styles: `
    .card { border: 1px solid var(--mat-sys-outline-variant); border-radius: 12px; padding: 16px; background: var(--mat-sys-surface); }
    h3 { display: flex; align-items: center; gap: 6px; font: var(--mat-sys-title-small); margin: 16px 0 4px; }
    .small { font: var(--mat-sys-body-small); }
    mat-progress-bar { margin-top: 12px; }
  `,
})
export class ReleaseIntegrity {
  readonly releaseId = input.required<number>();
  readonly signed = input.required<boolean>();
  readonly requirements = input<readonly BoardRequirement[]>([]);
  /** A re-check finished (the server recorded it in the history). */
  readonly checked = output<void>();

  private readonly api = inject(ReleaseApi);
  protected readonly zone = labZone();
  protected readonly run = new RecheckRun(() => this.api.checkIntegrity(this.releaseId()), () => this.checked.emit());
  protected readonly outcome = computed(() => {
    const report = this.run.report();
    return report && releaseIntegrityOutcome(report);
  });

  protected label(key: string): string {
    return this.requirements().find((r) => r.key === key)?.label ?? key;
  }
}
