import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { Router, RouterLink } from '@angular/router';
import { ArchiveQuery, STUDY_KIND_LABELS, STUDY_STATE_LABELS, type ArchiveItem } from '@shared/schemas';
import { ApiError } from '../../../core/http/api-error';
import { ErrorBanner } from '../../../ui/error-banner';
import { ARCHIVE_KEYS, ARCHIVE_PAGE_SIZE, archiveExportUrl, archiveFilterFrom } from '../archive-query';
import { ArchiveStore } from '../archive-store';
import { ArchiveFilters } from '../archive-filters/archive-filters';
import { DecisionCaution } from '../decision-caution';
import { FileDownload } from '../file-download';
import { ZonedPipe, labZone } from '../../../ui/lab-time';
import { listQuery } from '../list-query';
import { VerdictBadge } from '../verdict-badge';
import { meaningWords } from '../verdict-view';

/** Archive: every study of the laboratory for the quality officer, searched, sorted and paged by the server. */
@Component({
  selector: 'app-archive-page',
  templateUrl: './archive-page.html',
  styleUrls: ['./archive-page.scss', '../print.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
  providers: [ArchiveStore],
  imports: [
    MatTableModule, MatSortModule, MatPaginatorModule, MatButtonModule, MatIconModule, MatProgressBarModule, RouterLink,
    ErrorBanner, ArchiveFilters, DecisionCaution, VerdictBadge, ZonedPipe,
  ],
})
export class ArchivePage {
  protected readonly store = inject(ArchiveStore);
  private readonly router = inject(Router);
  private readonly downloads = inject(FileDownload);
  protected readonly list = listQuery({
    parse: archiveFilterFrom, keys: ARCHIVE_KEYS, pageSize: ARCHIVE_PAGE_SIZE, sortKey: ArchiveQuery.shape.sort,
    sortDefault: { active: 'createdAt', direction: 'desc' }, search: (query) => this.store.search(query),
  });
  protected readonly zone = labZone();
  protected readonly columns = ['title', 'kind', 'n', 'state', 'verdict', 'signed', 'createdAt'];
  protected readonly kindLabel = (item: ArchiveItem): string => STUDY_KIND_LABELS[item.kind];
  protected readonly stateLabel = (item: ArchiveItem): string => STUDY_STATE_LABELS[item.state];
  protected readonly meaning = meaningWords;
  protected readonly downloading = signal(false);
  protected readonly downloadError = signal<string | null>(null);

  protected open(item: ArchiveItem): void {
    void this.router.navigate(['/archive', item.id]);
  }

  protected downloadList(): void {
    this.downloading.set(true);
    this.downloadError.set(null);
    this.downloads.save(archiveExportUrl(this.list.query()), 'parallax-archive.xlsx').subscribe({
      next: () => this.downloading.set(false),
      error: (err: ApiError) => {
        this.downloading.set(false);
        this.downloadError.set(`The list could not be downloaded: ${err.message}`);
      },
    });
  }
}
