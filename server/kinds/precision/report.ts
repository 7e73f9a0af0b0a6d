import { PrecisionSettings, type PrecisionMaterial } from '@shared/kinds/precision/meta';
import {
  alphaText, claimText, componentHeadings, componentRows, designRows, dfText, flaggedRows, givenText, materialSummary, overallSentence,
  precisionFormat, resultHeading, termsNote, truenessRows, truenessSentence, verdictLines, type PrecisionFormat,
} from '@shared/kinds/precision/words';
import type { PrecisionMaterialResult, PrecisionResult, PrecisionVerdict } from '@shared/stats/precision-types';
import { nounFor, plural } from '@shared/types/plural';
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
import { dayPlot } from './day-plot';

/*
 * The layout of a precision verification's PDF. Its words and numbers (verdicts, sentences, table cells,
 * decimals) come from shared/kinds/precision/words.ts, as the Findings panel's and the Results sheet's do.
 */

const finite = (v: number | null | undefined): v is number => typeof v === 'number' && Number.isFinite(v);

/** How this report writes its numbers: the analyte's unit and the study's decimals. */
const formatOf = (report: StudyReport): PrecisionFormat => precisionFormat(report.analyte.unit, report.settings.decimals);

/** A material's line of the conclusion: its name, then its verdicts in the findings' sentences. */
function materialConclusion(m: PrecisionMaterialResult, results: PrecisionResult, f: PrecisionFormat): string {
  return `${m.name} — ${verdictLines(m, results, f).map((v) => v.text).join(' ')}`;
}

/** The table's cell padding (reports/table.ts). */
const CELL_PAD = { x: 4, y: 2.5 };

const cellWidths = (layout: Layout, columns: Column[]): number[] => {
  const total = columns.reduce((sum, c) => sum + c.weight, 0);
  return columns.map((c) => (layout.width * c.weight) / total - 2 * CELL_PAD.x);
};

/** Every cell broken at spaces to its column's width, so a unit such as "mmol/L" is never split at its slash (pdfkit would break after it). */
function wrapCells(layout: Layout, columns: Column[], rows: string[][], size: number = SIZE.table): string[][] {
  const widths = cellWidths(layout, columns);
  return rows.map((row) => row.map((cell, c) => wrapAtSpaces(layout.doc, cell, size, widths[c])));
}

/** The height of a table's header row and first row: what a heading above it must be kept with. */
function tableStart(layout: Layout, columns: Column[], rows: string[][]): number {
  const widths = cellWidths(layout, columns);
  const height = (cells: string[], bold: boolean): number => Math.max(...cells.map((cell, c) => measure(layout.doc, cell, { size: SIZE.table, bold }, widths[c]))) + 2 * CELL_PAD.y;
  return height(columns.map((c) => c.header), true) + (rows.length ? height(wrapCells(layout, columns, rows.slice(0, 1))[0], false) : 0) + 4;
}

/** drawTable with its cells broken at spaces first (wrapCells). */
function table(layout: Layout, columns: Column[], rows: string[][], options: TableOptions = {}): void {
  drawTable(layout, columns, wrapCells(layout, columns, rows, options.size), options);
}

const VERDICT_COLOR: Record<PrecisionVerdict, string> = { verified: COLOR.good, consistent: COLOR.accent, 'not-verified': COLOR.bad };

/**
 * The body of a precision verification report. Page 1 leads with the conclusion per material (repeatability
 * and within-laboratory precision against the claims, trueness where a value is assigned), the counts, the
 * caution, the sign-off and the plan; each material's components, flags and picture, what was studied and
 * every row follow.
 */
