import { ChangeDetectionStrategy, Component, computed, inject, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { formatNumber } from '../../findings/comparison/number-format';
import { askExclusionReason } from '../../findings/comparison/outlier-list/exclude-dialog';
import type { Exclusion } from '../../findings/comparison/outlier-list/outlier-list';
import type { GridRow } from '../../specimens/specimen-layout';
import type { EstablishResult } from './interval-result';

/** The values flagged by Tukey's fences or Dixon's rule, each with an Exclude button that asks for the reason. */
@Component({
  selector: 'app-interval-outliers',
  styleUrl: './interval-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule],
  template: `
    <section class="panel" aria-labelledby="interval-outliers-heading" data-testid="outliers">
      <h2 id="interval-outliers-heading">Possible outliers</h2>
      <p class="muted">
        Tukey's fences: below {{ fences().lower }} or above {{ fences().upper }} (Q1 − 1.5·IQR, Q3 + 1.5·IQR).
        Dixon's rule: an extreme value whose gap to the next exceeds one third of the range.
        A flag is not a reason: exclude an individual only for a documented cause.
      </p>
      @if (flagged().length === 0) {
        <p data-testid="no-outliers">No value is flagged.</p>
      } @else {
        <table>
          <thead><tr><th scope="col">Row</th><th scope="col">Individual</th><th scope="col" class="num">Value</th><th scope="col">Flagged by</th><th scope="col"><span class="cdk-visually-hidden">Action</span></th></tr></thead>
          <tbody>
            @for (o of flagged(); track o.position) {
              <tr [attr.data-testid]="'outlier-' + o.position">
                <th scope="row">{{ o.position }}</th><td>{{ o.label }}</td><td class="num">{{ o.value }}</td><td>{{ o.rules }}</td>
                <td class="num">
                  @if (o.excluded) {
                    <span class="muted">Excluded; run again to update</span>
                  } @else if (canExclude()) {
                    <button mat-stroked-button type="button" class="no-print" (click)="ask(o.position, o.label)" [attr.data-testid]="'exclude-' + o.position"><mat-icon>block</mat-icon> Exclude…</button>
                  }
                </td>
              </tr>
            }
          </tbody>
        </table>
      }
    </section>
  `,
})
export class IntervalOutliers {
  readonly result = input.required<EstablishResult>();
  readonly rows = input.required<readonly GridRow[]>();
  readonly decimals = input.required<number>();
  readonly canExclude = input(false);
  readonly excluded = output<Exclusion>();
  private readonly dialogs = inject(MatDialog);

  protected readonly fences = computed(() => {
    const t = this.result().outlierScreen.tukey;
    return { lower: formatNumber(t.lowerFence, this.decimals()), upper: formatNumber(t.upperFence, this.decimals()) };
  });
  protected readonly flagged = computed(() => {
    const r = this.result();
    const positions = r.outlierPositions ?? r.outliers;
    return r.outliers.map((analysed, i) => {
      const position = positions[i] ?? analysed;
      const row = this.rows()[position - 1];
      const rules = [r.outlierScreen.tukey.rows.includes(analysed) ? "Tukey's fences" : '', r.outlierScreen.dixon.rows.includes(analysed) ? "Dixon's rule" : ''];
      return {
        position,
        label: row ? String(row['label'] || '—') : '—',
        value: row ? String(row['value']) : '',
        rules: rules.filter(Boolean).join(', '),
        excluded: row?.['excluded'] === true,
      };
    });
  });

  protected ask(position: number, label: string): void {
    askExclusionReason(this.dialogs, position, label).subscribe((reason) => this.excluded.emit({ position, reason }));
  }
}
