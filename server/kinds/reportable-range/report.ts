import { RangeSettings, type RangeLevel } from '@shared/kinds/reportable-range/meta';
import {
  bestFitSentence, claimText, designRows, fitRows, givenText, goalCaption, goalText, levelHeadings, levelRows, rangeFormat, rangeText, trackLegend, trackWords, verdictSentence,
  VERDICT_HEADLINES, type RangeFormat,
} from '@shared/kinds/reportable-range/words';
import { mixtureValue } from '@shared/stats/reportable-range-options';
import type { RangeLevelResult, RangeResult } from '@shared/stats/reportable-range-types';
import { levelLabel, withUnit } from '@shared/types/findings-numbers';
import { plural } from '@shared/types/plural';
import { integer, NOT_AVAILABLE, num, orDash } from '../../reports/format';
import type { Layout } from '../../reports/layout';
import { plotRow } from '../../reports/plots/plot-box';
import type { ReportRow, StudyReport } from '../../reports/report-model';
import { amendments } from '../../reports/sections/amendments';
import { cautionCallout } from '../../reports/sections/caution';
import { planApprovalWords } from '../../reports/sections/plan';
import { signatureBlock } from '../../reports/sections/signature';
import { studyBlock } from '../../reports/sections/title';
import { warningsList } from '../../reports/sections/warnings';
import { drawTable, type Column, type TableOptions } from '../../reports/table';
import { measure, wrapAtSpaces } from '../../reports/text';
import { COLOR, SIZE } from '../../reports/theme';
import { deviationParts, drawDeviationPart, type DeviationPicture, type DeviationTrack } from './deviation-track';
import { rangePlot } from './range-plot';

/*
 * The layout of a reportable-range study's PDF. Its words and numbers (verdict, sentences, table cells, decimals)
 * come from shared/kinds/reportable-range/words.ts, as the Findings panel's and the Results sheet's do.
 */

/** How this report writes its numbers: the analyte's unit and the study's decimals. */
const formatOf = (report: StudyReport): RangeFormat => rangeFormat(report.analyte.unit, report.settings.decimals);

/** The table's cell padding (reports/table.ts). */
const CELL_PAD = { x: 4, y: 2.5 };

const cellWidths = (layout: Layout, columns: Column[]): number[] => {
  const total = columns.reduce((sum, c) => sum + c.weight, 0);
  return columns.map((c) => (layout.width * c.weight) / total - 2 * CELL_PAD.x);
};

/** Every cell broken at spaces to its column's width, so a unit such as "mmol/L" is never split at its slash. */
function wrapCells(layout: Layout, columns: Column[], rows: string[][], size: number = SIZE.table): string[][] {
  const widths = cellWidths(layout, columns);
  return rows.map((row) => row.map((cell, c) => wrapAtSpaces(layout.doc, cell, size, widths[c])));
}

/** The height of a table's header row and first row: what a heading above it must be kept with. */
function tableStart(layout: Layout, columns: Column[], rows: string[][]): number {
  const widths = cellWidths(layout, columns);
  const height = (cells: string[], bold: boolean): number => Math.max(...cells.map((cell, c) => measure(layout.doc, cell, { size: SIZE.table, bold }, widths[c]))) + 2 * CELL_PAD.y;
  return height(wrapHeadings(layout, columns).map((c) => c.header), true) + (rows.length ? height(wrapCells(layout, columns, rows.slice(0, 1))[0], false) : 0) + 4;
}

/** Headings broken at spaces a little narrower than their cells: they are set in the semibold face, which runs wider. */
function wrapHeadings(layout: Layout, columns: Column[], size: number = SIZE.table): Column[] {
  const widths = cellWidths(layout, columns);
  return columns.map((c, k) => ({ ...c, header: wrapAtSpaces(layout.doc, c.header, size, widths[k] * 0.92) }));
}

/** drawTable with its cells and headings broken at spaces first (wrapCells, wrapHeadings). */
function table(layout: Layout, columns: Column[], rows: string[][], options: TableOptions = {}): void {
  drawTable(layout, wrapHeadings(layout, columns, options.size), wrapCells(layout, columns, rows, options.size), options);
}

