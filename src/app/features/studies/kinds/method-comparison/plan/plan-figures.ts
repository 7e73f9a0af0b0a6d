import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { ComparisonPlanResult } from '@shared/stats/plan-comparison';
import { DecisionCaution } from '../../../../archive/decision-caution';
import { CurveChart } from '../../../findings/charts/curve-chart';
import { REGRESSION_LABELS } from '../../../study-text';
import { planTable, powerCurves } from './plan-figures-data';
import { target } from './plan-words';

/**
 * The figures of a plan run: the recommended n (or why none on the grid will do) under the decision-support caution,
 * the table of every n and decision level, the power curves, and what to read with care.
 */
@Component({
  selector: 'app-plan-figures',
  templateUrl: './plan-figures.html',
  styleUrl: './plan-figures.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule, DecisionCaution, CurveChart],
})
export class PlanFigures {
  readonly result = input.required<ComparisonPlanResult>();
  readonly unit = input('');

  protected readonly rows = computed(() => planTable(this.result(), this.unit()));
  protected readonly curves = computed(() => powerCurves(this.result(), this.unit()));
  protected readonly targets = computed(() => ({ power: target(this.result().targetPower), falsePass: target(this.result().maxFalsePass) }));
  protected readonly method = computed(() => {
    const r = this.result();
    return `${r.simulations.toLocaleString('en-US')} simulated studies at each n, each analysed with ${REGRESSION_LABELS[r.settings.regression]} ` +
      `as planned, at ${target(r.settings.level)} CIs; seed ${r.seed}.`;
  });
}
