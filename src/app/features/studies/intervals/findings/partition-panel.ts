import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { PartitionResult } from '@shared/stats/interval-types';
import { formatNumber } from '../../findings/comparison/number-format';
import { LimitsTable } from './limits-table';
import { PARTITION_FIELD_WORDS, partitionWords } from './interval-wording';

/** The Harris & Boyd test of each partition field, its subgroups, and separate limits when recommended. */
@Component({
  selector: 'app-partition-panel',
  styleUrl: './interval-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [LimitsTable],
  template: `
    <section class="panel" aria-labelledby="partition-heading" data-testid="partitions">
      <h2 id="partition-heading">Partitions (Harris &amp; Boyd)</h2>
      <p class="muted">z = |x̄₁ − x̄₂| / √(s₁²/n₁ + s₂²/n₂) against z* = 3·√(n̄/120); also partitioned when the larger SD exceeds 1.5 times the smaller.</p>
      @for (p of fields(); track p.field) {
        <h3 [attr.data-testid]="'partition-' + p.field">{{ p.words }}</h3>
        <table>
          <thead><tr><th scope="col">Subgroup</th><th scope="col" class="num">n</th><th scope="col" class="num">Mean</th><th scope="col" class="num">SD</th><th scope="col" class="num">Lower</th><th scope="col" class="num">Upper</th></tr></thead>
          <tbody>
            @for (g of p.groups; track g.group) {
              <tr><th scope="row">{{ g.group }}</th><td class="num">{{ g.n }}</td><td class="num">{{ g.mean }}</td><td class="num">{{ g.sd }}</td><td class="num">{{ g.lower }}</td><td class="num">{{ g.upper }}</td></tr>
            }
          </tbody>
        </table>
        @if (p.intervals) {
          @for (i of p.intervals; track i.group) {
            <h3>Limits for {{ p.name }} {{ i.group }} (n = {{ i.n }})</h3>
            <app-limits-table [lower]="i.lower" [upper]="i.upper" [lowerNote]="i.lowerNote" [upperNote]="i.upperNote" [decimals]="decimals()" [unit]="unit()" [confidence]="confidence()" [testId]="'limits-' + p.field + '-' + i.group" />
            @for (w of i.warnings; track $index) { <p class="small">{{ w }}</p> }
          }
        }
      }
    </section>
  `,
})
export class PartitionPanel {
  readonly partitions = input.required<readonly PartitionResult[]>();
  readonly decimals = input.required<number>();
  readonly unit = input('');
  readonly confidence = input.required<number>();
  /** Words beside the limits whose CI is narrower than one reporting step, keyed 'partitions.<p>.intervals.<g>.lower' (intervalStepWords). */
  readonly stepNotes = input<Readonly<Partial<Record<string, string>>>>({});

  protected readonly fields = computed(() =>
    this.partitions().map((p, k) => ({
      field: p.field,
      name: PARTITION_FIELD_WORDS[p.field] ?? p.field,
      words: partitionWords(p),
      groups: p.groups.map((g) => ({
        group: g.group, n: g.n,
        mean: formatNumber(g.mean, this.decimals()), sd: formatNumber(g.sd, this.decimals()),
        lower: formatNumber(g.lower, this.decimals()), upper: formatNumber(g.upper, this.decimals()),
      })),
      intervals: p.recommended && p.intervals
        ? p.intervals.map((i, g) => ({
          ...i,
          lowerNote: this.stepNotes()[`partitions.${k}.intervals.${g}.lower`] ?? '',
          upperNote: this.stepNotes()[`partitions.${k}.intervals.${g}.upper`] ?? '',
        }))
        : null,
    })),
  );
}
