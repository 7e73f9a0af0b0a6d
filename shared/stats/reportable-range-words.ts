import type { RangeFit, RangeLevelResult, RangeResult, RangeVerdict } from './reportable-range-types';
import { findingsDecimals, formatCi, formatNumber, formatP, levelLabel, MINUS, NOT_AVAILABLE, withUnit } from '../types/findings-numbers';

/**
 * The findings of a reportable-range study in words and table cells, one way for the Findings panel
 * (src/app/features/studies/kinds/reportable-range/findings), the PDF and the workbook's Results sheet
 * (server/kinds/reportable-range) and the engine's own verdict sentence (shared/stats/analyze-reportable-range.ts):
 * from the engine's result (shared/stats/reportable-range-types.ts) and the study's unit and decimals.
 * Numbers follow the one rule of shared/types/findings-numbers.ts: results and assigned values as reported, means,
 * fitted values, deviations and goals one decimal more, percentages with one.
 */
export interface RangeFormat {
  unit: string;
  /** Decimals of a result as reported. */
  value: number;
  /** Decimals of an estimate in the unit: a mean, an SD, a fitted value, a deviation, a goal. */
  stat: number;
  /** Decimals of a percentage. */
  percent: number;
}

/** The format of a study with this unit and these result decimals (the study's, 1 when unset). */
export function rangeFormat(unit: string | null | undefined, decimals: number | null | undefined): RangeFormat {
  const d = findingsDecimals(decimals);
  return { unit: unit ?? '', value: d.value, stat: d.stat, percent: d.percent };
}

export const VERDICT_HEADLINES: Record<RangeVerdict, string> = {
  'range-verified': 'Reportable range verified',
  'range-shortened': 'Reportable range shortened',
  'range-not-verified': 'Reportable range not verified',
};

/** A value as typed in Setup keeps its own decimals (at least the results', at most three more). */
export function givenText(v: number | null | undefined, f: RangeFormat): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return NOT_AVAILABLE;
  const typed = /\.(\d+)$/.exec(String(Number(v.toPrecision(12))))?.[1].length ?? 0;
  return formatNumber(v, Math.min(Math.max(typed, f.value), f.value + 3));
}

/** A level's x: its assigned value in the unit, or its mixing fraction (the column's heading says which: levelHeadings). */
export function xText(level: Pick<RangeLevelResult, 'x' | 'assigned' | 'fraction'>, f: RangeFormat): string {
  if (level.assigned !== null && level.assigned !== undefined) return givenText(level.assigned, f);
  return level.fraction !== null && level.fraction !== undefined ? formatNumber(level.fraction, 3) : NOT_AVAILABLE;
}

export function statText(v: number | null | undefined, f: RangeFormat): string {
  return formatNumber(v, f.stat);
}

export function percentText(v: number | null | undefined, f: RangeFormat): string {
  return v === null || v === undefined || !Number.isFinite(v) ? NOT_AVAILABLE : `${formatNumber(v, f.percent)}%`;
}

/** The goal in words: "0.70 mmol/L or 1.5% of the level, whichever is larger". */
export function goalText(goal: RangeResult['goal'] | null | undefined, f: RangeFormat): string {
  const abs = goal?.absolute ?? null;
  const pct = goal?.percent ?? null;
  const absText = abs !== null ? withUnit(givenText(abs, f), f.unit) : null;
  const pctText = pct !== null ? `${Number(pct.toPrecision(6))}% of the level` : null;
  if (absText && pctText) return `${absText} or ${pctText}, whichever is larger`;
  return absText ?? pctText ?? 'not set';
}

