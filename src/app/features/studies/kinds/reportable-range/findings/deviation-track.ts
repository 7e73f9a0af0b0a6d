import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { along, type DeviationPicture } from './deviation-picture';

let figures = 0;

/** Where a mark is drawn, around (0, 0): a diamond of half-width 6.5, and its left half for "within, CI reaches beyond". */
const DIAMOND = 'M0,-6.5 L6.5,0 L0,6.5 L-6.5,0 Z';
const LEFT_HALF = 'M0,-6.5 L0,6.5 L-6.5,0 Z';

/**
 * The deviation at each level against the allowable nonlinearity (deviation-picture.ts), drawn as the decision-level
 * picture of a method comparison is (its styles are shared): one track per level, the goal a hatched band with solid
 * edges, the CI a dark bar with end caps, the deviation a diamond (filled: within; half-filled: within, its CI reaching
 * beyond; open: beyond the goal), the level at the left and the judgement's words and numbers at the right. Each track is
 * an image labelled with all it shows.
 */
@Component({
  selector: 'app-range-deviation-track',
  styleUrls: ['../../../findings/comparison/verdict-panel/decision-track/decision-track.scss', './deviation-track.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <figure class="figure" data-testid="deviation-track">
      <svg class="defs" width="0" height="0" aria-hidden="true" focusable="false">
        <defs>
          <pattern [attr.id]="hatch" patternUnits="userSpaceOnUse" width="5" height="5" patternTransform="rotate(45)">
            <rect width="5" height="5" class="band-fill" />
            <line x1="0" y1="0" x2="0" y2="5" class="hatch-line" />
          </pattern>
        </defs>
      </svg>
      <div class="rows">
        @for (t of picture().tracks; track t.key) {
          <div class="row" [attr.data-testid]="'track-' + t.key" [attr.data-within]="t.within">
            <div class="level" data-testid="track-level">{{ t.level }}<span class="x">{{ t.x }}</span></div>
            <svg class="track" role="img" [attr.aria-label]="t.summary" width="100%" height="44" focusable="false">
              @for (tick of ticks(); track tick.value) {
                @if (tick.value !== 0) {
                  <line class="grid" [attr.x1]="tick.x" [attr.x2]="tick.x" y1="0" y2="44" />
                }
              }
              <line class="rule" x1="0" x2="100%" y1="22" y2="22" />
              <rect class="band" data-testid="track-band" [attr.x]="x(-t.goal)" [attr.width]="span(-t.goal, t.goal)" y="12" height="20"
                [attr.fill]="'url(#' + hatch + ')'" />
              <line class="band-edge" [attr.x1]="x(-t.goal)" [attr.x2]="x(-t.goal)" y1="12" y2="32" />
              <line class="band-edge" [attr.x1]="x(t.goal)" [attr.x2]="x(t.goal)" y1="12" y2="32" />
              <line class="zero" [attr.x1]="zero()" [attr.x2]="zero()" y1="0" y2="44" />
              @if (t.ci; as ci) {
                <line class="ci" data-testid="track-ci" [attr.x1]="x(ci[0])" [attr.x2]="x(ci[1])" y1="22" y2="22" />
                <line class="cap" [attr.x1]="x(ci[0])" [attr.x2]="x(ci[0])" y1="17" y2="27" />
                <line class="cap" [attr.x1]="x(ci[1])" [attr.x2]="x(ci[1])" y1="17" y2="27" />
              }
              <svg [attr.x]="x(t.deviation)" y="22" width="1" height="1" overflow="visible" class="mark" data-testid="track-mark" [attr.data-mark]="t.mark">
                <path [attr.d]="diamond" [attr.fill]="t.mark === 'filled' ? 'var(--track-ink)' : '#ffffff'" />
                @if (t.mark === 'half') {
                  <path [attr.d]="leftHalf" class="half" />
                }
                <path [attr.d]="diamond" class="outline" fill="none" />
              </svg>
            </svg>
            <div class="words">
              <strong class="word" data-testid="judgement">{{ t.word }}</strong>
              @for (line of t.lines; track $index) {
                <span class="detail">{{ line }}</span>
              }
            </div>
          </div>
        }
        <div class="row axis-row" aria-hidden="true">
          <div></div>
          <svg class="axis" width="100%" height="38" focusable="false">
            <line class="axis-line" x1="0" x2="100%" y1="2" y2="2" />
            @for (tick of ticks(); track tick.value) {
              <line class="axis-line" [attr.x1]="tick.x" [attr.x2]="tick.x" y1="2" y2="6" />
              <text [attr.x]="tick.x" y="17" text-anchor="middle">{{ tick.label }}</text>
            }
            <text x="50%" y="33" text-anchor="middle" class="axis-title">{{ picture().axis.title }}</text>
          </svg>
          <div></div>
        </div>
      </div>
      <figcaption class="legend" data-testid="deviation-legend">
        <span class="key"><svg width="16" height="16" aria-hidden="true"><path transform="translate(8 8) scale(0.85)" [attr.d]="diamond" class="filled" /></svg>{{ picture().legend.filled }}</span>
        <span class="key"><svg width="16" height="16" aria-hidden="true"><g transform="translate(8 8) scale(0.85)"><path [attr.d]="diamond" fill="#ffffff" /><path [attr.d]="leftHalf" class="half" /><path [attr.d]="diamond" class="outline" fill="none" /></g></svg>{{ picture().legend.half }}</span>
        <span class="key"><svg width="16" height="16" aria-hidden="true"><path transform="translate(8 8) scale(0.85)" [attr.d]="diamond" class="outline" fill="#ffffff" /></svg>{{ picture().legend.open }}</span>
        <span class="key"><svg width="18" height="16" aria-hidden="true"><line class="ci" x1="2" x2="16" y1="8" y2="8" /><line class="cap" x1="2" x2="2" y1="4" y2="12" /><line class="cap" x1="16" x2="16" y1="4" y2="12" /></svg>{{ picture().confidence }} CI</span>
        <span class="key band-key" data-testid="band-caption"><svg width="18" height="16" aria-hidden="true"><rect x="1" y="3" width="16" height="10" [attr.fill]="'url(#' + hatch + ')'" /><line class="band-edge" x1="1" x2="1" y1="3" y2="13" /><line class="band-edge" x1="17" x2="17" y1="3" y2="13" /></svg>{{ picture().bandCaption }}</span>
      </figcaption>
    </figure>
  `,
})
export class RangeDeviationTrack {
  readonly picture = input.required<DeviationPicture>();

  /** Pattern ids unique on the page, since every track's SVG refers to the hatching by id. */
  protected readonly hatch = `range-hatch-${++figures}`;
  protected readonly diamond = DIAMOND;
  protected readonly leftHalf = LEFT_HALF;
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
}
