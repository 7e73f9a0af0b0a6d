import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { DIFFERENCE_LABELS } from '../../../study-text';
import { ComparisonFindingsResult, Units, stepWords } from '../comparison-result';
import { formatNumber, formatP, levelLabel } from '../number-format';
import { agreementRows, regressionName, regressionRows } from '../summary-rows';
import { NO_P_VALUE } from '../verdict-wording';
import { PluralPipe } from '../../../../../ui/plural';

/** (c) The tables: bias and agreement, the tests of the differences, and the regression. */
@Component({
  selector: 'app-estimate-tables',
  templateUrl: './estimate-tables.html',
  styleUrl: './estimate-tables.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [PluralPipe],
})
export class EstimateTables {
  readonly result = input.required<ComparisonFindingsResult>();
  readonly units = input.required<Units>();

  protected readonly ciLabel = computed(() => `${levelLabel(this.result().settings.level)} CI`);
  protected readonly difference = computed(() => DIFFERENCE_LABELS[this.result().differenceType]);
  private readonly notes = computed(() => stepWords(this.result(), this.units()).notes);
  protected readonly agreement = computed(() => agreementRows(this.result(), this.units(), this.notes()));
  protected readonly regression = computed(() => regressionRows(this.result(), this.units(), this.notes()));
  protected readonly method = computed(() => regressionName(this.result(), this.result().settings.demingRatioConvention));
  protected readonly ciMethod = computed(() => {
    const m = this.result().regression.ciMethod;
    return m === 'rank' ? 'rank-based CIs' : m === 'jackknife' ? 'jackknife CIs' : m === 'bootstrap' ? 'bootstrap CIs of resampled pairs' : 'no CIs';
  });
  protected readonly tests = computed(() => {
    const r = this.result();
    const s = r.signTest;
    const w = r.wilcoxon;
    const m = r.biasTests.median;
    return [
      { name: 'Shifted-null bootstrap test, median bias = 0', detail: m ? `observed ${formatNumber(m.observed, this.units().differenceDecimals)} ${this.units().difference}` : NO_P_VALUE, p: formatP(m?.pValue) },
      { name: 'Shifted-null bootstrap test, mean bias = 0', detail: r.biasTests.mean ? `observed ${formatNumber(r.biasTests.mean.observed, this.units().differenceDecimals)} ${this.units().difference}` : NO_P_VALUE, p: formatP(r.biasTests.mean?.pValue) },
      { name: 'Sign test', detail: `${s.positive} above, ${s.negative} below, ${s.zeros} equal`, p: formatP(s.pValue) },
      { name: 'Wilcoxon signed-rank test', detail: w.statistic === null ? 'not run' : `V = ${formatNumber(w.statistic, 1)}, n = ${w.n}, ${w.method === 'exact' ? 'exact' : 'normal approximation'}`, p: formatP(w.pValue) },
    ];
  });
}
