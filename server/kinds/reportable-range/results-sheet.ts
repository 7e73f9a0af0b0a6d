import {
  bestFitSentence, claimText, fitRows, givenText, goalText, levelHeadings, rangeFormat, rangeText, verdictSentence, VERDICT_HEADLINES, withinWord,
  type RangeFormat,
} from '@shared/kinds/reportable-range/words';
import type { RangeFit, RangeLevelResult, RangeResult } from '@shared/stats/reportable-range-types';
import { numberFormat, P_VALUE_FORMAT } from '@shared/types/findings-numbers';
import { FRONT, WORDS } from '../../audit/results-sheet';
import type { ServerKind, SheetCell, SheetColumn, SheetLine } from '../kind';

/*
 * The workbook's Results sheet of a reportable-range study: numbers as numbers in the decimals the PDF's tables
 * print, and the verdict, judgements and best fit in the sentences of the Findings panel and the PDF
 * (shared/kinds/reportable-range/words.ts). One line per level, one per polynomial fitted, and the study's summary.
 */

const finite = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

/** The highest degree the engine fits (shared/stats/analyze-reportable-range.ts): the sheet has a column per coefficient. */
const TOP_DEGREE = 3;
const DEGREES = Array.from({ length: TOP_DEGREE + 1 }, (_, i) => i);

/** The confidence level of the deviations' CIs. */
const ciLevel = (results: Partial<RangeResult> | null | undefined): number => (finite(results?.confidenceLevel) ? results.confidenceLevel : 0.95);

/**
 * The columns: a value (the summary's numbers), then a level's assigned value, fraction, n, mean, SD, the straight
 * line's and the best fit's values, the deviation (unit and %) with its CI, the allowable deviation and the
 * recovery; then a polynomial's degree, coefficients, their SEs, the top coefficient's p and Sy.x. Headings are the
 * PDF's (levelHeadings), without the unit, which has its own column.
 */
function rangeColumns(level: number): SheetColumn[] {
  const h = levelHeadings({ basis: 'assigned', confidenceLevel: level }, rangeFormat('', null));
  const n = (header: string, key: string, width = 12): SheetColumn => ({ header, key, width, numeric: true });
  return [
    ...FRONT, n('Value', 'value'),
    n('Assigned value', 'assigned'), n('Fraction of the high pool', 'fraction', 14), n(h.n, 'n', 6), n(h.mean, 'mean'), n(h.sd, 'sd'),
    n(h.linear, 'linear'), n(h.fitted, 'fitted'), n(h.deviation, 'deviation'), n(h.deviationPercent, 'deviationPercent'),
    n(`${h.ci}, low`, 'ciLow', 16), n(`${h.ci}, high`, 'ciHigh', 16), n(`${h.goal} (±)`, 'goal'), n(h.recovery, 'recovery'),
    n('Degree', 'degree', 8), ...DEGREES.map((i) => n(`b${i}`, `b${i}`, 14)), ...DEGREES.map((i) => n(`SE of b${i}`, `se${i}`, 14)),
    n('p of the top coefficient', 'p', 12), n('Sy.x', 'syx'),
    { header: 'Unit', key: 'unit', width: 10 }, WORDS,
  ];
}

/** The decimals a text prints ("0.300" → 3), so a cell shows a given value as the PDF writes it. */
const decimalsIn = (text: string): number => /\.(\d+)/.exec(text)?.[1].length ?? 0;

/** A level's line: its x, results, the two fits' values, the deviation with its CI and goal, recovery, and the judgement in words. */
function levelLine(l: RangeLevelResult, f: RangeFormat): SheetLine {
  const stat = numberFormat(f.stat);
  const percent = numberFormat(f.percent);
  const cells: Record<string, SheetCell> = {
    assigned: l.assigned, fraction: l.fraction, n: l.n, mean: l.mean, sd: l.sd, linear: l.linear, fitted: l.fitted,
    deviation: l.deviation, deviationPercent: l.deviationPercent, ciLow: l.deviationCi?.[0] ?? null, ciHigh: l.deviationCi?.[1] ?? null,
    goal: l.goal, recovery: l.recoveryPercent, unit: f.unit || null,
  };
  return {
    section: 'Levels', name: l.level, cells,
    formats: {
      assigned: numberFormat(decimalsIn(givenText(l.assigned, f))), fraction: '0.000', n: '0', mean: stat, sd: stat, linear: stat, fitted: stat,
      deviation: stat, deviationPercent: percent, ciLow: stat, ciHigh: stat, goal: stat, recovery: percent,
    },
    words: withinWord(l),
  };
}

