import { PrecisionSettings, type PrecisionMaterial } from '../../../shared/kinds/precision/meta';
import { decimalsOf as decimalsOfValue } from '../../../shared/stats/precision';
import type { PrecisionComponent, PrecisionMaterialResult, PrecisionResult, PrecisionVerdict } from '../../../shared/stats/precision-types';
import { findingsDecimals, levelLabel, PERCENT_DECIMALS } from '../../../shared/types/findings-numbers';
import { nounFor, plural } from '../../../shared/types/plural';
import { integer, NOT_AVAILABLE, num, orDash, range, withUnit } from '../../reports/format';
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
 * The words and numbers of a precision verification, as the PDF and the Results sheet (results-sheet.ts) say
 * them. SDs are printed with one decimal more than the results (the findings' `stat` decimals), CVs with one.
 */

/** A verdict in the words of a sentence. */
export const PRECISION_VERDICT_WORDS: Record<PrecisionVerdict, string> = {
  verified: 'verified',
  consistent: 'consistent with the claim',
  'not-verified': 'not verified',
};

/** The components in words, as sentences name them. */
export const COMPONENT_WORDS = { repeatability: 'repeatability', withinLab: 'within-laboratory', betweenDay: 'between-day' } as const;

const capital = (text: string): string => text.charAt(0).toUpperCase() + text.slice(1);

/** A verdict as a table cell or the sheet's first word: "Verified", "Consistent with the claim", "Not verified". */
export const verdictLabel = (verdict: PrecisionVerdict | null | undefined): string => (verdict ? capital(PRECISION_VERDICT_WORDS[verdict]) : NOT_AVAILABLE);

const finite = (v: number | null | undefined): v is number => typeof v === 'number' && Number.isFinite(v);

/** α as given: 0.05, 0.1, 0.0125. */
export const alphaText = (alpha: number | null | undefined): string => (finite(alpha) ? String(Number(alpha.toPrecision(6))) : NOT_AVAILABLE);

/** The decimals of each kind of number of a precision study with the results' `decimals`. */
export function precisionDecimals(decimals: number | null | undefined): { value: number; sd: number; cv: number } {
  const d = findingsDecimals(decimals);
  return { value: d.value, sd: d.stat, cv: PERCENT_DECIMALS };
}

/** The decimals of a number as typed (a claim, an assigned value, its uncertainty), never fewer than `base` and at most 4 more. */
export const givenDecimals = (value: number | null | undefined, base: number): number => (finite(value) ? Math.max(base, Math.min(decimalsOfValue(value), base + 4)) : base);

/**
 * The decimals that print an estimate and the limits it is judged against (claim, UVL) so that two different
 * numbers never print alike: the usual decimals, one or two more where rounding would make an SD above its
 * claim read as equal to it. A claim typed with more decimals than the usual keeps them (givenDecimals).
 */
export function judgedDecimals(base: number, estimate: number | null | undefined, claim: number | null | undefined, uvl: number | null | undefined): number {
  let d = givenDecimals(claim, base);
  const clash = (): boolean => finite(estimate) && [claim, uvl].some((l) => finite(l) && l !== estimate && num(l, d) === num(estimate, d));
  while (clash() && d < base + 2) d++;
  return d;
}

/** A number in the terms of a claim: an SD with its unit, or a CV in %. */
export function inTerms(value: number | null | undefined, as: 'sd' | 'cv', decimals: number, unit: string): string {
  return as === 'cv' ? (finite(value) ? `${num(value, decimals)}%` : NOT_AVAILABLE) : withUnit(num(value, decimals), unit);
}

/** One judged component of a material: the estimate in the claim's terms, the claim, the UVL and the verdict, with their decimals. */
export interface JudgedComponent {
  which: 'repeatability' | 'withinLab';
  as: 'sd' | 'cv';
  estimate: number | null;
  claim: number | null;
  uvl: number | null;
  verdict: PrecisionVerdict | null;
  decimals: number;
}

export function judged(m: PrecisionMaterialResult, which: 'repeatability' | 'withinLab', unitDecimals: number | null | undefined): JudgedComponent {
  const as = m.claims?.as === 'cv' ? 'cv' : 'sd';
  const component = m[which] as PrecisionComponent | undefined;
  const estimate = (as === 'cv' ? component?.cv : component?.sd) ?? null;
  const claim = m.claims?.[which] ?? null;
  const uvl = m.uvl?.[which] ?? null;
  const base = as === 'cv' ? precisionDecimals(unitDecimals).cv : precisionDecimals(unitDecimals).sd;
  return { which, as, estimate, claim, uvl, verdict: m.verdicts?.[which] ?? null, decimals: judgedDecimals(base, estimate, claim, uvl) };
}

/**
 * One component judged in words: "repeatability verified (SD 0.04 mmol/L, at or below the claim of
 * 0.05 mmol/L; UVL 0.07 mmol/L)"; "within-laboratory consistent with the claim (CV 2.9%, above the claim of
 * 2.5% but not above the UVL of 3.2%)"; "… not verified (SD …, above the UVL of …; claim …)".
 */
export function componentSentence(c: JudgedComponent, unit: string): string {
  const name = COMPONENT_WORDS[c.which];
  const estimate = `${c.as === 'cv' ? 'CV' : 'SD'} ${inTerms(c.estimate, c.as, c.decimals, unit)}`;
  const claim = inTerms(c.claim, c.as, c.decimals, unit);
  const uvl = inTerms(c.uvl, c.as, c.decimals, unit);
  if (c.verdict === 'verified') return `${name} verified (${estimate}, at or below the claim of ${claim}; UVL ${uvl})`;
  if (c.verdict === 'consistent') return `${name} consistent with the claim (${estimate}, above the claim of ${claim} but not above the UVL of ${uvl})`;
  if (c.verdict === 'not-verified') return `${name} not verified (${estimate}, above the UVL of ${uvl}; claim ${claim})`;
  return `${name}: no verdict (${estimate}; claim ${claim})`;
}

/** Trueness in words: "trueness verified: the mean 4.03 mmol/L lies within the verification interval 3.95 to 4.09 mmol/L of the assigned value 4.02 mmol/L". */
export function truenessSentence(m: PrecisionMaterialResult, unit: string, unitDecimals: number | null | undefined): string | null {
  const t = m.trueness;
  if (!t) return null;
  const d = precisionDecimals(unitDecimals).sd;
  const assigned = withUnit(num(t.assigned, givenDecimals(t.assigned, precisionDecimals(unitDecimals).value)), unit);
  const interval = withUnit(range([t.interval.lower, t.interval.upper], d), unit);
  const where = t.verdict === 'verified' ? 'within' : 'outside';
  return `trueness ${t.verdict === 'verified' ? 'verified' : 'not verified'}: the mean ${withUnit(num(m.mean, d), unit)} lies ${where} the verification interval ${interval} of the assigned value ${assigned}`;
}

/** A material's findings in one or two sentences, for the conclusion. */
export function materialConclusion(m: PrecisionMaterialResult, unit: string, unitDecimals: number | null | undefined): string {
  const parts = [componentSentence(judged(m, 'repeatability', unitDecimals), unit), componentSentence(judged(m, 'withinLab', unitDecimals), unit)];
  const trueness = truenessSentence(m, unit, unitDecimals);
  return `${m.name}: ${parts.join('; ')}.${trueness ? ` ${capital(trueness)}.` : ''}`;
}

/** The key to the conclusion's abbreviation: "UVL: the upper verification limit, … (α = 0.05, shared by 2 materials)." */
export function uvlKey(results: Pick<PrecisionResult, 'alpha' | 'materialsTested'>): string {
  const l = results.materialsTested ?? 1;
  const shared = l > 1 ? `, shared by ${l} materials` : '';
  return `UVL: the upper verification limit, the largest estimate still consistent with the claim (α = ${alphaText(results.alpha)}${shared}).`;
}

/** Degrees of freedom: whole numbers as they are, Satterthwaite's with one decimal (from 100 on, whole). */
export const dfText = (df: number | null | undefined): string => (finite(df) ? (Number.isInteger(df) || df >= 100 ? integer(df) : num(df, 1)) : NOT_AVAILABLE);

/** The CI level of an SD at the results' α. */
export const ciLevel = (results: { alpha?: number | null } | null | undefined): number => (finite(results?.alpha) ? 1 - results.alpha : 0.95);

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
  const unit = report.analyte.unit;
  const decimals = report.settings.decimals;
  const lines = materials.map((m) => materialConclusion(m, unit, decimals));
  layout.conclusion('Conclusion', lines.length ? `${lines.join('\n')}\n${uvlKey(results)}` : 'No material could be analysed; see the warnings.');
  layout.keyValues([['Results', resultCounts(report, results)]], 60);
  cautionCallout(layout);
  signatureBlock(layout, report);
  precisionPlan(layout, report);
  amendments(layout, report);
  for (const m of materials) materialSection(layout, report, results, m);
  warningsList(layout, results.warnings);
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


/** "0.040" (an SD, its unit in the table's "Claims as" column) or "2.5%": a claim as given, never rounded below the decimals it was typed with. */
function claimText(value: number, as: 'sd' | 'cv', report: StudyReport): string {
  const d = precisionDecimals(report.settings.decimals);
  const base = as === 'cv' ? d.cv : d.sd;
  return inTerms(value, as, givenDecimals(value, base), '');
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

function claimsTable(layout: Layout, report: StudyReport, materials: PrecisionMaterial[]): void {
  const unit = report.analyte.unit;
  const valueDecimals = precisionDecimals(report.settings.decimals).value;
  const given = (v: number): string => withUnit(num(v, givenDecimals(v, valueDecimals)), unit);
  const assigned = (m: PrecisionMaterial): string => {
    if (m.assignedValue === null) return 'None';
    return `${given(m.assignedValue)}${m.assignedUncertainty !== null ? ` (u = ${given(m.assignedUncertainty)})` : ''}`;
  };
  const columns: Column[] = [
    { header: 'Material', weight: 1.3 }, { header: 'Claims as', weight: 0.9 },
    { header: 'Repeatability', weight: 1, align: 'right' }, { header: 'Within-laboratory', weight: 1.3, align: 'right' },
    { header: 'Assigned value', weight: 1.6 }, { header: 'Source of the assigned value', weight: 1.6 },
  ];
  const rows = materials.map((m) => [
    m.name, m.claimAs === 'cv' ? 'CV, %' : `SD${unit ? `, ${unit}` : ''}`,
    claimText(m.claimRepeatability, m.claimAs, report), claimText(m.claimWithinLab, m.claimAs, report),
    assigned(m), m.assignedValue === null ? NOT_AVAILABLE : orDash(m.assignedSource),
  ]);
  layout.subheading('Materials, claims and assigned values', tableStart(layout, columns, rows));
  table(layout, columns, rows);
  if (materials.some((m) => m.assignedUncertainty !== null)) layout.paragraph('u: the standard uncertainty of the assigned value.', { color: COLOR.muted, size: 8 });
}

/** One material: the counts, the components against the claims, trueness, flags, notes and the picture. */
function materialSection(layout: Layout, report: StudyReport, results: PrecisionResult, m: PrecisionMaterialResult): void {
  const unit = report.analyte.unit;
  const d = precisionDecimals(report.settings.decimals);
  const ciHeader = `${levelLabel(ciLevel(results))} CI of the SD`;
  const a = m.anova;
  const counts: [string, string][] = [
    ['Results', `${plural(m.n ?? 0, 'result')} over ${plural(m.days ?? 0, 'day')}; mean ${withUnit(num(m.mean, d.sd), unit)}`],
    ['Analysis of variance by day', a
      ? `mean square between days ${num(a.msBetween, 2 * d.sd)} (${dfText(a.dfBetween)} df), within days ${num(a.msWithin, 2 * d.sd)} (${dfText(a.dfWithin)} df); ${a.balanced ? 'balanced' : `unbalanced, effective day size n0 = ${num(a.n0, 2)}`}`
      : NOT_AVAILABLE],
  ];
  layout.heading(`Material: ${m.name}`, layout.keyValuesHeight(counts, 150) + 70);
  layout.keyValues(counts);
  const row = (label: string, component: { sd: number; cv: number; df?: number; ci?: { lower: number; upper: number } } | undefined, j: JudgedComponent | null): string[] => {
    const sdDecimals = j?.as === 'sd' ? j.decimals : d.sd;
    const cvDecimals = j?.as === 'cv' ? j.decimals : d.cv;
    return [
      label, num(component?.sd, sdDecimals), num(component?.cv, cvDecimals), dfText(component?.df),
      component?.ci ? range([component.ci.lower, component.ci.upper], sdDecimals) : NOT_AVAILABLE,
      j ? inTerms(j.claim, j.as, j.decimals, '') : NOT_AVAILABLE, j ? inTerms(j.uvl, j.as, j.decimals, '') : NOT_AVAILABLE,
      j ? verdictLabel(j.verdict) : 'No claim',
    ];
  };
  const repeatability = judged(m, 'repeatability', report.settings.decimals);
  const withinLab = judged(m, 'withinLab', report.settings.decimals);
  const verdicts = [repeatability.verdict, null, withinLab.verdict];
  table(layout, [
    { header: 'Component', weight: 1.25 }, { header: `SD${unit ? ` (${unit})` : ''}`, weight: 1, align: 'right' },
    { header: 'CV (%)', weight: 0.6, align: 'right' }, { header: 'df', weight: 0.5, align: 'right' },
    { header: ciHeader, weight: 1.3, align: 'right' }, { header: 'Claim', weight: 0.8, align: 'right' },
    { header: 'UVL', weight: 0.8, align: 'right' }, { header: 'Verdict', weight: 1.35 },
  ], [
    row('Repeatability', m.repeatability, repeatability),
    row('Between-day', m.betweenDay, null),
    row('Within-laboratory', m.withinLab, withinLab),
  ], { color: (r, c) => (c === 7 && verdicts[r] ? VERDICT_COLOR[verdicts[r]!] : undefined) });
  const terms = m.claims?.as === 'cv' ? 'CVs, in %' : `SDs${unit ? `, in ${unit}` : ''}`;
  const clipped = a && !(a.msBetween > a.msWithin)
    ? ' The days differ less than the replicates within them (mean square between days not above that within), so the between-day SD is set to 0 and the within-laboratory SD equals the repeatability SD.'
    : '';
  layout.paragraph(`The claims were given as ${terms}: each estimate, its claim and its upper verification limit (UVL) are compared in those terms. The between-day SD has no claim of its own; it is part of the within-laboratory SD.${clipped}`, { color: COLOR.muted, size: 8 });
  truenessBlock(layout, report, m);
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

function truenessBlock(layout: Layout, report: StudyReport, m: PrecisionMaterialResult): void {
  const t = m.trueness;
  if (!t) return;
  const unit = report.analyte.unit;
  const d = precisionDecimals(report.settings.decimals);
  const pairs: [string, string][] = [
    ['Assigned value', `${withUnit(num(t.assigned, givenDecimals(t.assigned, d.value)), unit)}, standard uncertainty ${withUnit(num(t.uncertainty, givenDecimals(t.uncertainty, d.value)), unit)}`],
    ['Source of the assigned value', orDash(t.source)],
    ['Bias (mean − assigned value)', `${withUnit(num(t.bias, d.sd), unit)} (${finite(t.biasPercent) ? `${num(t.biasPercent, d.cv)}%` : NOT_AVAILABLE} of the assigned value)`],
    ['Standard error of the mean', `${withUnit(num(t.se, d.sd), unit)}; ${dfText(t.df)} df for the interval`],
    ['Verification interval', withUnit(range([t.interval.lower, t.interval.upper], d.sd), unit)],
    ['Verdict', capital(truenessSentence(m, unit, report.settings.decimals) ?? '')],
  ];
  layout.subheading('Trueness against the assigned value', layout.keyValuesHeight(pairs, 150, 3));
  layout.keyValues(pairs);
}

function flagsBlock(layout: Layout, report: StudyReport, m: PrecisionMaterialResult): void {
  const outliers = m.outliers ?? [];
  if (!outliers.length) {
    layout.paragraph('No replicate was flagged by the outlier rule.');
    return;
  }
  const d = precisionDecimals(report.settings.decimals);
  const byPosition = new Map(report.rows.map((r) => [r.position, r]));
  const columns: Column[] = [
    { header: 'Row', weight: 0.5, align: 'right' }, { header: 'Day', weight: 1 }, { header: 'Replicate', weight: 0.85, align: 'right' },
    { header: 'Result', weight: 0.8, align: 'right' }, { header: 'Why', weight: 4 },
  ];
  const rows = outliers.map((o) => {
    const row = o.position !== undefined ? byPosition.get(o.position) : undefined;
    return [o.position !== undefined ? String(o.position) : NOT_AVAILABLE, o.day, o.replicate !== null ? String(o.replicate) : NOT_AVAILABLE,
      row?.valueText ?? num(o.value, d.value), o.why];
  });
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
  const d = precisionDecimals(report.settings.decimals);
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
  const d = precisionDecimals(report.settings.decimals);
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
