import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { LimitResult } from '@shared/stats/reference-interval';
import { formatCi, formatNumber, levelLabel } from '../../findings/comparison/number-format';

/** The limits of one interval: each percentile's estimate with its rank-based and bootstrap CIs, and a note under a CI narrower than the step. */
@Component({
  selector: 'app-limits-table',
  styleUrl: './interval-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <table [attr.data-testid]="testId()">
      <thead>
        <tr>
          <th scope="col">Limit</th><th scope="col" class="num">Percentile</th><th scope="col" class="num">Estimate ({{ unit() }})</th>
          <th scope="col" class="num">{{ level() }} CI, rank-based</th><th scope="col" class="num">{{ level() }} CI, bootstrap</th>
        </tr>
      </thead>
      <tbody>
        @for (l of rows(); track l.name) {
          <tr [attr.data-testid]="testId() + '-' + l.key" [class.has-note]="l.note">
            <th scope="row">{{ l.name }}</th>
            <td class="num">{{ l.percentile }}</td>
            <td class="num">{{ l.estimate }}</td>
            <td class="num">{{ l.rankCi }}</td>
            <td class="num">{{ l.ci }}</td>
          </tr>
          @if (l.note) {
            <tr class="step-note" [attr.data-testid]="testId() + '-' + l.key + '-step'"><td colspan="5">{{ l.name }} limit: bootstrap {{ l.note }}</td></tr>
          }
        }
      </tbody>
    </table>
  `,
})
export class LimitsTable {
  readonly lower = input<LimitResult | null>(null);
  readonly upper = input<LimitResult | null>(null);
  readonly decimals = input.required<number>();
  readonly unit = input('');
  readonly confidence = input.required<number>();
  readonly testId = input('limits');
  /** Words for a limit whose CI is narrower than one reporting step, shown under its row; empty for none. */
  readonly lowerNote = input('');
  readonly upperNote = input('');

  protected readonly level = computed(() => levelLabel(this.confidence()));
  protected readonly rows = computed(() =>
    ([['lower', 'Lower', this.lower(), this.lowerNote()], ['upper', 'Upper', this.upper(), this.upperNote()]] as const)
      .filter(([, , l]) => l !== null)
      .map(([key, name, l, note]) => ({
        key, name, note,
        percentile: `${l!.percentile}th`,
        estimate: formatNumber(l!.estimate, this.decimals()),
        rankCi: l!.rankCi ? formatCi(l!.rankCi, this.decimals()) : 'not used by this method',
        ci: formatCi(l!.ci, this.decimals()),
      })),
  );
}