export function precisionReport(layout: Layout, report: StudyReport, results: PrecisionResult | null): void {
  if (!results) {
    layout.conclusion('Conclusion', 'There is no current analysis of these results and claims, so no findings are shown.');
    cautionCallout(layout);
    signatureBlock(layout, report);
    precisionPlan(layout, report);
    amendments(layout, report);
    studyBlock(layout, report);
    precisionExclusions(layout, report);
    precisionRows(layout, report, new Set());
    return;
  }
  const materials = results.materials ?? [];
  const f = formatOf(report);
  layout.conclusion('Conclusion', [overallSentence(results), ...materials.map((m) => materialConclusion(m, results, f))].join('\n'));
  layout.keyValues([['Results', resultCounts(report, results)]], 60);
  cautionCallout(layout);
  signatureBlock(layout, report);
  precisionPlan(layout, report);
  amendments(layout, report);
  for (const m of materials) materialSection(layout, report, results, m);
  warningsList(layout, results.warnings);
  const design = designRows(results);
  layout.subheading('Design of the analysis', layout.keyValuesHeight(design, 150, 3));
  layout.keyValues(design);
  studyBlock(layout, report);
  precisionExclusions(layout, report);
  const flagged = new Set(materials.flatMap((m) => (m.outliers ?? []).map((o) => o.position)).filter(finite));
  precisionRows(layout, report, flagged);
}

/** "50 used of 52 entered; 2 excluded". */
function resultCounts(report: StudyReport, results: PrecisionResult): string {
  const used = (results.materials ?? []).reduce((sum, m) => sum + (m.n ?? 0), 0);
  return `${integer(used)} used of ${integer(report.rows.length)} entered; ${integer(results.excludedCount ?? 0)} excluded`;
}

/** The settings' own part, parsed as the engine read it (defaults where a key is missing). */
function ownSettings(report: StudyReport): PrecisionSettings {
  const parsed = PrecisionSettings.safeParse(report.settings);
  if (parsed.success) return parsed.data;
  // Without materials (a study not yet set up) the rest of the plan still reads as stored.
  const rest = PrecisionSettings.safeParse({ ...report.settings, materials: undefined });
  return rest.success ? rest.data : { materials: [], days: 5, replicates: 5, alpha: 0.05, controlLot: '' };
}

/** The plan of a precision study: materials with their claims and assigned values, the design, α and the rules. */
export function precisionPlan(layout: Layout, report: StudyReport): void {
  const s = report.settings;
  const own = ownSettings(report);
  const l = Math.max(1, own.materials.length);
  const alpha = alphaText(own.alpha);
  const pairs: [string, string][] = [
    ['Design', `${plural(own.days, 'day')} × ${plural(own.replicates, 'replicate')} a day for each material (${plural(own.days * own.replicates, 'result')} each), one run a day`],
    ['Materials', own.materials.length ? `${plural(own.materials.length, 'material')}; their claims and assigned values below` : 'None named: no claim can be judged'],
    ['Significance level', own.materials.length > 1
      ? `α = ${alpha}, shared by the ${own.materials.length} materials (α/${l} for each upper verification limit)`
      : `α = ${alpha}`],
    ['Control material lot', orDash(own.controlLot)],
    ['Acceptance rule (as planned)', orDash(s.acceptanceRule)],
    ['Outlier rule', orDash(s.outlierRule)],
    ['Plan approval', planApprovalWords(report)],
  ];
  layout.heading('Plan and acceptance criteria', layout.keyValuesHeight(pairs, 150, 2));
  layout.keyValues(pairs);
  if (own.materials.length) claimsTable(layout, report, own.materials);
}

