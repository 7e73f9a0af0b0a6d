import {
  alphaSharing, claimVerdictSentence, dfDecimals, givenDecimals, judgedDecimals, precisionFormat, termsDecimals, termsOf, truenessSentence, typedDecimals,
  type ClaimedComponent, type PrecisionFormat,
} from '@shared/kinds/precision/words';
import type { PrecisionMaterialResult, PrecisionResult } from '@shared/stats/precision-types';
import { levelLabel, numberFormat } from '@shared/types/findings-numbers';
import { plural } from '@shared/types/plural';
import { FRONT, WORDS } from '../../audit/results-sheet';
import type { ServerKind, SheetCell, SheetColumn, SheetLine } from '../kind';

/*
 * The workbook's Results sheet of a precision verification: numbers as numbers in the decimals and the verdicts
 * in the sentences of the Findings panel and the PDF (shared/kinds/precision/words.ts).
 */

const finite = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);
const dfFormat = (df: number | null | undefined): string => numberFormat(dfDecimals(df));

/** The CI level of an SD at the results' α. */
const ciLevel = (results: { alpha?: number | null } | null | undefined): number => (finite(results?.alpha) ? 1 - results.alpha : 0.95);

/** The columns of a precision verification: each estimate with its CI, df, the claim and its upper verification limit. */
function precisionColumns(level: number): SheetColumn[] {
  const ci = levelLabel(level);
  return [...FRONT, { header: 'Value', key: 'value', width: 12, numeric: true },
    { header: `${ci} CI low`, key: 'ciLow', width: 12, numeric: true }, { header: `${ci} CI high`, key: 'ciHigh', width: 12, numeric: true },
    { header: 'df', key: 'df', width: 8, numeric: true }, { header: 'Claim', key: 'claim', width: 11, numeric: true },
    { header: 'Upper verification limit', key: 'uvl', width: 14, numeric: true }, { header: 'Unit', key: 'unit', width: 10 }, WORDS];
}

/** The estimates of a component as the sheet names them. */
const LINE_NAMES = { repeatability: 'Repeatability', betweenDay: 'Between-day', withinLab: 'Within-laboratory' } as const;

/**
 * The lines of one component: its SD and its CV, each with its CI (the CV's is the SD's scaled by 100/|mean|, as
 * the CV claim's UVL is), the df, and the claim, UVL and verdict on the line the claim is given in (SD or CV).
 */
function componentLines(section: string, key: ClaimedComponent | 'betweenDay', m: PrecisionMaterialResult, r: PrecisionResult, f: PrecisionFormat): SheetLine[] {
  const component = key === 'betweenDay' ? { ...m.betweenDay, df: undefined, ci: undefined } : m[key];
  const claimed = key === 'betweenDay' ? null : key;
  const terms = termsOf(m);
  const scale = finite(m.mean) && m.mean !== 0 ? 100 / Math.abs(m.mean) : NaN;
  const line = (as: 'sd' | 'cv'): SheetLine => {
    const ci = component?.ci;
    const judgedHere = claimed !== null && terms === as ? claimed : null;
    const format = numberFormat(judgedHere ? judgedDecimals(m, judgedHere, f) : termsDecimals(as, f));
    const factor = as === 'sd' ? 1 : scale;
    const cells: Record<string, SheetCell> = {
      value: (as === 'sd' ? component?.sd : component?.cv) ?? null,
      ciLow: ci && finite(factor) ? ci.lower * factor : null,
      ciHigh: ci && finite(factor) ? ci.upper * factor : null,
      df: component?.df ?? null,
      claim: judgedHere ? m.claims?.[judgedHere] ?? null : null,
      uvl: judgedHere ? m.uvl?.[judgedHere] ?? null : null,
      unit: as === 'sd' ? f.unit || null : '%',
    };
    const words = judgedHere
      ? claimVerdictSentence(m, judgedHere, r, f)
      : claimed ? `The claim is given as ${terms === 'sd' ? 'an SD' : 'a CV'}` : 'No claim: part of the within-laboratory SD';
    return {
      section, name: `${LINE_NAMES[key]} ${as === 'sd' ? 'SD' : 'CV'}`, cells,
      formats: { value: format, ciLow: format, ciHigh: format, df: dfFormat(component?.df), claim: format, uvl: format }, words,
    };
  };
  return [line('sd'), line('cv')];
}

