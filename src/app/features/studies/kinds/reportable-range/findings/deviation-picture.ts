import { goalCaption, trackLegend, trackWords, type DeviationMark, type RangeFormat } from '@shared/kinds/reportable-range/words';
import type { Interval } from '@shared/stats/confidence-interval';
import type { RangeResult } from '@shared/stats/reportable-range-types';
import { formatNumber, levelLabel } from '@shared/types/findings-numbers';
import { niceAxis } from '@shared/types/plot-axes';
import { NARROW_CI_SHORT } from '@shared/types/resolution-words';

/**
 * The deviation at each level as a picture against the goal, in the visual language of the decision-level picture
 * (shared/types/decision-track.ts): one horizontal track per level on a common axis of deviation, symmetric about 0 (the
 * straight line); the allowable nonlinearity at the level a hatched band with solid edges; the deviation's bootstrap CI a
 * bar with end caps; the deviation a diamond, filled when within the goal, half-filled when within but its CI reaches
 * beyond, open when beyond. The judgement's words stand beside every track; no colour carries a meaning alone. Every
 * number is the engine's (the deviation, its CI, the goal at the level, within), written by the study's words
 * (shared/kinds/reportable-range/words.ts).
 */
export type { DeviationMark } from '@shared/kinds/reportable-range/words';

export interface DeviationTrack {
  key: string;
  /** The level's name, and its x in words ("13.2 mmol/L", or "fraction 0.400"). */
  level: string;
  x: string;
  deviation: number;
  ci: Interval | null;
  /** The allowable nonlinearity at the level: the band's half-width. */
  goal: number;
  within: boolean;
  mark: DeviationMark;
  /** The judgement as the level table says it: "Within", "Within (CI reaches beyond)", "Beyond the goal". */
  word: string;
  /** The numbers beside the word, a line each: the deviation, its CI, the allowable nonlinearity. */
  lines: string[];
  /** Everything the track shows, in one line for a screen reader. */
  summary: string;
}

export interface DeviationAxis {
  min: number;
  max: number;
  ticks: number[];
  labels: string[];
  title: string;
}

export interface DeviationPicture {
  tracks: DeviationTrack[];
  axis: DeviationAxis;
  /** "95%" */
  confidence: string;
  /** The words of the three marks (shared/kinds/reportable-range/words.ts trackLegend). */
  legend: Record<DeviationMark, string>;
  /** "Allowable nonlinearity 0.50 mmol/L or 3% of the level, whichever is larger (source: …)". */
  bandCaption: string;
}

/** The picture of a result's levels, in order of x. */
export function deviationPicture(r: RangeResult, f: RangeFormat): DeviationPicture {
  const confidence = levelLabel(r.confidenceLevel ?? 0.95);
  const words = trackWords(r, f, NARROW_CI_SHORT);
  const tracks = r.levels.map((l, i): DeviationTrack => {
    const w = words[i];
    return {
      key: `levels.${i}`, level: l.level, x: w.at, deviation: l.deviation, ci: l.deviationCi, goal: l.goal, within: l.within, mark: w.mark, word: w.word,
      lines: w.lines, summary: `${l.level} (${w.at}): ${w.lines.join(', ')}. ${w.word}.`,
    };
  });
  return {
    tracks,
    axis: deviationAxis(tracks, f),
    confidence,
    legend: trackLegend(f),
    bandCaption: goalCaption(r.goal, f),
  };
}

/** Where a value falls along the axis, from 0 (left end) to 1 (right end). */
export function along(axis: Pick<DeviationAxis, 'min' | 'max'>, value: number): number {
  const span = axis.max - axis.min || 1;
  return (value - axis.min) / span;
}

/**
 * The common axis: symmetric about 0 (the straight line), wide enough for every band, CI and deviation plus a margin,
 * on ticks of 1, 2 or 5 × 10^k never finer than the deviations' decimals.
 */
function deviationAxis(tracks: readonly DeviationTrack[], f: RangeFormat): DeviationAxis {
  let reach = 0;
  const take = (v: number | null | undefined): void => {
    if (typeof v === 'number' && Number.isFinite(v)) reach = Math.max(reach, Math.abs(v));
  };
  for (const t of tracks) {
    take(t.deviation);
    take(t.goal);
    t.ci?.forEach(take);
  }
  const finest = 10 ** -f.stat;
  if (reach === 0) reach = finest * 5;
  const padded = reach * 1.12;
  // Symmetric ends in, symmetric ticks out: niceAxis ends on the multiples of its step at or beyond each end.
  const nice = niceAxis(-padded, padded, { count: 6, resolution: finest });
  return {
    min: nice.min, max: nice.max, ticks: nice.ticks,
    labels: nice.ticks.map((t) => formatNumber(t, nice.decimals)),
    title: trackLegend(f).axis,
  };
}
