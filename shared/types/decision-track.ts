import type { Interval } from '../stats/confidence-interval';
import type { DecisionLevelResult } from '../stats/comparison-types';
import type { Verdict } from '../stats/decision-levels';
import type { Resolution } from '../stats/resolution';
import { findingsDecimals, formatCi, formatNumber, levelLabel, withUnit } from './findings-numbers';
import { REGRESSION_NAMES } from './regression-words';
import { estimateStep, judgedOnSentence } from './resolution-words';
import { LEVEL_VERDICT_WORDS, VERDICT_IN_LINE, verdictWord } from '../text/verdict-words';

/**
 * The decision-level picture, as plain data for the findings page, the review page and the PDF alike: one
 * horizontal track per medical decision level on a common axis of predicted bias, showing the allowable band
 * (± the allowable bias at that level), the bias estimate as a mark, its CI as a bar and, where the CI is
 * narrower than the reporting step, the floor interval the verdict was judged on. Every number is the
 * engine's (shared/stats comparison-core.ts: allowable, verdict, judgedOn); nothing here judges anew.
 * The mark's shape carries the verdict without colour: filled (within), half-filled (inconclusive), open
 * (exceeds), and the verdict word always stands beside it.
 */

/** The picture's title, on the findings page, the review page and the PDF. */
export const PICTURE_TITLE = 'Predicted bias at each medical decision level, against the allowable bias';

/** The allowable bias as the study states it: absolute, percent of the level, or both (the greater applies). */
export interface TrackGoal {
  absolute: number | null;
  percent: number | null;
  /** Where the allowable bias comes from (a policy, a biological-variation database ...); '' when not given. */
  source: string;
}

/** How the picture writes its numbers: the result unit and the study's decimals (findings-numbers.ts decides the rest). */
export interface TrackFormat {
  unit: string;
  /** The study's decimals (the analyte's, unless changed; 1 when unset). */
  decimals: number | null | undefined;
}

/** The part of a comparison result the picture reads; results stored by an older engine may lack fields. */
export interface TrackResult {
  n?: number;
  decisionLevels?: DecisionLevelResult[] | null;
  settings?: { level?: number; allowableBias?: number | null; allowableBiasPercent?: number | null } | null;
  regression?: { method?: string | null } | null;
  resolution?: Resolution | null;
}

export type TrackMark = 'filled' | 'half' | 'open' | 'none';

/** Which part of the goal sets the band at this level. */
export type BandBasis = 'absolute' | 'percent';

export interface TrackBand {
  /** Half the band's width: the engine's allowable bias at the level. */
  half: number;
  basis: BandBasis;
  /** "±0.30 mmol/L"; with a percent goal "±0.50 mmol/L (5% of the level)"; with both, which one is the greater here. */
  text: string;
}

export interface DecisionTrack {
  /** The estimate's path in the result, as resolution.limitedEstimates names it: 'decisionLevels.0'. */
  key: string;
  level: number;
  /** The level with its unit: "10.0 mmol/L". */
  at: string;
  estimate: number | null;
  ci: Interval | null;
  /** The interval the verdict was judged on when the CI is narrower than one reporting step (the CI widened to the estimate ± half a step). */
  floor: Interval | null;
  band: TrackBand | null;
  verdict: Verdict | null;
  /** The verdict word: "Within", "Inconclusive", "Exceeds", or "No verdict". */
  word: string;
  /** What the word means here: "the whole CI lies inside the allowable band". */
  reason: string;
  mark: TrackMark;
  /** "0.05 mmol/L" */
  bias: string;
  /** "1.7%" or "" without one. */
  biasPercent: string;
  /** "0.01 to 0.17", or "not available". */
  ciText: string;
  /** "0.25 to 0.37 mmol/L" when judged on the floor, else null. */
  floorText: string | null;
  /** The numbers beside the verdict word, a line each: the bias with its CI, the floor where it applies, the band. */
  lines: string[];
  /** Everything the track shows, in one line for a screen reader. */
  summary: string;
  /** The level in a full sentence (the words under the picture). */
  sentence: string;
}

export interface TrackAxis {
  min: number;
  max: number;
  ticks: number[];
  /** The ticks written with the decimals of the tables. */
  labels: string[];
  /** "Predicted bias, candidate − comparative (mmol/L)" */
  title: string;
}