/** A level's judgement colour in the tables (its words always stand in the cell too). */
const judgementColor = (l: RangeLevelResult): string => (!l.within ? COLOR.bad : l.ciBeyondGoal ? COLOR.warm : COLOR.good);

/** The source of the allowable nonlinearity: the findings' (added where results are served), else the study's. */
function goalSource(report: StudyReport, results: RangeResult | null): string {
  const stored = results?.goal?.source;
  if (typeof stored === 'string' && stored.trim()) return stored.trim();
  const own = report.settings.nonlinearitySource;
  return typeof own === 'string' ? own.trim() : '';
}

/**
 * The body of a reportable-range report. Page 1 leads with the verdict and its sentence, the verified range against
 * the claim, the goal and the best fit, then the caution, the sign-off and the plan; the picture of the results
 * against the levels, the deviation at each level against the goal, the tables of levels and fits, the warnings and
 * the design, what was studied and every row follow.
 */
export function rangeReport(layout: Layout, report: StudyReport, results: RangeResult | null): void {
  if (!results) {
    layout.conclusion('Conclusion', 'There is no current analysis of these results and goals, so no findings are shown.');
    cautionCallout(layout);
    signatureBlock(layout, report);
    rangePlan(layout, report);
    amendments(layout, report);
    studyBlock(layout, report);
    rangeExclusions(layout, report);
    rangeRows(layout, report);
    return;
  }
  const f = formatOf(report);
  const levels = results.levels ?? [];
  const verdict = VERDICT_HEADLINES[results.verdict] ?? 'No verdict';
  layout.conclusion(`Conclusion: ${verdict}`, levels.length ? verdictSentence(results, f) : 'No level could be analysed; see the warnings.');
  const source = goalSource(report, results);
  const lead: [string, string][] = [
    ['Verified range', rangeText(results, f)],
    ['Claimed measuring interval', claimText(results.claimed, f)],
    ['Allowable nonlinearity', `${goalText(results.goal, f)}${source ? `; source: ${source}` : '; no source given'}`],
    ['Best fit', results.fits?.length ? bestFitSentence(results) : NOT_AVAILABLE],
    ['Results', resultCounts(report, results)],
  ];
  layout.keyValues(lead, 150);
  cautionCallout(layout);
  signatureBlock(layout, report);
  rangePlan(layout, report);
  amendments(layout, report);
  if (levels.length) {
    linearitySection(layout, report, results, f);
    deviationSection(layout, results, f, source);
    levelTables(layout, results, f);
  }
  fitsSection(layout, results, f);
  warningsList(layout, results.warnings);
  const design = designRows(results, f);
  layout.subheading('Design of the analysis', layout.keyValuesHeight(design, 190, 3));
  layout.keyValues(design, 190);
  studyBlock(layout, report);
  rangeExclusions(layout, report);
  rangeRows(layout, report);
}

/** "14 used of 15 entered; 1 excluded". */
function resultCounts(report: StudyReport, results: RangeResult): string {
  const used = (results.levels ?? []).reduce((sum, l) => sum + (l.n ?? 0), 0);
  return `${integer(used)} used of ${integer(report.rows.length)} entered; ${integer(results.excludedCount ?? 0)} excluded`;
}

/** The settings' own part, parsed as the engine read it (defaults where a key is missing). */
function ownSettings(report: StudyReport): RangeSettings {
  const parsed = RangeSettings.safeParse(report.settings);
  if (parsed.success) return parsed.data;
  // Without levels (a study not yet set up, or one being corrected) the rest of the plan still reads as stored.
  const rest = RangeSettings.safeParse({ ...report.settings, levels: undefined });
  return rest.success ? rest.data : RangeSettings.parse({});
}

