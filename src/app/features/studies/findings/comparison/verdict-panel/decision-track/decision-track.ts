import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { along, type DecisionPicture, type DecisionTrack, type TrackMark } from '@shared/types/decision-track';
import { LEVEL_VERDICT_WORDS } from '@shared/text/verdict-words';

let figures = 0;

/** Where a mark of each kind is drawn, around (0, 0): a diamond of half-width 6, and its left half for "inconclusive". */
const DIAMOND = 'M0,-6.5 L6.5,0 L0,6.5 L-6.5,0 Z';
const LEFT_HALF = 'M0,-6.5 L0,6.5 L-6.5,0 Z';

/**
 * The decision-level picture (shared/types/decision-track.ts): one horizontal track per medical decision level
 * on a common axis of predicted bias. The allowable band is a hatched light-teal rectangle with solid edges,
 * the CI a dark bar with end caps, the floor (a CI narrower than the reporting step) a dashed ochre frame
 * around it, the estimate a diamond: filled when within, half-filled when inconclusive, open when it exceeds.
 * The level stands at the left, the verdict word and its numbers at the right as text; each track is an image
 * with a label that says all it shows. No colour carries a meaning alone.
 */
@Component({
  selector: 'app-decision-track',
  templateUrl: './decision-track.html',
  styleUrl: './decision-track.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DecisionTrackFigure {
  readonly picture = input.required<DecisionPicture>();

  /** Pattern ids unique on the page, since every track's SVG refers to the hatching by id. */
  protected readonly hatch = `decision-hatch-${++figures}`;
  protected readonly diamond = DIAMOND;
  protected readonly leftHalf = LEFT_HALF;
  /** The legend's words for the three marks (shared/text/verdict-words.ts), as the PDF's legend says them. */
  protected readonly legend = { within: LEVEL_VERDICT_WORDS.within.legend, inconclusive: LEVEL_VERDICT_WORDS.inconclusive.legend, exceeds: LEVEL_VERDICT_WORDS.exceeds.legend };
  protected readonly ticks = computed(() => {
    const axis = this.picture().axis;
    return axis.ticks.map((value, k) => ({ value, label: axis.labels[k], x: this.x(value) }));
  });
  protected readonly zero = computed(() => this.x(0));

  /** A value's place along the track, as an SVG percentage of its width. */
  protected x(value: number): string {
    return `${(along(this.picture().axis, value) * 100).toFixed(3)}%`;
  }

  protected span(from: number, to: number): string {
    const axis = this.picture().axis;
    return `${(Math.max(0, along(axis, to) - along(axis, from)) * 100).toFixed(3)}%`;
  }

  protected markFill(mark: TrackMark): string {
    return mark === 'filled' ? 'var(--track-ink)' : '#ffffff';
  }

  protected trackId(t: DecisionTrack): string {
    return t.key;
  }
}