/** The claims as given (in the terms the "Claims as" column names, never rounded below their typed decimals) and the assigned values. */
function claimsTable(layout: Layout, report: StudyReport, materials: PrecisionMaterial[]): void {
  const unit = report.analyte.unit;
  const f = formatOf(report);
  const assigned = (m: PrecisionMaterial): string => {
    if (m.assignedValue === null) return 'None';
    return `${givenText(m.assignedValue, f)}${m.assignedUncertainty !== null ? ` (u = ${givenText(m.assignedUncertainty, f)})` : ''}`;
  };
  const columns: Column[] = [
    { header: 'Material', weight: 1.3 }, { header: 'Claims as', weight: 0.9 },
    { header: 'Repeatability', weight: 1, align: 'right' }, { header: 'Within-laboratory', weight: 1.3, align: 'right' },
    { header: 'Assigned value', weight: 1.6 }, { header: 'Source of the assigned value', weight: 1.6 },
  ];
  const rows = materials.map((m) => [
    m.name, m.claimAs === 'cv' ? 'CV, %' : `SD${unit ? `, ${unit}` : ''}`,
    claimText(m.claimRepeatability, m.claimAs, f), claimText(m.claimWithinLab, m.claimAs, f),
    assigned(m), m.assignedValue === null ? NOT_AVAILABLE : orDash(m.assignedSource),
  ]);
  layout.subheading('Materials, claims and assigned values', tableStart(layout, columns, rows));
  table(layout, columns, rows);
  if (materials.some((m) => m.assignedUncertainty !== null)) layout.paragraph('u: the standard uncertainty of the assigned value.', { color: COLOR.muted, size: 8 });
}

/** One material: the counts, the components against the claims, trueness, flags, notes and the picture. */
function materialSection(layout: Layout, report: StudyReport, results: PrecisionResult, m: PrecisionMaterialResult): void {
  const unit = report.analyte.unit;
  const f = formatOf(report);
  const a = m.anova;
  const counts: [string, string][] = [
    ['Results', materialSummary(m, f)],
    ['Analysis of variance by day', a
      ? `mean square between days ${num(a.msBetween, 2 * f.stat)} (${dfText(a.dfBetween)} df), within days ${num(a.msWithin, 2 * f.stat)} (${dfText(a.dfWithin)} df); ${a.balanced ? 'balanced' : `unbalanced, effective day size n0 = ${num(a.n0, 2)}`}`
      : NOT_AVAILABLE],
  ];
  layout.heading(`Material: ${m.name}`, layout.keyValuesHeight(counts, 150) + 70);
  layout.keyValues(counts);
  // The table's cells and headings are the Findings panel's; the narrow UVL column takes the short heading the terms note spells out.
  const rows = componentRows(m, f);
  const h = componentHeadings(m, f, results.alpha);
  table(layout, [
    { header: 'Component', weight: 1.4 }, { header: h.sd, weight: 0.95, align: 'right' },
    { header: h.cv, weight: 0.55, align: 'right' }, { header: 'df', weight: 0.4, align: 'right' },
    { header: h.ci, weight: 1.2, align: 'right' }, { header: h.claim, weight: 0.8, align: 'right' },
    { header: h.uvlShort, weight: 0.8, align: 'right' }, { header: 'Verdict', weight: 1.65 },
  ], rows.map((r) => [r.name, r.sd, r.cv, r.df, r.ci, r.claim, r.uvl, r.verdict]),
  { color: (k, c) => (c === 7 && rows[k].verdictKey ? VERDICT_COLOR[rows[k].verdictKey!] : undefined) });
  layout.paragraph(termsNote(m, f), { color: COLOR.muted, size: 8 });
  truenessBlock(layout, report, results, m);
  flagsBlock(layout, report, m);
  for (const note of m.notes ?? []) layout.paragraph(`•  ${note}`, { color: COLOR.warm });
  if ((m.byDay ?? []).some((day) => day.values.length)) {
    const [box] = plotRow(layout, 1, 190);
    dayPlot(layout.doc, box, {
      title: `${m.name}: results by day around the grand mean`,
      yLabel: unit ? `${report.analyte.name} (${unit})` : report.analyte.name,
      days: m.byDay, mean: m.mean, withinLabSd: m.withinLab?.sd ?? null,
      flagged: (m.outliers ?? []).map((o) => ({ day: o.day, value: o.value })),
      resolution: results.resolution?.increment,
    });
  }
}

