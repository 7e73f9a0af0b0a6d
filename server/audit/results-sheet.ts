import type ExcelJS from 'exceljs';
import type { ComparisonResult, IntervalResult, LimitResult } from '@shared/stats';
import type { VerifyIntervalResult } from '@shared/stats/verify-interval';
import { findingsDecimals, formatNumber, levelLabel, numberFormat, P_VALUE_FORMAT, withUnit } from '@shared/types/findings-numbers';
import { agreementRows, differenceUnitOf, testRows, type ComparisonUnits, type FindingsRow } from '@shared/types/findings-rows';
import { NO_VERDICT, VERDICT_WORDS } from '@shared/text/verdict-words';
import {
  correlationDetails, interceptSentence, linearitySentence, REGRESSION_HEADING, regressionCiWords, regressionMethod, regressionRows, slopeSentence,
} from '@shared/types/regression-words';
import type { ServerKind, SheetCell, SheetColumn, SheetLine } from '../kinds/kind';
import { INTERVAL_METHOD_WORDS, PARTITION_WORDS } from '../reports/words';

/**
 * The full record's Results sheet, laid out like the findings tables: one row per estimate with its value,
 * CI, p-value and unit as numbers (each with the number format of the decimals the tables print), the
 * result in words beside it, and only the columns the study's kind uses. Names, decimals and words come
 * from the same shared functions as the findings page and the PDF (shared/types/findings-rows.ts,
 * regression-words.ts), so the regression's CI method is named as the report names it.
 */

type Line = SheetLine;
type ColumnSpec = SheetColumn;
type Cell = SheetCell;

export const WORDS: ColumnSpec = { header: 'In words', key: 'words', width: 90 };
export const FRONT: ColumnSpec[] = [{ header: 'Section', key: 'section', width: 30 }, { header: 'Estimate', key: 'name', width: 44 }];

/** The columns of a comparison: value, CI and p. */
export function comparisonColumns(level: number): ColumnSpec[] {
  const ci = levelLabel(level);
  return [...FRONT, { header: 'Value', key: 'value', width: 12, numeric: true }, { header: `${ci} CI low`, key: 'ciLow', width: 12, numeric: true },
    { header: `${ci} CI high`, key: 'ciHigh', width: 12, numeric: true }, { header: 'p', key: 'p', width: 9, numeric: true }, { header: 'Unit', key: 'unit', width: 10 }, WORDS];
}

/** The columns of an establishment: each limit with its rank-based and bootstrap CIs. */
export function establishColumns(level: number): ColumnSpec[] {
  const ci = levelLabel(level);
  return [...FRONT, { header: 'Percentile', key: 'percentile', width: 11, numeric: true }, { header: 'Value', key: 'value', width: 12, numeric: true },
    { header: `${ci} CI low, rank-based`, key: 'rankLow', width: 16, numeric: true }, { header: `${ci} CI high, rank-based`, key: 'rankHigh', width: 16, numeric: true },
    { header: `${ci} CI low, bootstrap`, key: 'ciLow', width: 16, numeric: true }, { header: `${ci} CI high, bootstrap`, key: 'ciHigh', width: 16, numeric: true },
    { header: 'Unit', key: 'unit', width: 10 }, WORDS];
}

/** The columns of a count: a value and its unit. */
export function valueColumns(): ColumnSpec[] {
  return [...FRONT, { header: 'Value', key: 'value', width: 12, numeric: true }, { header: 'Unit', key: 'unit', width: 10 }, WORDS];
}

/** A shared table row as a sheet line: the numbers stored as numbers, in the decimals the tables print. */
export function fromRow(section: string, r: FindingsRow, words?: string): Line {
  const format = numberFormat(r.decimals);
  const cells: Record<string, Cell> = { value: r.estimate, unit: r.unit || null };
  const formats: Record<string, string> = { value: format, ciLow: format, ciHigh: format, p: P_VALUE_FORMAT };
  if (r.ci !== undefined) Object.assign(cells, { ciLow: r.ci?.[0] ?? null, ciHigh: r.ci?.[1] ?? null });
  if (r.p !== undefined) cells.p = r.p;
  const missingCi = r.ci === null ? 'CI not available' : undefined;
  return { section, name: r.name, cells, formats, words: [words ?? r.words, missingCi].filter(Boolean).join('; ') || undefined };
}