/** A level's value as planned (the unit stands in the heading): its assigned value, or its fraction of the high pool and the value the pools give it. */
function plannedValue(l: RangeLevel, own: RangeSettings, f: RangeFormat): [string, string] {
  if (l.assigned !== null) return [givenText(l.assigned, f), NOT_AVAILABLE];
  const fraction = l.fraction === null ? NOT_AVAILABLE : String(Number(l.fraction.toPrecision(6)));
  const pooled = mixtureValue(l.fraction, own.poolLow, own.poolHigh);
  if (pooled === null) return [NOT_AVAILABLE, fraction];
  return [`${givenText(pooled, f)} (from the pools)`, fraction];
}

/**
 * The plan of a reportable-range study, fixed before the data: the levels and pools, the replicates, the allowable
 * nonlinearity with its source, the claimed measuring interval, α, the bootstrap and the rules; then each level.
 */
export function rangePlan(layout: Layout, report: StudyReport): void {
  const s = report.settings;
  const own = ownSettings(report);
  const f = formatOf(report);
  const n = own.levels.length;
  const fractions = own.levels.some((l) => l.fraction !== null);
  const pools: [string, string][] = own.poolLow !== null && own.poolHigh !== null
    ? [['Pools', `low ${withUnit(givenText(own.poolLow, f), f.unit)}, high ${withUnit(givenText(own.poolHigh, f), f.unit)}`]]
    : fractions ? [['Pools', 'Not given: the levels are drawn against the fraction of the high pool, without recovery']] : [];
  const pairs: [string, string][] = [
    ['Levels', n ? `${plural(n, 'level')} × ${plural(own.replicates, 'replicate')} (${plural(n * own.replicates, 'result')} planned); each level below` : 'None named: no range can be judged'],
    ...pools,
    ['Allowable nonlinearity', own.allowableNonlinearity === null && own.allowableNonlinearityPercent === null
      ? 'Not set: no verdict can be given'
      : goalText({ absolute: own.allowableNonlinearity, percent: own.allowableNonlinearityPercent }, f)],
    ['Source of the allowable nonlinearity', orDash(own.nonlinearitySource)],
    ['Claimed measuring interval', claimText({ low: own.claimedLow, high: own.claimedHigh }, f)],
    ['Significance level', `α = ${own.alpha}, for the t-test of each polynomial’s top coefficient`],
    ['Bootstrap', `${levelLabel(s.confidenceLevel)} percentile CIs of the deviations from ${s.resamples.toLocaleString('en-US')} resamples of the replicates within each level, seed "${s.seed}"`],
    ['Acceptance rule (as planned)', orDash(s.acceptanceRule)],
    ['Outlier rule', orDash(s.outlierRule)],
    ['Plan approval', planApprovalWords(report)],
  ];
  layout.heading('Plan and acceptance criteria', layout.keyValuesHeight(pairs, 150, 2));
  layout.keyValues(pairs);
  if (!n) return;
  // The fraction column only where some level is given as a mixture.
  const columns: Column[] = [
    { header: 'Level', weight: 2 }, { header: f.unit ? `Assigned value (${f.unit})` : 'Assigned value', weight: 1.6, align: 'right' },
    ...(fractions ? [{ header: 'Fraction of the high pool', weight: 1.2, align: 'right' as const }] : []),
  ];
  const rows = own.levels.map((l) => [l.name, ...plannedValue(l, own, f)].slice(0, columns.length));
  layout.subheading('Levels as planned', tableStart(layout, columns, rows));
  table(layout, columns, rows);
}

/** The results against the levels' x, with the straight line, the best fit and the allowable band. */
function linearitySection(layout: Layout, report: StudyReport, results: RangeResult, f: RangeFormat): void {
  const height = 250;
  layout.heading('Linearity', height + 16);
  const fraction = results.basis === 'fraction';
  const [box] = plotRow(layout, 1, height);
  const names: Record<number, string> = { 2: 'best fit (quadratic)', 3: 'best fit (cubic)' };
  rangePlot(layout.doc, box, results, {
    title: `Results against the ${fraction ? 'fraction of the high pool' : 'assigned value'}`,
    xLabel: fraction ? 'Fraction of the high pool' : (f.unit ? `Assigned value (${f.unit})` : 'Assigned value'),
    yLabel: f.unit ? `${report.analyte.name} (${f.unit})` : report.analyte.name,
    bestLabel: results.bestDegree > 1 ? names[results.bestDegree] ?? `best fit (degree ${results.bestDegree})` : null,
    bandLabel: 'allowable nonlinearity around the straight line',
    beyondLabel: 'mean of a level beyond the goal',
  });
}