/** The trueness details as the Findings panel lists them, and the verdict's sentence. */
function truenessBlock(layout: Layout, report: StudyReport, results: PrecisionResult, m: PrecisionMaterialResult): void {
  if (!m.trueness) return;
  const f = formatOf(report);
  const pairs: [string, string][] = [...truenessRows(m, f, results), ['Verdict', truenessSentence(m, f) ?? NOT_AVAILABLE]];
  // Its labels are long (the interval's formula): a wider label column than the other blocks'.
  layout.subheading('Trueness against the assigned value', layout.keyValuesHeight(pairs, 210, 3));
  layout.keyValues(pairs, 210);
}

function flagsBlock(layout: Layout, report: StudyReport, m: PrecisionMaterialResult): void {
  const outliers = m.outliers ?? [];
  if (!outliers.length) {
    layout.paragraph('No replicate was flagged by the outlier rule.');
    return;
  }
  const f = formatOf(report);
  const columns: Column[] = [
    { header: 'Row', weight: 0.5, align: 'right' }, { header: 'Day', weight: 1 }, { header: 'Replicate', weight: 0.85, align: 'right' },
    { header: resultHeading(f), weight: 1.15, align: 'right' }, { header: 'Why', weight: 3.65 },
  ];
  const rows = flaggedRows(m, f).map((o) => [o.row, o.day, o.replicate, o.value, o.why]);
  layout.subheading(`Flagged ${nounFor(outliers.length, 'replicate')} (kept in the analysis unless excluded with a reason)`, tableStart(layout, columns, rows));
  table(layout, columns, rows);
}

const cell = (v: unknown): string => (v === null || v === undefined || v === '' ? NOT_AVAILABLE : String(v));
const resultText = (r: ReportRow, decimals: number): string => r.valueText ?? num(r.value, decimals);

/** The excluded rows with their reasons, listed on their own so none is missed. */
export function precisionExclusions(layout: Layout, report: StudyReport): void {
  const excluded = report.rows.filter((r) => r.excluded);
  if (!excluded.length) {
    layout.heading('Exclusions', 20);
    layout.paragraph('No row was excluded.');
    return;
  }
  const d = formatOf(report);
  const columns: Column[] = [
    { header: 'Row', weight: 0.5, align: 'right' }, { header: 'Material', weight: 1.2 }, { header: 'Day', weight: 1 },
    { header: 'Replicate', weight: 0.85, align: 'right' }, { header: 'Result', weight: 0.8, align: 'right' }, { header: 'Reason', weight: 3.1 },
  ];
  const rows = excluded.map((r) => [String(r.position), cell(r.material), cell(r.day), cell(r.replicate), resultText(r, d.value), orDash(r.exclusionReason)]);
  layout.heading('Exclusions', tableStart(layout, columns, rows));
  table(layout, columns, rows);
}

/** Every row as entered, excluded ones included, in grid order: material, day, replicate, the result as typed, status and note. */
export function precisionRows(layout: Layout, report: StudyReport, flagged: Set<number>): void {
  const d = formatOf(report);
  const status = (r: ReportRow): string => (r.excluded ? `Excluded: ${orDash(r.exclusionReason)}` : flagged.has(r.position) ? 'Flagged by the outlier rule' : '');
  const columns: Column[] = [
    { header: 'Row', weight: 0.5, align: 'right' }, { header: 'Material', weight: 1.2 }, { header: 'Day', weight: 1 },
    { header: 'Replicate', weight: 0.85, align: 'right' }, { header: 'Result', weight: 0.8, align: 'right' },
    { header: 'Status', weight: 1.9 }, { header: 'Note', weight: 1.6 },
  ];
  const rows = report.rows.map((r) => [
    String(r.position), cell(r.material), cell(r.day), cell(r.replicate), resultText(r, d.value), status(r), r.note ?? '',
  ]);
  layout.heading('Results as entered', tableStart(layout, columns, rows));
  if (!rows.length) {
    layout.paragraph('No row has been entered.');
    return;
  }
  table(layout, columns, rows, {
    color: (k, c) => (c === 5 && report.rows[k].excluded ? COLOR.bad : c === 5 && flagged.has(report.rows[k].position) ? COLOR.warm : undefined),
  });
}