export function comparisonLines(r: ComparisonResult, unit: string, decimals: number): Line[] {
  const units: ComparisonUnits = { unit, difference: differenceUnitOf(r.differenceType, unit), decimals: findingsDecimals(decimals, r.differenceType) };
  const d = units.decimals;
  const level = r.settings?.level ?? 0.95;
  const reg = r.regression;
  const count = (section: string, name: string, value: number | null | undefined, words?: string): Line =>
    ({ section, name, cells: { value: value ?? null }, formats: { value: '0' }, words });
  const agreement = 'Bias and agreement';
  const lines: Line[] = [
    count(agreement, 'Pairs analysed', r.n),
    count(agreement, 'Pairs excluded', r.excluded?.count ?? 0),
    ...agreementRows(r, units).map((row) => fromRow(agreement, row)),
  ];
  if (reg) {
    const sentence: Record<string, string> = {
      'regression.slope': slopeSentence(reg, level, units),
      'regression.intercept': interceptSentence(reg, level, units),
      'regression.linearityP': linearitySentence(reg),
      'regression.correlation': correlationDetails(reg, units),
    };
    lines.push(
      { section: REGRESSION_HEADING, name: 'Method', cells: {}, words: regressionMethod({ regression: reg, level, units, interval: r.settings?.interval, demingRatioConvention: r.settings?.demingRatioConvention }) },
      { section: REGRESSION_HEADING, name: 'CIs of slope and intercept', cells: {}, words: regressionCiWords(reg.ciMethod, r.settings?.interval) },
      ...regressionRows(reg, units).map((row) => fromRow(REGRESSION_HEADING, row, sentence[row.path])),
    );
    if (reg.method !== 'passing-bablok') lines.push({ section: REGRESSION_HEADING, name: 'Linearity', cells: {}, words: linearitySentence(reg) });
  }
  const tests = 'Tests of the differences against zero';
  lines.push(...testRows(r, units).map((row) => fromRow(tests, row)));
  const levels = 'Decision levels';
  for (const l of r.decisionLevels ?? []) {
    const at = withUnit(formatNumber(l.level, d.value), unit);
    const allowable = l.allowable === null ? 'no allowable bias set' : `allowable ±${withUnit(formatNumber(l.allowable, d.stat), unit)}`;
    const verdict = l.verdict ? VERDICT_WORDS[l.verdict] : NO_VERDICT.word;
    lines.push(fromRow(levels, { path: '', name: `Predicted bias at ${at}`, estimate: l.bias.estimate, ci: l.bias.ci, unit, decimals: d.stat }, `${verdict} (${allowable})`));
    if (l.biasPercent !== null) lines.push({ section: levels, name: `Predicted bias at ${at}, % of the level`, cells: { value: l.biasPercent, unit: '%' }, formats: { value: numberFormat(d.percent) } });
  }
  return lines;
}

function limitLines(section: string, prefix: string, lower: LimitResult | null, upper: LimitResult | null, unit: string, decimals: number): Line[] {
  const format = numberFormat(decimals);
  return ([['Lower limit', lower], ['Upper limit', upper]] as [string, LimitResult | null][]).filter(([, l]) => l).map(([name, l]) => ({
    section, name: `${prefix}${name}`,
    cells: {
      percentile: l!.percentile, value: l!.estimate, rankLow: l!.rankCi?.[0] ?? null, rankHigh: l!.rankCi?.[1] ?? null,
      ciLow: l!.ci?.[0] ?? null, ciHigh: l!.ci?.[1] ?? null, unit: unit || null,
    },
    formats: { percentile: '0.0', value: format, rankLow: format, rankHigh: format, ciLow: format, ciHigh: format },
    words: [l!.rankCi ? '' : 'rank-based CI not used by this method', l!.ci ? '' : 'bootstrap CI not available'].filter(Boolean).join('; ') || undefined,
  }));
}