export interface DecisionPicture {
  tracks: DecisionTrack[];
  axis: TrackAxis;
  /** "95%" */
  confidence: string;
  /** The goal in words: "±0.30 mmol/L", "±5% of the level", "±0.30 mmol/L or ±5% of the level, whichever is greater"; null when not set. */
  goal: string | null;
  /** The source of the allowable bias, '' when not given. */
  source: string;
  /** The band's caption: "Allowable bias ±0.30 mmol/L (source: …)". */
  bandCaption: string;
  /** Some track shows a floor (a CI narrower than the reporting step). */
  hasFloor: boolean;
  /** The study's conclusion in one or two sentences. */
  conclusion: string;
}

/** How each verdict is marked on its track (its words: shared/text/verdict-words.ts). */
const MARKS: Record<Verdict, TrackMark> = { within: 'filled', inconclusive: 'half', exceeds: 'open' };

export { verdictWord };

/** The picture of one comparison's decision levels. */
export function decisionPicture(result: TrackResult, goal: TrackGoal, format: TrackFormat): DecisionPicture {
  const d = findingsDecimals(format.decimals);
  const confidence = levelLabel(result.settings?.level ?? 0.95);
  const stated = statedGoal(result, goal);
  const tracks = (result.decisionLevels ?? []).map((l, k) => track(l, k, stated, format, confidence, result));
  const goalWords = goalText(stated, format.unit, d.stat) ?? bandsText(tracks);
  const source = goal.source?.trim() ?? '';
  return {
    tracks,
    axis: trackAxis(tracks, d.stat, format.unit),
    confidence,
    goal: goalWords,
    source,
    bandCaption: goalWords
      ? `Allowable bias ${goalWords}${source ? ` (source: ${source})` : ' (no source given)'}`
      : 'No allowable bias is set, so no band is drawn',
    hasFloor: tracks.some((t) => t.floor !== null),
    conclusion: conclusionOf(tracks, result, format.unit, d.value, confidence, stated),
  };
}

/** Where a value falls along the axis, from 0 (left end) to 1 (right end). */
export function along(axis: Pick<TrackAxis, 'min' | 'max'>, value: number): number {
  const span = axis.max - axis.min || 1;
  return (value - axis.min) / span;
}

/**
 * A decision level in a sentence: the predicted bias, its CI and what that says against the allowable bias;
 * where the CI is narrower than the reporting step, on what the verdict was judged. `step`, that step in
 * words ("1 mmol/L").
 */
export function levelSentence(l: DecisionLevelResult, format: TrackFormat, confidence: number, step = ''): string {
  const d = findingsDecimals(format.decimals);
  const at = withUnit(formatNumber(l.level, d.value), format.unit);
  const bias = withUnit(formatNumber(l.bias?.estimate, d.stat), format.unit);
  const head = `At ${at} the predicted bias is ${bias} (${levelLabel(confidence)} CI ${formatCi(l.bias?.ci, d.stat)})`;
  const limit = l.allowable === null || l.allowable === undefined ? '' : `±${withUnit(formatNumber(l.allowable, d.stat), format.unit)}`;
  if (l.judgedOn && l.verdict) {
    const judged = `${head}. ${judgedOnSentence(withUnit(formatCi(l.judgedOn, d.stat), format.unit), step)}`;
    return `${judged}: ${LEVEL_VERDICT_WORDS[l.verdict].against('judged', limit)}.`;
  }
  if (l.verdict) return `${head}: ${LEVEL_VERDICT_WORDS[l.verdict].against('ci', limit)}.`;
  return l.allowable === null || l.allowable === undefined
    ? `${head}. No allowable bias is set for this study, so there is no verdict.`
    : `${head}. The CI could not be formed, so there is no verdict.`;
}

interface StatedGoal { absolute: number | null; percent: number | null }

/** The goal the engine judged on (its resolved settings), else the study's. */
function statedGoal(result: TrackResult, goal: TrackGoal): StatedGoal {
  const s = result.settings;
  if (s && ('allowableBias' in s || 'allowableBiasPercent' in s)) return { absolute: s.allowableBias ?? null, percent: s.allowableBiasPercent ?? null };
  return { absolute: goal.absolute, percent: goal.percent };
}

function goalText(goal: StatedGoal, unit: string, decimals: number): string | null {
  const absolute = goal.absolute !== null ? `±${withUnit(formatNumber(goal.absolute, decimals), unit)}` : null;
  const percent = goal.percent !== null ? `±${figure(goal.percent)}% of the level` : null;
  if (absolute && percent) return `${absolute} or ${percent}, whichever is greater`;
  return absolute ?? percent;
}