/** The verified range in words: "0.30 to 30.05 mmol/L (Level 1 to Level 6)"; "none" when no level is within. */
export function rangeText(r: Pick<RangeResult, 'verifiedRange' | 'basis'>, f: RangeFormat): string {
  const v = r.verifiedRange;
  if (!v) return 'none';
  const levels = v.lowLevel === v.highLevel ? `level "${v.lowLevel}" only` : `levels "${v.lowLevel}" to "${v.highLevel}"`;
  if (r.basis === 'fraction') return `${levels} (mean results ${statText(v.low, f)} to ${withUnit(statText(v.high, f), f.unit)})`;
  return `${givenText(v.low, f)} to ${withUnit(givenText(v.high, f), f.unit)} (${levels})`;
}

/** The claimed measuring interval in words; "not stated" without one. */
export function claimText(claimed: RangeResult['claimed'] | null | undefined, f: RangeFormat): string {
  const lo = claimed?.low ?? null;
  const hi = claimed?.high ?? null;
  if (lo === null && hi === null) return 'not stated';
  if (lo !== null && hi !== null) return `${givenText(lo, f)} to ${withUnit(givenText(hi, f), f.unit)}`;
  return lo !== null ? `from ${withUnit(givenText(lo, f), f.unit)}` : `up to ${withUnit(givenText(hi, f), f.unit)}`;
}

/** How the verified range stands against the claimed interval: "" without a claim or a range. */
export function claimSentence(r: Pick<RangeResult, 'verifiedRange' | 'claimed' | 'coversClaim'>, f: RangeFormat): string {
  const v = r.verifiedRange;
  if (r.coversClaim === null || r.coversClaim === undefined || !v) return '';
  if (r.coversClaim) return ' It covers the claimed measuring interval.';
  const short: string[] = [];
  if (r.claimed?.low !== null && r.claimed?.low !== undefined && v.low > r.claimed.low) short.push(`the claimed low end (${withUnit(givenText(r.claimed.low, f), f.unit)})`);
  if (r.claimed?.high !== null && r.claimed?.high !== undefined && v.high < r.claimed.high) short.push(`the claimed high end (${withUnit(givenText(r.claimed.high, f), f.unit)})`);
  return ` It does not reach ${short.join(' or ')}.`;
}

/** The verdict in one sentence, with the verified range and how it stands against the claim. */
export function verdictSentence(
  r: Pick<RangeResult, 'verdict' | 'verifiedRange' | 'basis' | 'coversClaim' | 'claimed'> & { levels: Pick<RangeLevelResult, 'level' | 'within'>[] },
  f: RangeFormat,
): string {
  const claim = claimSentence(r, f);
  if (r.verdict === 'range-not-verified') return 'Not verified: at no level does the deviation from linearity lie within the allowable nonlinearity.';
  if (r.verdict === 'range-verified') {
    return `Verified: at all ${r.levels.length} levels the deviation from linearity lies within the allowable nonlinearity; the reportable range is verified from ${rangeText(r, f)}.${claim}`;
  }
  const outside = r.levels.filter((l) => !l.within).map((l) => `"${l.level}"`);
  return `Shortened: the deviation from linearity exceeds the allowable nonlinearity at ${outside.length === 1 ? 'level' : 'levels'} ${outside.join(', ')}; the reportable range is verified only from ${rangeText(r, f)}.${claim}`;
}

/** Which polynomial fits best, in words. */
export function bestFitSentence(r: Pick<RangeResult, 'bestDegree' | 'alpha' | 'fits'>): string {
  const names: Record<number, string> = { 1: 'the straight line', 2: 'the quadratic (degree 2)', 3: 'the cubic (degree 3)' };
  const best = r.fits.find((x) => x.degree === r.bestDegree);
  if (r.bestDegree === 1) {
    return `The straight line fits best: no higher-degree top coefficient differs from 0 at α = ${r.alpha}, so the deviation from linearity is 0 at every level.`;
  }
  return `${capital(names[r.bestDegree] ?? `degree ${r.bestDegree}`)} fits best: its top coefficient differs from 0 (${best && best.p !== null ? (formatP(best.p).startsWith('<') ? `p ${formatP(best.p)}` : `p = ${formatP(best.p)}`) : NOT_AVAILABLE}, α = ${r.alpha}).`;
}

