import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { LimitResult } from '../../../../../../shared/stats/reference-interval';
import { formatCi, formatNumber, levelLabel } from '../../findings/comparison/number-format';

/** The limits of one interval: each percentile's estimate with its rank-based and bootstrap CIs. */
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
          <tr [attr.data-testid]="testId() + '-' + l.key">
            <th scope="row">{{ l.name }}</th>
            <td class="num">{{ l.percentile }}</td>
            <td class="num">{{ l.estimate }}</td>
            <td class="num">{{ l.rankCi }}</td>
            <td class="num">{{ l.ci }}</td>
          </tr>
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

  protected readonly level = computed(() => levelLabel(this.confidence()));
  protected readonly rows = computed(() =>
    ([['lower', 'Lower', this.lower()], ['upper', 'Upper', this.upper()]] as const)
      .filter(([, , l]) => l !== null)
      .map(([key, name, l]) => ({
        key, name,
        percentile: `${l!.percentile}th`,
        estimate: formatNumber(l!.estimate, this.decimals()),
        rankCi: l!.rankCi ? formatCi(l!.rankCi, this.decimals()) : 'not used by this method',
        ci: formatCi(l!.ci, this.decimals()),
      })),
  );
}