/** A polynomial's line: its degree, coefficients and their SEs (on the raw x, as numbers), the top coefficient's p and Sy.x. */
function fitLine(fit: RangeFit, words: string, f: RangeFormat): SheetLine {
  const cells: Record<string, SheetCell> = { degree: fit.degree, p: fit.p, syx: fit.syx, unit: f.unit || null };
  fit.coefficients.forEach((b, i) => { cells[`b${i}`] = b; });
  fit.se.forEach((s, i) => { cells[`se${i}`] = s; });
  const names: Record<number, string> = { 1: 'Straight line', 2: 'Quadratic', 3: 'Cubic' };
  return {
    section: 'Polynomial fits', name: `${names[fit.degree] ?? 'Polynomial'} (degree ${fit.degree})`, cells,
    formats: { degree: '0', p: P_VALUE_FORMAT, syx: numberFormat(f.stat) }, words: words || undefined,
  };
}

/** The Results sheet lines of a reportable-range study: the verdict and its numbers, each level, each polynomial, the warnings. */
export function rangeLines(r: RangeResult, unit: string, decimals: number): SheetLine[] {
  const section = 'Reportable range';
  const f = rangeFormat(unit, decimals);
  const u = f.unit || null;
  const levels = r.levels ?? [];
  const given = (v: number | null | undefined): Record<string, string> => ({ value: numberFormat(decimalsIn(givenText(v, f))) });
  const range = r.verifiedRange;
  // On the 'fraction' basis the verified range's ends are the end levels' mean results.
  const ends = r.basis === 'fraction' ? { value: numberFormat(f.stat) } : null;
  const lines: SheetLine[] = [
    { section, name: 'Verdict', cells: {}, words: levels.length ? verdictSentence(r, f) : VERDICT_HEADLINES[r.verdict] },
    { section, name: 'Verified range, low end', cells: { value: range?.low ?? null, unit: u }, formats: ends ?? given(range?.low), words: rangeText(r, f) },
    { section, name: 'Verified range, high end', cells: { value: range?.high ?? null, unit: u }, formats: ends ?? given(range?.high) },
    { section, name: 'Claimed measuring interval, low end', cells: { value: r.claimed?.low ?? null, unit: u }, formats: given(r.claimed?.low), words: claimText(r.claimed, f) },
    { section, name: 'Claimed measuring interval, high end', cells: { value: r.claimed?.high ?? null, unit: u }, formats: given(r.claimed?.high) },
    {
      section, name: 'Allowable nonlinearity', cells: { value: r.goal?.absolute ?? null, unit: u }, formats: given(r.goal?.absolute),
      words: `${goalText(r.goal, f)}${r.goal?.source ? `; source: ${r.goal.source}` : ''}`,
    },
    {
      section, name: 'Allowable nonlinearity, % of the level', cells: { value: r.goal?.percent ?? null, unit: '%' },
      formats: { value: numberFormat(finite(r.goal?.percent) ? decimalsIn(String(Number(r.goal.percent.toPrecision(6)))) : 0) },
    },
    { section, name: 'Best-fitting degree', cells: { value: r.bestDegree }, formats: { value: '0' }, words: r.fits?.length ? bestFitSentence(r) : undefined },
    { section, name: 'Significance level α', cells: { value: r.alpha ?? null }, formats: { value: numberFormat(Math.max(2, decimalsIn(String(r.alpha ?? '')))) } },
    { section, name: 'Levels analysed', cells: { value: levels.length }, formats: { value: '0' } },
    { section, name: 'Results analysed', cells: { value: levels.reduce((s, l) => s + l.n, 0) }, formats: { value: '0' } },
    { section, name: 'Results excluded', cells: { value: r.excludedCount ?? 0 }, formats: { value: '0' } },
  ];
  if (r.scatterFlag) {
    lines.push({
      section, name: 'Cochran’s C of the replicate scatter', cells: { value: r.scatterFlag.c }, formats: { value: '0.000' },
      words: `level "${r.scatterFlag.level}" (critical value ${r.scatterFlag.critical.toFixed(3)})`,
    });
  }
  lines.push(...levels.map((l) => levelLine(l, f)));
  const judgements = fitRows(r, f);
  (r.fits ?? []).forEach((fit, k) => lines.push(fitLine(fit, judgements[k]?.judgement ?? '', f)));
  (r.warnings ?? []).forEach((w) => lines.push({ section: 'Warnings', name: 'Warning', cells: {}, words: w }));
  return lines;
}

/** ServerKind['resultsSheet'] of a reportable-range study: the deviations' CIs at the study's confidence level. */
export const rangeSheet: ServerKind['resultsSheet'] = {
  level: (results) => ciLevel(results as Partial<RangeResult> | null),
  columns: rangeColumns,
  lines: (results, unit, decimals) => rangeLines(results as RangeResult, unit, decimals),
};
