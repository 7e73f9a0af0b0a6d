import { ChangeDetectionStrategy, Component, computed, inject, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { ErrorBanner } from '../../../ui/error-banner';
import { ArchiveApi } from '../archive-api';
import { ZonedPipe, labZone } from '../../../ui/lab-time';
import { engineLine, integrityOutcome, reproduceOutcome, showValue } from '../recheck-words';
import { CheckList } from './check-list';
import { RecheckOutcome } from './recheck-outcome';
import { RecheckRun } from './recheck-run';

/**
 * The two re-checks of a study, each shown check by check in words with an icon: the integrity check
 * (hashes and the history chain against the signature) and the re-run of the analysis.
 */
@Component({
  selector: 'app-recheck-panel',
  templateUrl: './recheck-panel.html',
  styleUrl: './recheck-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, MatTableModule, ErrorBanner, ZonedPipe, RecheckOutcome, CheckList],
})
export class RecheckPanel {
  readonly studyId = input.required<number>();
  /** Only a signed study has a signature to check against. */
  readonly signed = input.required<boolean>();
  /** A re-check finished; the server recorded it in the study's history. */
  readonly checked = output<void>();

  private readonly api = inject(ArchiveApi);
  protected readonly zone = labZone();
  protected readonly integrity = new RecheckRun(() => this.api.checkIntegrity(this.studyId()), () => this.checked.emit());
  protected readonly reproduce = new RecheckRun(() => this.api.reproduce(this.studyId()), () => this.checked.emit());
  protected readonly integrityOutcome = computed(() => {
    const report = this.integrity.report();
    return report && integrityOutcome(report);
  });
  protected readonly reproduceOutcome = computed(() => {
    const report = this.reproduce.report();
    return report && reproduceOutcome(report);
  });
  protected readonly engineLine = engineLine;
  protected readonly show = showValue;
  protected readonly differenceColumns = ['path', 'stored', 'recomputed'];
}
