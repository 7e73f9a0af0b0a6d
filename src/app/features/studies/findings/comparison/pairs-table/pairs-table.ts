import { ChangeDetectionStrategy, Component, ElementRef, afterRenderEffect, computed, inject, input, model } from '@angular/core';
import { MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { TableView } from '../../../../../ui/table-view';
import { type PairFormat, type PairRow, pairFlags } from './pair-rows';

/** The columns of the table of pairs, in order. */
export const PAIR_COLUMNS = ['position', 'label', 'comparative', 'candidate', 'difference', 'percent', 'standardized', 'flags'] as const;

/** What a column sorts by: numbers as numbers (a missing one last), labels as text, flags by how many. */
export function pairSortValue(row: PairRow, column: string): string | number | null {
  switch (column) {
    case 'label': return row.label;
    case 'comparative': return row.comparative;
    case 'candidate': return row.candidate;
    case 'difference': return row.difference;
    case 'percent': return row.percent;
    case 'standardized': return row.standardized;
    case 'flags': return pairFlags(row).length;
    default: return row.position;
  }
}

/**
 * Every analysed pair in a sortable table: label, both results, the difference, the % difference and the
 * standardized difference, and its flags, so the director can see which specimens drive the bias. A row
 * and a point are the same specimen: choosing a row rings its point on the plots, and a clicked point
 * selects its row here and scrolls it into view.
 */
@Component({
  selector: 'app-pairs-table',
  templateUrl: './pairs-table.html',
  styleUrl: './pairs-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatTableModule, MatSortModule],
})
export class PairsTable {
  /** The pairs, or null when the rows changed since the analysis. */
  readonly rows = input<PairRow[] | null>(null);
  readonly format = input.required<PairFormat>();
  /** The grid position of the chosen specimen. */
  readonly selected = model<number | null>(null);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);

  protected readonly columns = [...PAIR_COLUMNS];
  private readonly source = computed(() => this.rows() ?? []);
  protected readonly view = new TableView<PairRow>(this.source, () => '', pairSortValue);

  protected readonly heads = computed(() => {
    const f = this.format();
    const unit = (name: string): string => (f.unit ? `${name} (${f.unit})` : name);
    return {
      comparative: unit('Comparative'), candidate: unit('Candidate'), difference: unit('Difference y − x'),
      percent: `% difference (of the ${f.percentOf})`, standardized: 'Standardized difference',
    };
  });
  protected readonly flags = pairFlags;
  protected readonly count = computed(() => this.source().length);
  protected readonly summary = computed(() => {
    const rows = this.source();
    const outliers = rows.filter((r) => r.outlier).length;
    const beyond = rows.filter((r) => r.beyondLimits).length;
    const excluded = rows.filter((r) => r.excluded).length;
    return `${rows.length} pairs; ${outliers} possible ${outliers === 1 ? 'outlier' : 'outliers'}, ${beyond} beyond the limits of agreement, ${excluded} excluded.`;
  });

  constructor() {
    // A point clicked on a plot: bring its row into view (the nearest edge, so a visible row stays put).
    afterRenderEffect(() => {
      const position = this.selected();
      if (position === null) return;
      const row = this.host.nativeElement.querySelector<HTMLElement>(`[data-testid="pair-${position}"]`);
      row?.scrollIntoView?.({ block: 'nearest' });
    });
  }

  protected choose(row: PairRow): void {
    this.selected.set(this.selected() === row.position ? null : row.position);
  }

  protected text(row: PairRow, column: 'comparative' | 'candidate' | 'difference' | 'percent' | 'standardized'): string {
    const f = this.format();
    if (column === 'comparative' || column === 'candidate') return f.value(row[column]);
    if (column === 'difference') return f.difference(row.difference);
    if (column === 'percent') return f.percent(row.percent);
    return f.standardized(row.standardized);
  }
}
