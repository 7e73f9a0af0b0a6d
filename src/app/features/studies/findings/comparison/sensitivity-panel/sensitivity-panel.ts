import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { ComparisonFindingsResult, Units, stepWords } from '../comparison-result';
import { sensitivityRows } from '../summary-rows';

/** (b) Sensitivity: the main estimates without the excluded rows beside the same estimates with every row. */
@Component({
  selector: 'app-sensitivity-panel',
  changeDetection: ChangeDetectionStrategy.OnPush,
  styleUrl: './sensitivity-panel.scss',
  template: `
    <section class="panel" aria-labelledby="sensitivity-heading" data-testid="sensitivity-panel">
      <h2 id="sensitivity-heading">With and without the excluded rows</h2>
      @if (rows(); as rows) {
        @if (reasonsHere()) {
          <p class="muted">{{ excluded() }}</p>
          <ng-content />
          <p class="muted">The findings above leave {{ result().excluded.count === 1 ? 'it' : 'them' }} out; here the main estimates are shown both ways.</p>
        } @else {
          <p class="muted">{{ excluded() }} The findings above leave {{ result().excluded.count === 1 ? 'it' : 'them' }} out; here the main estimates are shown both ways.</p>
        }
        <div class="table-scroll">
          <table>
            <thead><tr><th scope="col">Estimate (CI)</th><th scope="col" class="num">Without the excluded rows</th><th scope="col" class="num">With every row</th></tr></thead>
            <tbody>
              @for (r of rows; track r.name) {
                <tr><th scope="row">{{ r.name }}</th><td class="num">{{ r.main }}</td><td class="num">{{ r.all }}</td></tr>
              }
            </tbody>
          </table>
        </div>
      } @else {
        <p class="muted" data-testid="no-exclusions">No row is excluded, so the findings already use every row.</p>
      }
    </section>
  `,
})
export class SensitivityPanel {
  readonly result = input.required<ComparisonFindingsResult>();
  readonly units = input.required<Units>();
  /** True where the page lists the reasons inside this panel (the review, which has no Specimens tab). */
  readonly reasonsHere = input(false);

  protected readonly rows = computed(() => {
    const r = this.result();
    return r.sensitivity ? sensitivityRows(r, r.sensitivity, this.units(), stepWords(r, this.units()).notes) : null;
  });
  protected readonly excluded = computed(() => {
    const count = this.result().excluded.count;
    if (this.reasonsHere()) return count === 1 ? 'One row is excluded, for this reason:' : `${count} rows are excluded, for these reasons:`;
    return count === 1 ? 'One row is excluded; its reason is on the Specimens tab.' : `${count} rows are excluded; their reasons are on the Specimens tab.`;
  });
}