/** The deviation picture's tracks: one per level, in the cells of the level table. */
function deviationPicture(results: RangeResult, f: RangeFormat, source: string): DeviationPicture {
  const levels = results.levels ?? [];
  const words = trackWords(results, f);
  const legend = trackLegend(f);
  const tracks: DeviationTrack[] = levels.map((l, k) => ({
    name: l.level, at: words[k].at, deviation: l.deviation, ci: l.deviationCi, goal: l.goal, mark: words[k].mark, word: words[k].word, lines: words[k].lines,
  }));
  return {
    tracks,
    axisTitle: legend.axis,
    decimals: f.stat,
    legend: { filled: legend.filled, half: legend.half, open: legend.open, ci: `${levelLabel(results.confidenceLevel ?? 0.95)} CI` },
    bandCaption: goalCaption({ ...results.goal, source }, f),
  };
}

/** The height of a subheading with its space (Layout.subheading). */
const SUBHEADING = 22;

/** Whether even a whole page cannot hold the picture in one part. */
function cutOnPage(layout: Layout, picture: DeviationPicture): boolean {
  return deviationParts(layout.doc, picture, layout.width, layout.pageRoom - SUBHEADING, layout.pageRoom - SUBHEADING).length > 1;
}

/** The deviation from linearity at each level against the goal, flowing between tracks across pages. */
function deviationSection(layout: Layout, results: RangeResult, f: RangeFormat, source: string): void {
  const picture = deviationPicture(results, f, source);
  const cut = () => deviationParts(layout.doc, picture, layout.width, layout.room - SUBHEADING, layout.pageRoom - SUBHEADING);
  let parts = cut();
  // Whole on the next page when less than half of it fits here (a page then holds the plot above, most of its height).
  if (parts[0].newPage || (parts.length > 1 && parts[0].to < picture.tracks.length / 2 && !cutOnPage(layout, picture))) {
    layout.newPage();
    parts = cut();
  }
  layout.subheading('Deviation from linearity at each level, against the allowable nonlinearity', parts[0].height);
  for (const part of parts) {
    if (part.newPage) layout.newPage();
    layout.block(part.height, (y) => drawDeviationPart(layout.doc, picture, part, layout.left, y, layout.width));
  }
}

/** The levels in two tables: the results and recovery, then the deviation from linearity with its judgement. */
function levelTables(layout: Layout, results: RangeResult, f: RangeFormat): void {
  const levels = results.levels ?? [];
  const rows = levelRows(results, f);
  const h = levelHeadings(results, f);
  const first: Column[] = [
    { header: h.level, weight: 1.6 }, { header: h.x, weight: 1.1, align: 'right' }, { header: h.n, weight: 0.4, align: 'right' },
    { header: h.mean, weight: 1, align: 'right' }, { header: h.sd, weight: 1, align: 'right' }, { header: h.recovery, weight: 0.9, align: 'right' },
  ];
  const firstRows = rows.map((r) => [r.level, r.x, r.n, r.mean, r.sd, r.recovery]);
  layout.heading('Results at each level', tableStart(layout, first, firstRows));
  table(layout, first, firstRows);
  const second: Column[] = [
    { header: h.level, weight: 0.95 }, { header: h.linear, weight: 0.85, align: 'right' }, { header: h.fitted, weight: 0.8, align: 'right' },
    { header: h.deviation, weight: 0.9, align: 'right' }, { header: h.deviationPercent, weight: 0.9, align: 'right' },
    { header: h.ci, weight: 1.2, align: 'right' }, { header: h.goal, weight: 1, align: 'right' }, { header: h.within, weight: 1.7 },
  ];
  const secondRows = rows.map((r) => [r.level, r.linear, r.fitted, r.deviation, r.deviationPercent, r.ci, r.goal, r.within]);
  layout.subheading('Deviation from linearity at each level', tableStart(layout, second, secondRows));
  table(layout, second, secondRows, { color: (k, c) => (c === 7 ? judgementColor(levels[k]) : undefined) });
}

