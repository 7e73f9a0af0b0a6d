import { ChangeDetectionStrategy, Component, computed, inject, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import type { GridRow } from '../../../specimens/specimen-layout';
import { ComparisonFindingsResult } from '../comparison-result';
import { FLAG_IS_NOT_A_REASON, outlierRuleWords } from '@shared/types/findings-rows';
import { askExclusionReason } from './exclude-dialog';

/** A row to exclude, by its grid position (1-based), with the reason the user gave. */
export interface Exclusion {
  position: number;
  reason: string;
}

/** The outliers the stated rule flagged, each with an Exclude button that asks for the reason; then the warnings. */
@Component({
  selector: 'app-outlier-list',
  templateUrl: './outlier-list.html',
  styleUrl: '../estimate-tables/estimate-tables.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule],
})
export class OutlierList {
  readonly result = input.required<ComparisonFindingsResult>();
  readonly rows = input.required<readonly GridRow[]>();
  /** False when the rows changed since the analysis, or the study no longer changes: no Exclude buttons. */
  readonly canExclude = input(false);
  readonly excluded = output<Exclusion>();
  private readonly dialogs = inject(MatDialog);

  /** The rule as applied and what a flag means, in the words the PDF prints (shared/types/findings-rows.ts). */
  protected readonly rule = computed(() => outlierRuleWords(this.result().outlierTest));
  protected readonly flagWords = FLAG_IS_NOT_A_REASON;
  protected readonly flagged = computed(() => {
    const positions = this.result().outlierPositions ?? this.result().outliers;
    return positions.map((position) => {
      const row = this.rows()[position - 1];
      return {
        position,
        label: row ? String(row['label'] || '—') : '—',
        comparative: row ? String(row['comparative']) : '',
        candidate: row ? String(row['candidate']) : '',
        excluded: row?.['excluded'] === true,
      };
    });
  });

  protected ask(position: number, label: string): void {
    askExclusionReason(this.dialogs, position, label).subscribe((reason) => this.excluded.emit({ position, reason }));
  }
}
