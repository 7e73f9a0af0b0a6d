import { allowableBiasAt } from '../stats/decision-levels';
import type { DifferenceType } from '../stats/differences';

/** The allowable bias as the study states it: an absolute limit, a percentage, or both (whichever is greater). */
export interface AllowableGoal {
  absolute: number | null;
  percent: number | null;
}

/**
 * The allowable bias at a plotted x, in the plotted difference's unit: the absolute limit (or P % of x) for
 * absolute differences, and the same as a percentage of x for percent differences. At each x it is the rule
 * the decision levels are judged by (decision-levels.ts, allowableBiasAt). Infinity where a percentage of
 * zero is asked for (an absolute limit at x = 0 as a percent); null without a goal.
 */
export function allowableAt(x: number, goal: AllowableGoal, type: DifferenceType): number | null {
  const allowable = allowableBiasAt(x, goal.absolute, goal.percent);
  if (allowable === null) return null;
  if (type === 'absolute') return allowable;
  if (goal.absolute === null) return goal.percent; // P % of x is P % whatever x is
  return x === 0 ? Infinity : (100 * allowable) / Math.abs(x);
}

/** The band ±allowable across x, as points (x, half-width) along it: two for a flat band, more where it bends. */
export interface AllowableBand {
  /** Whether the band is the same width everywhere (an absolute goal on absolute differences, a percentage on percent ones). */
  flat: boolean;
  points: { x: number; half: number }[];
  /** The goal in words, for a legend: "±0.50", "±5 %", "±0.50 or ±5 %, whichever is greater". */
  words: string;
}

/**
 * The allowable-bias band over [from, to] of the plot's x axis, or null without a goal. A band that bends (a
 * percentage goal on absolute differences, an absolute goal on percent ones) is sampled at `samples` even
 * steps plus the x where the greater of the two goals changes, so its corner is drawn where it is.
 */
export function allowableBand(
  from: number, to: number, goal: AllowableGoal, type: DifferenceType, format: (v: number) => string, samples = 64,
): AllowableBand | null {
  if (goal.absolute === null && goal.percent === null) return null;
  const words = [
    goal.absolute !== null ? `±${format(goal.absolute)}` : null,
    goal.percent !== null ? `±${Number(goal.percent.toPrecision(6))} %` : null,
  ].filter((w): w is string => w !== null).join(' or ') + (goal.absolute !== null && goal.percent !== null ? ', whichever is greater' : '');
  const flat = type === 'absolute' ? goal.percent === null : goal.absolute === null;
  const xs = flat ? [from, to] : Array.from({ length: samples + 1 }, (_, k) => from + ((to - from) * k) / samples);
  if (!flat && goal.absolute !== null && goal.percent !== null && goal.percent > 0) {
    const corner = (100 * goal.absolute) / goal.percent;
    for (const c of [corner, -corner]) if (c > from && c < to) xs.push(c);
  }
  if (!flat && from < 0 && to > 0) xs.push(0);
  const points = [...new Set(xs)].sort((a, b) => a - b).map((x) => ({ x, half: allowableAt(x, goal, type)! }));
  return { flat, points, words };
}

/**
 * How far the band reaches on the difference axis, when the axis should show it: the widest half-width, unless
 * it is more than `limit` times the reach of the points and lines (then it would squeeze them into a strip;
 * the band fills the plot instead, its edges beyond it). Null without a band or when it is left to overflow.
 */
export function bandReach(band: AllowableBand | null, reach: number, limit = 2): number | null {
  if (!band) return null;
  const half = Math.max(...band.points.map((p) => p.half));
  return Number.isFinite(half) && half <= limit * reach ? half : null;
}
