import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { ComparisonFindingsResult, Units, stepWords, withUnit } from '../comparison-result';
import { formatCi, formatNumber, levelLabel } from '../number-format';
import { NOT_EQUIVALENCE, levelSentence, medianSentence, overallSentence, verdictView } from '../verdict-wording';

/** (a) The verdict: each decision level's predicted bias and CI against the allowable bias, and the median bias test. */
@Component({
  selector: 'app-verdict-panel',
  templateUrl: './verdict-panel.html',
  styleUrl: './verdict-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule],
})
export class VerdictPanel {
  readonly result = input.required<ComparisonFindingsResult>();
  readonly units = input.required<Units>();
  readonly source = input('');

  protected readonly level = computed(() => this.result().settings.level);
  protected readonly overall = computed(() => overallSentence(this.result().decisionLevels));
  private readonly steps = computed(() => stepWords(this.result(), this.units()));
  /** The rule of the reporting step, once, when any estimate of these findings is limited by it. */
  protected readonly stepRule = computed(() => this.steps().rule);
  protected readonly rows = computed(() => {
    const u = this.units();
    const { notes, step } = this.steps();
    return this.result().decisionLevels.map((d, k) => {
      const judged = d.judgedOn ? `Verdict judged on ${withUnit(formatCi(d.judgedOn, u.decimals), u.unit)}.` : '';
      return {
        key: `decisionLevels.${k}`,
        at: withUnit(formatNumber(d.level, u.decimals - 1), u.unit),
        bias: withUnit(formatNumber(d.bias.estimate, u.decimals), u.unit),
        percent: d.biasPercent === null ? '' : `${formatNumber(d.biasPercent, 1)} %`,
        ci: formatCi(d.bias.ci, u.decimals),
        allowable: d.allowable === null ? 'not set' : `±${withUnit(formatNumber(d.allowable, u.decimals), u.unit)}`,
        view: verdictView(d.verdict),
        sentence: levelSentence(d, u, this.level(), d.judgedOn ? step(`decisionLevels.${k}`) : ''),
        note: [notes[`decisionLevels.${k}`], judged].filter(Boolean).join(' '),
      };
    });
  });
  protected readonly median = computed(() => {
    const { notes, step } = this.steps();
    const narrow = notes['bias.median'] ? step('bias.median') : '';
    return medianSentence(this.result().bias.median, this.units(), this.level(), this.result().engine.resamples, narrow);
  });
  protected readonly ciLabel = computed(() => `${levelLabel(this.level())} CI`);
  protected readonly notEquivalence = NOT_EQUIVALENCE;
}
