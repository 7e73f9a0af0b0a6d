import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { Study } from '@shared/schemas';
import { CurveChart } from '../../../findings/charts/curve-chart';
import type { SetupGroup } from '../../../setup/setup-form-group';
import { settingSignal } from './setting-signal';
import { DEFAULT_VERIFY_N, transferencePlan, verifyN } from './transference-data';

/**
 * "How often the rule accepts": for the planned number of local individuals, the chance that the transference rule
 * accepts a stated interval when a given share of the local population falls outside it (shared/stats/plan-transference,
 * computed here as the planned number changes; nothing is saved).
 */
@Component({
  selector: 'app-transference-plan',
  styleUrl: './interval-plan.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [CurveChart],
  template: `
    <section class="panel" aria-labelledby="transference-heading" data-testid="transference-plan">
      <h2 id="transference-heading">How often the rule accepts</h2>
      <p class="muted intro">
        The rule: accept the stated interval when at most {{ plan().k }} of {{ plan().n }} individuals fall outside it; when more do, test
        {{ plan().n }} more and accept when at most {{ plan().k }} of those fall outside (CLSI EP28-A3c practice). Worked out here from the
        binomial distribution for the planned number{{ usingDefault() ? ' (' + defaultN + ' while none is planned)' : '' }}; nothing is saved.
      </p>
      <p class="sentence" data-testid="transference-sentence">{{ plan().sentence }}</p>
      <div class="columns">
        <table data-testid="transference-table">
          <caption>{{ plan().n }} individuals, at most {{ plan().k }} outside</caption>
          <thead>
            <tr>
              <th scope="col" class="num">True share outside</th>
              <th scope="col" class="num">Accepted at first</th>
              <th scope="col" class="num">Accepted with the retest</th>
            </tr>
          </thead>
          <tbody>
            @for (r of plan().rows; track r.outside) {
              <tr [attr.data-testid]="'transference-row-' + $index">
                <th scope="row" class="num">{{ r.outside }}</th>
                <td class="num">{{ r.acceptFirst }}</td>
                <td class="num">{{ r.acceptWithRetest }}</td>
              </tr>
            }
          </tbody>
        </table>
        <app-curve-chart
          [curves]="plan().curves"
          heading="Chance of accepting against the share outside"
          caption="Dashed, triangles: accepted at the first test. Solid, circles: accepted at the first test or the retest. The dotted line marks 10% outside."
          testId="transference-chart"
        />
      </div>
      <p class="muted small">
        The retest is a second chance for any population, so it raises acceptance at every share outside, also for a population the
        stated interval does not fit.
      </p>
    </section>
  `,
})
export class TransferencePlan {
  readonly form = input.required<SetupGroup>();
  readonly study = input<Study | null>(null);
  readonly readonly = input(false);

  protected readonly defaultN = DEFAULT_VERIFY_N;
  private readonly planned = settingSignal(this.form, (f) => f.controls.settings.controls.plannedSpecimens);
  protected readonly usingDefault = computed(() => verifyN(this.planned()) !== this.planned());
  protected readonly plan = computed(() => transferencePlan(verifyN(this.planned())));
}