function capital(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}

/** A level's judgement in a table cell: "Within" / "Beyond the goal" (words, never colour alone). */
export function withinWord(l: Pick<RangeLevelResult, 'within' | 'ciBeyondGoal'>): string {
  if (!l.within) return 'Beyond the goal';
  return l.ciBeyondGoal ? 'Within (CI reaches beyond)' : 'Within';
}

export interface LevelHeadings {
  level: string; x: string; n: string; mean: string; sd: string; linear: string; fitted: string; deviation: string;
  deviationPercent: string; ci: string; goal: string; recovery: string; within: string;
}

export function levelHeadings(r: Pick<RangeResult, 'basis' | 'confidenceLevel'>, f: RangeFormat): LevelHeadings {
  const u = f.unit ? ` (${f.unit})` : '';
  return {
    level: 'Level', x: r.basis === 'fraction' ? 'Fraction of the high pool' : `Assigned${u}`, n: 'n', mean: `Mean${u}`, sd: `SD${u}`,
    linear: `Straight line${u}`, fitted: `Best fit${u}`, deviation: `Deviation${u}`, deviationPercent: 'Deviation %',
    ci: `${levelLabel(r.confidenceLevel ?? 0.95)} CI of the deviation`, goal: `Allowable${u}`, recovery: 'Recovery %', within: 'Judgement',
  };
}

export type LevelRow = Record<keyof LevelHeadings, string>;

/** One table row per level, in order of x. */
export function levelRows(r: Pick<RangeResult, 'levels'>, f: RangeFormat): LevelRow[] {
  return (r.levels ?? []).map((l) => ({
    level: l.level, x: xText(l, f), n: String(l.n), mean: statText(l.mean, f), sd: statText(l.sd, f),
    linear: statText(l.linear, f), fitted: statText(l.fitted, f), deviation: statText(l.deviation, f),
    deviationPercent: percentText(l.deviationPercent, f), ci: l.deviationCi ? formatCi(l.deviationCi, f.stat) : NOT_AVAILABLE,
    goal: `±${statText(l.goal, f)}`, recovery: percentText(l.recoveryPercent, f), within: withinWord(l),
  }));
}

/** A coefficient in a table: six significant digits, with a true minus sign. */
export function coefficientText(v: number | null | undefined): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return NOT_AVAILABLE;
  const text = Number(v.toPrecision(6)).toString();
  return text.startsWith('-') ? MINUS + text.slice(1) : text;
}

export interface FitRow { degree: string; coefficients: string; se: string; p: string; syx: string; judgement: string }

/** One table row per polynomial: "b0 = …, b1 = …", their SEs, the top coefficient's p, Sy.x, and which is best. */
export function fitRows(r: Pick<RangeResult, 'fits' | 'bestDegree'>, f: RangeFormat): FitRow[] {
  return (r.fits ?? []).map((fit: RangeFit) => ({
    degree: String(fit.degree),
    coefficients: fit.coefficients.map((b, i) => `b${i} = ${coefficientText(b)}`).join(', '),
    se: fit.se.map((s) => coefficientText(s)).join(', '),
    p: fit.degree === 1 ? NOT_AVAILABLE : formatP(fit.p),
    syx: statText(fit.syx, f),
    judgement: fit.degree === r.bestDegree ? 'Best fit' : fit.degree === 1 ? '' : fit.significant ? 'Top coefficient differs from 0' : 'Top coefficient not different from 0',
  }));
}

