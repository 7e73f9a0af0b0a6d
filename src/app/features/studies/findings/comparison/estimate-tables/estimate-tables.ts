import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { DIFFERENCE_LABELS } from '../../../study-text';
import { ComparisonFindingsResult, Units, stepWords } from '../comparison-result';
import { levelLabel } from '../number-format';
import { agreementRows, regressionView, testRows } from '../summary-rows';
import { BIAS_CI_WORDS, BIAS_P_WORDS } from '@shared/types/findings-rows';
import { PluralPipe } from '../../../../../ui/plural';

/**
 * (c) The estimates: bias and agreement; how the candidate reads across the range (the regression in words,
 * shared/types/regression-words.ts, as the PDF prints it); the tests of the differences.
 */
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
  protected readonly biasCi = computed(() => BIAS_CI_WORDS[this.result().settings.interval] ?? BIAS_CI_WORDS['percentile']);
  protected readonly pWords = BIAS_P_WORDS;
  protected readonly difference = computed(() => DIFFERENCE_LABELS[this.result().differenceType]);
  private readonly notes = computed(() => stepWords(this.result(), this.units()).notes);
  protected readonly agreement = computed(() => agreementRows(this.result(), this.units(), this.notes()));
  protected readonly regression = computed(() => regressionView(this.result(), this.units(), this.notes()));
  protected readonly tests = computed(() => testRows(this.result(), this.units()));
}