/** Results that do not say how the goal was stated: the band as drawn, when it is the same at every level. */
function bandsText(tracks: DecisionTrack[]): string | null {
  const texts = [...new Set(tracks.filter((t) => t.band).map((t) => t.band!.text))];
  if (!texts.length) return null;
  return texts.length === 1 ? texts[0] : 'as given at each level';
}

/** A stated percentage as typed: 5 → "5", 2.5 → "2.5". */
const figure = (value: number): string => String(Number(value.toPrecision(12)));

function band(l: DecisionLevelResult, goal: StatedGoal, unit: string, decimals: number): TrackBand | null {
  if (l.allowable === null || l.allowable === undefined || !Number.isFinite(l.allowable)) return null;
  const half = l.allowable;
  const text = `±${withUnit(formatNumber(half, decimals), unit)}`;
  if (goal.percent === null) return { half, basis: 'absolute', text };
  const fromPercent = (Math.abs(l.level) * goal.percent) / 100;
  const ofLevel = `${figure(goal.percent)}% of the level`;
  if (goal.absolute === null) return { half, basis: 'percent', text: `${text} (${ofLevel})` };
  // Both are set: the caption says "whichever is greater"; each level says which one that is.
  return fromPercent > goal.absolute
    ? { half, basis: 'percent', text: `${text} (${ofLevel})` }
    : { half, basis: 'absolute', text: `${text} (the absolute limit)` };
}

function track(l: DecisionLevelResult, k: number, goal: StatedGoal, format: TrackFormat, confidence: string, result: TrackResult): DecisionTrack {
  const { unit } = format;
  const { value: valueDecimals, stat, percent: percentDecimals } = findingsDecimals(format.decimals);
  const key = `decisionLevels.${k}`;
  const resolution = result.resolution ?? null;
  const verdict = l.verdict ?? null;
  const estimate = l.bias?.estimate ?? null;
  const ci = l.bias?.ci ?? null;
  const floor = l.judgedOn ?? null;
  const trackBand = band(l, goal, unit, stat);
  const at = withUnit(formatNumber(l.level, valueDecimals), unit);
  const reason = verdict
    ? LEVEL_VERDICT_WORDS[verdict][floor ? 'floor' : 'ci']
    : trackBand === null ? 'no allowable bias is set' : 'the CI could not be formed';
  const floorText = floor ? withUnit(formatCi(floor, stat), unit) : null;
  const bias = withUnit(formatNumber(estimate, stat), unit);
  const biasPercent = l.biasPercent === null || l.biasPercent === undefined ? '' : `${formatNumber(l.biasPercent, percentDecimals)}%`;
  const ciText = formatCi(ci, stat);
  const word = verdictWord(verdict);
  const narrow = floor || resolution?.limitedEstimates?.includes(key) ? '; the CI is narrower than one reporting step' : '';
  const summary = `At ${at}: predicted bias ${bias}, ${confidence} CI ${ciText}${narrow}${floorText ? `, judged on ${floorText}` : ''}; ` +
    `allowable ${trackBand ? trackBand.text : 'not set'}. ${word}: ${reason}.`;
  return {
    key, level: l.level, at, estimate, ci, floor, band: trackBand, verdict, word, reason,
    mark: verdict ? MARKS[verdict] : 'none',
    bias, biasPercent, ciText, floorText, summary,
    lines: [
      `${bias}, ${confidence} CI ${ciText}`,
      ...(floorText ? [`judged on ${floorText}`] : []),
      trackBand ? `allowable ${trackBand.text}` : 'no allowable bias set',
    ],
    sentence: levelSentence(l, format, result.settings?.level ?? 0.95, floor && resolution ? estimateStep(resolution, key, unit) : ''),
  };
}

/**
 * The common axis: symmetric about zero (no bias), so every band sits in the middle and a bias to either side
 * reads the same; wide enough for every band, CI, floor and estimate plus a margin, ending on ticks of 1, 2 or 5
 * × 10^k written with the tables' decimals (a step finer than those decimals is never used).
 */