/** The design as label–value pairs: levels, results, exclusions, goal, claim, α, the bootstrap, the engine. */
export function designRows(r: RangeResult, f: RangeFormat): [string, string][] {
  const levels = r.levels ?? [];
  const n = levels.reduce((s, l) => s + l.n, 0);
  return [
    ['Levels with results', String(levels.length)],
    ['Results analysed', String(n)],
    ['Excluded with a reason', String(r.excludedCount ?? 0)],
    ['Levels given as', r.basis === 'fraction' ? 'mixing fractions of the high pool (no pool values: no recovery)' : 'assigned values'],
    ['Allowable nonlinearity', goalText(r.goal, f)],
    ['Claimed measuring interval', claimText(r.claimed, f)],
    ['Significance level α (top coefficients)', typeof r.alpha === 'number' ? String(r.alpha) : NOT_AVAILABLE],
    ['CIs of the deviations', r.engine?.resamples
      ? `${levelLabel(r.confidenceLevel ?? 0.95)} percentile bootstrap, ${r.engine.resamples.toLocaleString('en-US')} resamples within levels, seed "${r.engine.seed}"`
      : 'none: the straight line fits best (no resampling)'],
    ['Engine version', r.engine?.version ?? NOT_AVAILABLE],
  ];
}

/** How a level's deviation is marked in the deviation picture: filled within, half-filled within with a CI beyond, open beyond. */
export type DeviationMark = 'filled' | 'half' | 'open';

function deviationMark(l: Pick<RangeLevelResult, 'within' | 'ciBeyondGoal'>): DeviationMark {
  return !l.within ? 'open' : l.ciBeyondGoal ? 'half' : 'filled';
}

/** What the deviation picture says beside one level's track (the Findings panel and the PDF alike). */
export interface TrackWords {
  /** The level's x in words: "12.30 mmol/L", or "fraction 0.125". */
  at: string;
  mark: DeviationMark;
  /** The judgement as the level table says it. */
  word: string;
  /** A line each: the deviation (and %), its CI (or why there is none), the allowable nonlinearity there. */
  lines: string[];
}

/**
 * The words beside each level's track, in order of x. `narrowNote`, when given, is added to the CI of a level whose CI
 * is narrower than one reporting step (`resolution.limitedEstimates`).
 */
export function trackWords(r: Pick<RangeResult, 'levels' | 'confidenceLevel' | 'resolution'>, f: RangeFormat, narrowNote?: string): TrackWords[] {
  const confidence = levelLabel(r.confidenceLevel ?? 0.95);
  const narrow = new Set(r.resolution?.limitedEstimates ?? []);
  const rows = levelRows(r, f);
  return (r.levels ?? []).map((l, i) => {
    const row = rows[i];
    const ci = l.deviationCi ? `${confidence} CI ${withUnit(row.ci, f.unit)}` : 'no CI: the straight line fits best';
    return {
      at: l.assigned !== null && l.assigned !== undefined ? withUnit(row.x, f.unit) : `fraction ${row.x}`,
      mark: deviationMark(l),
      word: row.within,
      lines: [
        `deviation ${withUnit(row.deviation, f.unit)} (${row.deviationPercent})`,
        narrowNote && narrow.has(`levels.${i}.deviationCi`) ? `${ci}; ${narrowNote}` : ci,
        `allowable ${withUnit(row.goal, f.unit)}`,
      ],
    };
  });
}

/** The picture's legend words, one per mark, and its axis title. */
export function trackLegend(f: RangeFormat): Record<DeviationMark, string> & { axis: string } {
  return {
    filled: 'within',
    half: 'within, its CI reaching beyond',
    open: 'beyond the goal',
    axis: `Deviation of the best fit from the straight line${f.unit ? ` (${f.unit})` : ''}`,
  };
}

/** The band's caption: "Allowable nonlinearity 0.50 mmol/L or 1.5% of the level, whichever is larger (source: …)". */
export function goalCaption(goal: RangeResult['goal'] | null | undefined, f: RangeFormat): string {
  const source = goal?.source?.trim() ?? '';
  return `Allowable nonlinearity ${goalText(goal, f)}${source ? ` (source: ${source})` : ' (no source given)'}`;
}