export function establishLines(r: IntervalResult, unit: string, decimals: number): Line[] {
  const d = findingsDecimals(decimals);
  const section = 'Reference interval';
  const lines: Line[] = [
    { section, name: 'Values analysed', cells: { value: r.n }, formats: { value: '0' }, words: `${r.excludedCount} excluded of ${r.nTotal}` },
    { section, name: 'Method', cells: {}, words: INTERVAL_METHOD_WORDS[r.method]?.name ?? r.method },
    ...limitLines(section, '', r.lower, r.upper, unit, d.stat),
  ];
  if (r.boxCoxLambda !== null) lines.push({ section, name: 'Box–Cox λ', cells: { value: r.boxCoxLambda }, formats: { value: '0.000' } });
  for (const p of r.partitions ?? []) {
    const field = PARTITION_WORDS[p.field] ?? p.field;
    const part = `Partition by ${field.toLowerCase()} (Harris & Boyd)`;
    lines.push(
      { section: part, name: 'z', cells: { value: p.z }, formats: { value: '0.00' }, words: `against z* = ${formatNumber(p.zCritical, 2)}` },
      { section: part, name: 'SD ratio', cells: { value: p.sdRatio }, formats: { value: '0.00' }, words: 'against 1.5' },
      { section: part, name: 'Decision', cells: {}, words: p.recommended ? 'Separate intervals are recommended' : 'One common interval is supported' },
    );
    for (const g of p.intervals ?? []) lines.push(...limitLines(part, `${field} ${g.group}, `, g.lower, g.upper, unit, d.stat));
  }
  return lines;
}

export function verifyLines(r: VerifyIntervalResult & { stated?: { lower: number; upper: number; source: string } }, unit: string, decimals: number): Line[] {
  const d = findingsDecimals(decimals);
  const section = 'Verification of the stated interval';
  const value = (name: string, v: number | null | undefined, format: string, u = '', words?: string): Line => ({ section, name, cells: { value: v ?? null, unit: u || null }, formats: { value: format }, words });
  return [
    value('Stated lower limit', r.stated?.lower, numberFormat(d.value), unit),
    value('Stated upper limit', r.stated?.upper, numberFormat(d.value), unit, r.stated?.source ? `source: ${r.stated.source}` : undefined),
    value('Values tested', r.n, '0'),
    value('Outside the stated interval', r.outside, '0', '', `${r.below} below, ${r.above} above`),
    value('Allowed outside', r.allowedOutside, '0'),
    value('Binomial probability', r.probability, '0.000', '', `of ${r.outside} or more outside if the stated interval fits this population (95% coverage)`),
    { section, name: 'Decision', cells: {}, words: `${r.accepted ? 'Accepted' : 'Not accepted'}: ${r.outside} of ${r.n} outside, at most ${r.allowedOutside} allowed. ${r.advice}` },
  ];
}

/** What the sheet says above the table: which analysis, and whether its findings are current, in words. */
export interface ResultsHeading { analysis: string; findings: string }

/**
 * Writes the Results sheet for a study of `kind` (its server module says the columns and lines) from stored
 * results (those the signature binds, or the latest); with no results the sheet says so in words.
 */
export function resultsSheet(wb: ExcelJS.Workbook, kind: ServerKind, results: unknown, opts: { unit: string; decimals: number; heading: ResultsHeading }): ExcelJS.Worksheet {
  const r = (results ?? null) as { kind?: string } | null;
  const columns = kind.resultsSheet.columns(kind.resultsSheet.level(results));
  const ws = wb.addWorksheet('Results');
  ws.columns = columns.map(({ header, key, width }) => ({ header, key, width }));
  ws.getRow(1).font = { bold: true };
  ws.views = [{ state: 'frozen', ySplit: 1 }];
  const lines: Line[] = [
    { section: 'Analysis', name: 'Which analysis', cells: {}, words: opts.heading.analysis },
    { section: 'Analysis', name: 'Findings', cells: {}, words: opts.heading.findings },
  ];
  if (r?.kind === kind.meta.resultKind) lines.push(...kind.resultsSheet.lines(r, opts.unit, opts.decimals));
  const keys = new Set(columns.map((c) => c.key));
  for (const line of lines) {
    const row = ws.addRow({ section: line.section, name: line.name, words: line.words ?? null });
    for (const [key, value] of Object.entries(line.cells)) {
      if (!keys.has(key) || value === null || value === undefined || (typeof value === 'number' && !Number.isFinite(value))) continue;
      const cell = row.getCell(key);
      cell.value = value;
      const format = line.formats?.[key];
      if (typeof value === 'number' && format) cell.numFmt = format;
    }
  }
  return ws;
}
