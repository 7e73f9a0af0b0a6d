import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { ComparisonFindingsResult, Units, withUnit } from '../comparison-result';
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
  protected readonly rows = computed(() => {
    const u = this.units();
    return this.result().decisionLevels.map((d) => ({
      at: withUnit(formatNumber(d.level, u.decimals - 1), u.unit),
      bias: withUnit(formatNumber(d.bias.estimate, u.decimals), u.unit),
      percent: d.biasPercent === null ? '' : `${formatNumber(d.biasPercent, 1)} %`,
      ci: formatCi(d.bias.ci, u.decimals),
      allowable: d.allowable === null ? 'not set' : `±${withUnit(formatNumber(d.allowable, u.decimals), u.unit)}`,
      view: verdictView(d.verdict),
      sentence: levelSentence(d, u, this.level()),
    }));
  });
  protected readonly median = computed(() =>
    medianSentence(this.result().bias.median, this.units(), this.level(), this.result().engine.resamples),
  );
  protected readonly ciLabel = computed(() => `${levelLabel(this.level())} CI`);
  protected readonly notEquivalence = NOT_EQUIVALENCE;
}
