import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { decisionPicture, PICTURE_TITLE } from '@shared/types/decision-track';
import { ComparisonFindingsResult, Units, stepWords } from '../comparison-result';
import { NOT_EQUIVALENCE, medianSentence } from '../verdict-wording';
import { DecisionTrackFigure } from './decision-track/decision-track';

/**
 * (a) The verdict: the study's conclusion, the decision-level picture (each level's predicted bias and CI
 * against its allowable band, the verdict word beside it), each level in a sentence, and the median bias test.
 * The picture and its words are the PDF's (shared/types/decision-track.ts).
 */
@Component({
  selector: 'app-verdict-panel',
  templateUrl: './verdict-panel.html',
  styleUrl: './verdict-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule, DecisionTrackFigure],
})
export class VerdictPanel {
  readonly result = input.required<ComparisonFindingsResult>();
  readonly units = input.required<Units>();
  /** Where the allowable bias comes from; the band's caption names it. */
  readonly source = input('');

  protected readonly pictureTitle = PICTURE_TITLE;
  protected readonly picture = computed(() => {
    const r = this.result();
    const u = this.units();
    return decisionPicture(r, {
      absolute: r.settings?.allowableBias ?? null, percent: r.settings?.allowableBiasPercent ?? null, source: this.source(),
    }, { unit: u.unit, decimals: u.decimals - 1 });
  });
  private readonly steps = computed(() => stepWords(this.result(), this.units()));
  /** The rule of the reporting step, once, when any estimate of these findings is limited by it. */
  protected readonly stepRule = computed(() => this.steps().rule);
  protected readonly median = computed(() => {
    const { notes, step } = this.steps();
    const narrow = notes['bias.median'] ? step('bias.median') : '';
    const r = this.result();
    return medianSentence(r.bias.median, this.units(), r.settings.level, r.engine.resamples, narrow);
  });
  protected readonly notEquivalence = NOT_EQUIVALENCE;
}