function trackAxis(tracks: DecisionTrack[], decimals: number, unit: string): TrackAxis {
  let reach = 0;
  const take = (v: number | null | undefined): void => {
    if (typeof v === 'number' && Number.isFinite(v)) reach = Math.max(reach, Math.abs(v));
  };
  for (const t of tracks) {
    take(t.estimate);
    take(t.band?.half);
    t.ci?.forEach(take);
    t.floor?.forEach(take);
  }
  const finest = Math.pow(10, -decimals);
  if (reach === 0) reach = finest * 5;
  const padded = reach * 1.12;
  const raw = padded / 3; // about three ticks on each side of zero
  const power = Math.pow(10, Math.floor(Math.log10(raw)));
  let step = [1, 2, 5, 10].map((m) => m * power).find((s) => s >= raw * (1 - 1e-9)) ?? 10 * power;
  step = Math.max(step, finest);
  const count = Math.ceil(padded / step - 1e-9);
  const ticks: number[] = [];
  for (let i = -count; i <= count; i++) {
    const t = Number((i * step).toPrecision(12));
    ticks.push(t === 0 ? 0 : t);
  }
  const max = count * step;
  return {
    min: -max, max, ticks,
    labels: ticks.map((t) => formatNumber(t, decimals)),
    title: unit ? `Predicted bias at the level, candidate − comparative (${unit})` : 'Predicted bias at the level, candidate − comparative',
  };
}

/** "3.0 mmol/L", "3.0 and 10.0 mmol/L", "3.0, 10.0 and 20.0 mmol/L". */
function levelList(levels: number[], unit: string, decimals: number): string {
  const figures = levels.map((l) => formatNumber(l, decimals));
  const joined = figures.length < 2 ? figures.join('') : `${figures.slice(0, -1).join(', ')} and ${figures[figures.length - 1]}`;
  return withUnit(joined, unit);
}

/**
 * The conclusion, in one or two sentences: the verdict at each decision level, grouped by verdict in the
 * order of the levels, then on what it rests (the CI of the bias the regression predicts, with n, and the
 * floor where the CI is narrower than the reporting step).
 */
function conclusionOf(tracks: DecisionTrack[], result: TrackResult, unit: string, decimals: number, confidence: string, goal: StatedGoal): string {
  if (!tracks.length) return 'No medical decision levels are set, so no verdict is given; the bias and the regression describe the agreement.';
  const list = (filter: (t: DecisionTrack) => boolean): string => levelList(tracks.filter(filter).map((t) => t.level), unit, decimals);
  if (goal.absolute === null && goal.percent === null && tracks.every((t) => t.band === null)) {
    return `No allowable bias is set, so no verdict is given at ${tracks.length === 1 ? 'the decision level' : 'the decision levels'} (${list(() => true)}); ` +
      'the picture shows the predicted bias and its CI.';
  }
  const every = tracks.length > 1 ? `every decision level (${list(() => true)})` : `the decision level ${list(() => true)}`;
  const all = (v: Verdict | null): boolean => tracks.every((t) => t.verdict === v);
  let first: string;
  if (all('within')) first = `The predicted bias is within the allowable bias at ${every}.`;
  else if (all('exceeds')) first = `The predicted bias exceeds the allowable bias at ${every}.`;
  else if (all('inconclusive')) first = `Inconclusive at ${every}: the CI of the predicted bias crosses an edge of the allowable bias.`;
  else {
    const parts: string[] = [];
    let named = false;
    const add = (v: Verdict | null, words: (named: boolean) => string): void => {
      if (!tracks.some((t) => t.verdict === v)) return;
      parts.push(`${words(named)} at ${list((t) => t.verdict === v)}`);
      if (v !== null) named = true;
    };
    add('within', () => VERDICT_IN_LINE.within);
    add('inconclusive', () => 'inconclusive');
    add('exceeds', (n) => (n ? 'exceeds it' : VERDICT_IN_LINE.exceeds));
    add(null, () => 'no verdict');
    const text = parts.join('; ');
    first = `${text.charAt(0).toUpperCase()}${text.slice(1)}.`;
  }
  const method = REGRESSION_NAMES[result.regression?.method ?? ''] ?? null;
  const n = typeof result.n === 'number' ? ` of ${result.n.toLocaleString('en-US')} ${result.n === 1 ? 'pair' : 'pairs'}` : '';
  const source = method ? `the ${method} regression${n}` : `the regression${n}`;
  const floored = tracks.filter((t) => t.floor !== null && t.verdict !== null);
  const floor = floored.length
    ? `; at ${levelList(floored.map((t) => t.level), unit, decimals)} that CI is narrower than one reporting step, so the verdict is judged on the estimate ± half a step`
    : '';
  return `${first} Judged on the ${confidence} CI of the bias that ${source} predicts at each level${floor}.`;
}
