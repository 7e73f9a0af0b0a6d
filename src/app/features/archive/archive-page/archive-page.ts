import { ChangeDetectionStrategy, Component, computed, effect, inject, signal, untracked } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSortModule, Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { Router, RouterLink } from '@angular/router';
import { ArchiveQuery, STUDY_KIND_LABELS, STUDY_STATE_LABELS, type ArchiveItem } from '../../../../../shared/schemas';
import { ApiError } from '../../../core/http/api-error';
import { ErrorBanner } from '../../../ui/error-banner';
import { ARCHIVE_KEYS, ARCHIVE_PAGE_SIZE, ArchiveFilter, archiveExportUrl, archiveFilterFrom } from '../archive-query';
import { ArchiveStore } from '../archive-store';
import { ArchiveFilters } from '../archive-filters/archive-filters';
import { DecisionCaution } from '../decision-caution';
import { FileDownload } from '../file-download';
import { ZonedPipe, labZone } from '../../../ui/lab-time';
import { withChange } from '../query-params';
import { routeQuery } from '../route-query';
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
  private readonly address = routeQuery<ArchiveQuery, (typeof ARCHIVE_KEYS)[number]>(archiveFilterFrom, ARCHIVE_KEYS);
  protected readonly zone = labZone();
  protected readonly filter = this.address.query;
  protected readonly columns = ['title', 'kind', 'n', 'state', 'verdict', 'signed', 'createdAt'];
  protected readonly kindLabel = (item: ArchiveItem): string => STUDY_KIND_LABELS[item.kind];
  protected readonly stateLabel = (item: ArchiveItem): string => STUDY_STATE_LABELS[item.state];
  protected readonly meaning = meaningWords;
  protected readonly pageSize = computed(() => this.filter().pageSize ?? ARCHIVE_PAGE_SIZE);
  protected readonly pageIndex = computed(() => (this.filter().page ?? 1) - 1);
  protected readonly sort = computed(() => ({ active: this.filter().sort ?? 'createdAt', direction: this.filter().order ?? 'desc' }));
  protected readonly downloading = signal(false);
  protected readonly downloadError = signal<string | null>(null);

  constructor() {
    effect(() => {
      const filter = this.filter();
      untracked(() => this.store.search(filter));
    });
  }

  protected searched(fields: ArchiveFilter): void {
    const { sort, order, pageSize } = this.filter();
    this.go(withChange<ArchiveQuery>({ sort, order, pageSize }, fields));
  }

  protected sorted(sort: Sort): void {
    const active = ArchiveQuery.shape.sort.safeParse(sort.active);
    const keep = sort.direction && active.success;
    this.go({ ...this.filter(), sort: keep ? active.data : undefined, order: keep ? (sort.direction as 'asc' | 'desc') : undefined, page: undefined });
  }

  protected paged(event: PageEvent): void {
    this.go({ ...this.filter(), page: event.pageIndex + 1, pageSize: event.pageSize === ARCHIVE_PAGE_SIZE ? undefined : event.pageSize });
  }

  protected open(item: ArchiveItem): void {
    void this.router.navigate(['/archive', item.id]);
  }

  protected downloadList(): void {
    this.downloading.set(true);
    this.downloadError.set(null);
    this.downloads.save(archiveExportUrl(this.filter()), 'parallax-archive.xlsx').subscribe({
      next: () => this.downloading.set(false),
      error: (err: ApiError) => {
        this.downloading.set(false);
        this.downloadError.set(`The list could not be downloaded: ${err.message}`);
      },
    });
  }

  private go(filter: ArchiveFilter): void {
    this.address.go(filter);
  }
}