function truenessLines(section: string, m: PrecisionMaterialResult, f: PrecisionFormat): SheetLine[] {
  const t = m.trueness;
  if (!t) return [];
  const unit = f.unit || null;
  const stat = numberFormat(f.stat);
  return [
    { section, name: 'Assigned value', cells: { value: t.assigned, unit }, formats: { value: numberFormat(givenDecimals(t.assigned, f.value)) }, words: t.source ? `source: ${t.source}` : undefined },
    { section, name: 'Standard uncertainty of the assigned value', cells: { value: t.uncertainty, unit }, formats: { value: numberFormat(givenDecimals(t.uncertainty, f.value)) } },
    { section, name: 'Bias (mean − assigned value)', cells: { value: t.bias, unit }, formats: { value: stat } },
    { section, name: 'Bias, % of the assigned value', cells: { value: finite(t.biasPercent) ? t.biasPercent : null, unit: '%' }, formats: { value: numberFormat(f.percent) } },
    { section, name: 'Standard error of the mean', cells: { value: t.se, unit }, formats: { value: stat } },
    {
      section, name: 'Verification interval', cells: { ciLow: t.interval.lower, ciHigh: t.interval.upper, df: t.df, unit },
      formats: { ciLow: stat, ciHigh: stat, df: dfFormat(t.df) }, words: 'around the assigned value (the CI columns hold its ends)',
    },
    { section, name: 'Trueness', cells: {}, words: truenessSentence(m, f) ?? undefined },
  ];
}

/** The Results sheet lines of a precision verification: per material its mean, components, trueness, flags and notes. */
export function precisionLines(r: PrecisionResult, unit: string, decimals: number): SheetLine[] {
  const section = 'Precision verification';
  const materials = r.materials ?? [];
  const f = precisionFormat(unit, decimals);
  const lines: SheetLine[] = [
    { section, name: 'Materials', cells: { value: materials.length }, formats: { value: '0' } },
    { section, name: 'Significance level α', cells: { value: r.alpha ?? null }, formats: { value: numberFormat(finite(r.alpha) ? Math.max(2, typedDecimals(r.alpha)) : 2) },
      words: alphaSharing(r) ?? undefined },
    { section, name: 'Results excluded', cells: { value: r.excludedCount ?? 0 }, formats: { value: '0' } },
  ];
  for (const m of materials) {
    const at = `Material: ${m.name}`;
    lines.push(
      { section: at, name: 'Results used', cells: { value: m.n }, formats: { value: '0' }, words: `over ${plural(m.days ?? 0, 'day')}; ${m.anova?.balanced === false ? 'unbalanced (days hold different numbers of results)' : 'balanced'}` },
      { section: at, name: 'Mean', cells: { value: m.mean, unit: f.unit || null }, formats: { value: numberFormat(f.stat) } },
      ...componentLines(at, 'repeatability', m, r, f),
      ...componentLines(at, 'betweenDay', m, r, f),
      ...componentLines(at, 'withinLab', m, r, f),
      ...truenessLines(at, m, f),
      ...(m.outliers ?? []).map((o): SheetLine => ({
        section: at, name: `Flagged replicate${o.position !== undefined ? `, row ${o.position}` : ''}`, cells: { value: o.value, unit: f.unit || null },
        formats: { value: numberFormat(f.value) }, words: `day ${o.day}${o.replicate !== null ? `, replicate ${o.replicate}` : ''}: ${o.why}`,
      })),
      ...(m.notes ?? []).map((note): SheetLine => ({ section: at, name: 'Note', cells: {}, words: note })),
    );
  }
  (r.warnings ?? []).forEach((w) => lines.push({ section: 'Warnings', name: 'Warning', cells: {}, words: w }));
  return lines;
}

/** ServerKind['resultsSheet'] of a precision study: CIs at 1 − α. */
export const precisionSheet: ServerKind['resultsSheet'] = {
  level: (results) => ciLevel(results as Partial<PrecisionResult> | null),
  columns: precisionColumns,
  lines: (results, unit, decimals) => precisionLines(results as PrecisionResult, unit, decimals),
};