/** The polynomials fitted: coefficients with their SEs, the top coefficient's p, Sy.x, and which fits best. */
function fitsSection(layout: Layout, results: RangeResult, f: RangeFormat): void {
  const rows = fitRows(results, f);
  const columns: Column[] = [
    { header: 'Degree', weight: 0.55, align: 'right' }, { header: 'Coefficients (y = b0 + b1·x + …)', weight: 1.9 },
    { header: 'Standard errors', weight: 1.1, align: 'right' }, { header: 'p of the top coefficient', weight: 0.9, align: 'right' },
    { header: f.unit ? `Sy.x (${f.unit})` : 'Sy.x', weight: 0.8, align: 'right' }, { header: 'Judgement', weight: 1.5 },
  ];
  // One coefficient to a line, its SE beside it.
  const cells = rows.map((r) => [r.degree, r.coefficients.split(', ').join('\n'), r.se.split(', ').join('\n'), r.p, r.syx, r.judgement]);
  layout.heading('Polynomial fits', tableStart(layout, columns, cells) + 14);
  if (!rows.length) {
    layout.paragraph('No polynomial could be fitted; see the warnings.');
    return;
  }
  table(layout, columns, cells, { strong: (k) => rows[k].judgement === 'Best fit' });
  layout.paragraph(bestFitSentence(results));
}

const cell = (v: unknown): string => (v === null || v === undefined || v === '' ? NOT_AVAILABLE : String(v));
const resultText = (r: ReportRow, decimals: number): string => r.valueText ?? num(r.value, decimals);

/** The excluded rows with their reasons, listed on their own so none is missed. */
export function rangeExclusions(layout: Layout, report: StudyReport): void {
  const excluded = report.rows.filter((r) => r.excluded);
  if (!excluded.length) {
    layout.heading('Exclusions', 20);
    layout.paragraph('No row was excluded.');
    return;
  }
  const f = formatOf(report);
  const columns: Column[] = [
    { header: 'Row', weight: 0.5, align: 'right' }, { header: 'Level', weight: 1.5 }, { header: 'Replicate', weight: 0.85, align: 'right' },
    { header: 'Result', weight: 0.8, align: 'right' }, { header: 'Reason', weight: 3.4 },
  ];
  const rows = excluded.map((r) => [String(r.position), cell(r.level), cell(r.replicate), resultText(r, f.value), orDash(r.exclusionReason)]);
  layout.heading('Exclusions', tableStart(layout, columns, rows));
  table(layout, columns, rows);
}

/** Every row as entered, excluded ones included, in grid order: level, replicate, the result as typed, status and note. */
export function rangeRows(layout: Layout, report: StudyReport): void {
  const f = formatOf(report);
  const columns: Column[] = [
    { header: 'Row', weight: 0.5, align: 'right' }, { header: 'Level', weight: 1.5 }, { header: 'Replicate', weight: 0.85, align: 'right' },
    { header: 'Result', weight: 0.8, align: 'right' }, { header: 'Status', weight: 1.9 }, { header: 'Note', weight: 1.9 },
  ];
  const rows = report.rows.map((r) => [
    String(r.position), cell(r.level), cell(r.replicate), resultText(r, f.value), r.excluded ? `Excluded: ${orDash(r.exclusionReason)}` : '', r.note ?? '',
  ]);
  layout.heading('Results as entered', tableStart(layout, columns, rows));
  if (!rows.length) {
    layout.paragraph('No row has been entered.');
    return;
  }
  table(layout, columns, rows, { color: (k, c) => (c === 4 && report.rows[k].excluded ? COLOR.bad : undefined) });
}
