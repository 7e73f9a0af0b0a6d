import { ChangeDetectionStrategy, Component, effect, inject, input, numberAttribute, signal, untracked, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { ApiError } from '../../../core/http/api-error';
import { ErrorBanner } from '../../../ui/error-banner';
import { studyUrl } from '../archive-api';
import { DecisionCaution } from '../decision-caution';
import { FileDownload } from '../file-download';
import { RecheckPanel } from '../recheck-panel/recheck-panel';
import { SignatureList } from '../signature-list/signature-list';
import { StudyHistory } from '../study-history';
import { StudyOverview } from '../study-overview/study-overview';
import { AuditRecordStore } from './audit-record-store';

/** A study's audit record, read-only: what it is, who signed it and what that meant, the re-checks, and its history. */
@Component({
  selector: 'app-audit-record-page',
  templateUrl: './audit-record-page.html',
  styleUrls: ['./audit-record-page.scss', '../print.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
  providers: [AuditRecordStore],
  imports: [
    MatButtonModule, MatIconModule, MatProgressBarModule, RouterLink, ErrorBanner, DecisionCaution, StudyOverview, SignatureList,
    RecheckPanel, StudyHistory,
  ],
})
export class AuditRecordPage {
  /** The route's :id. */
  readonly id = input.required({ transform: numberAttribute });
  protected readonly store = inject(AuditRecordStore);
  private readonly downloads = inject(FileDownload);
  private readonly history = viewChild(StudyHistory);
  protected readonly downloading = signal(false);
  protected readonly downloadError = signal<string | null>(null);
  protected readonly pdfUrl = (id: number) => studyUrl(id, '/report.pdf');

  constructor() {
    effect(() => {
      const id = this.id();
      untracked(() => this.store.open(id));
    });
  }

  /** A re-check adds an event to the history: show it. */
  protected rechecked(): void {
    this.history()?.reload();
  }

  protected downloadRecord(id: number): void {
    this.downloading.set(true);
    this.downloadError.set(null);
    this.downloads.save(studyUrl(id, '/export.xlsx'), `parallax-study-${id}.xlsx`).subscribe({
      next: () => this.downloading.set(false),
      error: (err: ApiError) => {
        this.downloading.set(false);
        this.downloadError.set(`The record could not be downloaded: ${err.message}`);
      },
    });
  }
}
