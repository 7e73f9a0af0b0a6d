import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { Router, RouterLink } from '@angular/router';
import { filter } from 'rxjs';
import { CHANGE_TYPE_LABELS, RELEASE_CAUTION, ReleaseQuery, type Release, type ReleaseSummary } from '@shared/schemas';
import { AuthStore } from '../../../core/auth/auth-store';
import { ApiError } from '../../../core/http/api-error';
import { ErrorBanner } from '../../../ui/error-banner';
import { ZonedPipe, labZone } from '../../../ui/lab-time';
import { FileDownload } from '../../archive/file-download';
import { listQuery } from '../../archive/list-query';
import { CreateReleaseData, CreateReleaseDialog } from '../create-release/create-release-dialog';
import { ReleaseApi } from '../release-api';
import { RELEASE_KEYS, RELEASE_PAGE_SIZE, exportFilter, releaseFilterFrom } from '../release-query';
import { DecisionCaution } from '../../archive/decision-caution';
import { ReleaseStateChip } from '../release-state-chip';
import { metWords } from '../release-words';
import { ReleaseFilters } from './release-filters';
import { ReleaseListStore } from './release-list-store';

/** Releases: every change to a method of the laboratory, searched, sorted and paged by the server. */
@Component({
  selector: 'app-release-list-page',
  templateUrl: './release-list-page.html',
  styleUrl: './release-list-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  providers: [ReleaseListStore],
  imports: [
    MatTableModule, MatSortModule, MatPaginatorModule, MatButtonModule, MatIconModule, MatProgressBarModule, RouterLink,
    ErrorBanner, ZonedPipe, ReleaseFilters, ReleaseStateChip, DecisionCaution,
  ],
})
export class ReleaseListPage {
  protected readonly caution = RELEASE_CAUTION;
  protected readonly store = inject(ReleaseListStore);
  private readonly api = inject(ReleaseApi);
  private readonly auth = inject(AuthStore);
  private readonly router = inject(Router);
  private readonly dialogs = inject(MatDialog);
  private readonly downloads = inject(FileDownload);
  protected readonly list = listQuery({
    parse: releaseFilterFrom, keys: RELEASE_KEYS, pageSize: RELEASE_PAGE_SIZE, sortKey: ReleaseQuery.shape.sort,
    sortDefault: { active: 'createdAt', direction: 'desc' }, search: (query) => this.store.search(query),
  });
  protected readonly zone = labZone();
  protected readonly canCreate = computed(() => this.auth.hasAnyRole(['technologist', 'director']));
  protected readonly canExport = computed(() => this.auth.hasAnyRole(['director', 'quality']));
  protected readonly columns = ['title', 'changeType', 'method', 'state', 'met', 'signedAt'];
  protected readonly changeLabel = (r: ReleaseSummary): string => CHANGE_TYPE_LABELS[r.changeType];
  protected readonly met = (r: ReleaseSummary): string => metWords(r.met, r.required);
  protected readonly downloading = signal(false);
  protected readonly downloadError = signal<string | null>(null);

  protected open(release: ReleaseSummary): void {
    void this.router.navigate(['/releases', release.id]);
  }

  protected create(): void {
    this.dialogs
      .open<CreateReleaseDialog, CreateReleaseData, Release>(CreateReleaseDialog, { data: {}, width: '760px', maxWidth: '95vw' })
      .afterClosed()
      .pipe(filter((r): r is Release => !!r))
      .subscribe((release) => void this.router.navigate(['/releases', release.id]));
  }

  protected exportList(): void {
    this.downloading.set(true);
    this.downloadError.set(null);
    this.downloads.save(this.api.exportUrl(exportFilter(this.list.query())), 'parallax-releases.xlsx').subscribe({
      next: () => this.downloading.set(false),
      error: (err: ApiError) => {
        this.downloading.set(false);
        this.downloadError.set(`The list could not be exported: ${err.message}`);
      },
    });
  }
}
