import { decimalsOf as decimalsOfValue } from '../../../shared/stats/precision';
import type { PrecisionComponent, PrecisionMaterialResult, PrecisionResult } from '../../../shared/stats/precision-types';
import { levelLabel, numberFormat } from '../../../shared/types/findings-numbers';
import { FRONT, WORDS } from '../../audit/results-sheet';
import type { ServerKind, SheetCell, SheetColumn, SheetLine } from '../kind';
import { ciLevel, componentSentence, givenDecimals, judged, precisionDecimals, truenessSentence, type JudgedComponent } from './report';

const finite = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);
const capital = (text: string): string => text.charAt(0).toUpperCase() + text.slice(1);
const dfFormat = (df: number | null | undefined): string => (finite(df) && Number.isInteger(df) ? '0' : '0.0');

/** The columns of a precision verification: each estimate with its CI, df, the claim and its upper verification limit. */
function precisionColumns(level: number): SheetColumn[] {
  const ci = levelLabel(level);
  return [...FRONT, { header: 'Value', key: 'value', width: 12, numeric: true },
    { header: `${ci} CI low`, key: 'ciLow', width: 12, numeric: true }, { header: `${ci} CI high`, key: 'ciHigh', width: 12, numeric: true },
    { header: 'df', key: 'df', width: 8, numeric: true }, { header: 'Claim', key: 'claim', width: 11, numeric: true },
    { header: 'Upper verification limit', key: 'uvl', width: 14, numeric: true }, { header: 'Unit', key: 'unit', width: 10 }, WORDS];
}

/**
 * The lines of one component: its SD and its CV, each with its CI (the CV's is the SD's scaled by 100/|mean|, as
 * the CV claim's UVL is), the df, and the claim, UVL and verdict on the line the claim is given in (SD or CV).
 */
function componentLines(section: string, name: string, component: Partial<PrecisionComponent> | undefined, mean: number, j: JudgedComponent | null, unit: string, decimals: number | null | undefined): SheetLine[] {
  const d = precisionDecimals(decimals);
  const scale = finite(mean) && mean !== 0 ? 100 / Math.abs(mean) : NaN;
  const line = (as: 'sd' | 'cv'): SheetLine => {
    const ci = component?.ci;
    const judgedHere = j?.as === as ? j : null;
    const format = numberFormat(judgedHere ? judgedHere.decimals : as === 'sd' ? d.sd : d.cv);
    const factor = as === 'sd' ? 1 : scale;
    const cells: Record<string, SheetCell> = {
      value: (as === 'sd' ? component?.sd : component?.cv) ?? null,
      ciLow: ci && finite(factor) ? ci.lower * factor : null,
      ciHigh: ci && finite(factor) ? ci.upper * factor : null,
      df: component?.df ?? null,
      claim: judgedHere?.claim ?? null,
      uvl: judgedHere?.uvl ?? null,
      unit: as === 'sd' ? unit || null : '%',
    };
    const words = judgedHere ? capital(componentSentence(judgedHere, unit)) : j ? `The claim is given as ${j.as === 'sd' ? 'an SD' : 'a CV'}` : 'No claim: part of the within-laboratory SD';
    return {
      section, name: `${name} ${as === 'sd' ? 'SD' : 'CV'}`, cells,
      formats: { value: format, ciLow: format, ciHigh: format, df: dfFormat(component?.df), claim: format, uvl: format }, words,
    };
  };
  return [line('sd'), line('cv')];
}

function truenessLines(section: string, m: PrecisionMaterialResult, unit: string, decimals: number | null | undefined): SheetLine[] {
  const t = m.trueness;
  if (!t) return [];
  const d = precisionDecimals(decimals);
  const sd = numberFormat(d.sd);
  return [
    { section, name: 'Assigned value', cells: { value: t.assigned, unit: unit || null }, formats: { value: numberFormat(givenDecimals(t.assigned, d.value)) }, words: t.source ? `source: ${t.source}` : undefined },
    { section, name: 'Standard uncertainty of the assigned value', cells: { value: t.uncertainty, unit: unit || null }, formats: { value: numberFormat(givenDecimals(t.uncertainty, d.value)) } },
    { section, name: 'Bias (mean − assigned value)', cells: { value: t.bias, unit: unit || null }, formats: { value: sd } },
    { section, name: 'Bias, % of the assigned value', cells: { value: finite(t.biasPercent) ? t.biasPercent : null, unit: '%' }, formats: { value: numberFormat(d.cv) } },
    { section, name: 'Standard error of the mean', cells: { value: t.se, unit: unit || null }, formats: { value: sd } },
    {
      section, name: 'Verification interval', cells: { ciLow: t.interval.lower, ciHigh: t.interval.upper, df: t.df, unit: unit || null },
      formats: { ciLow: sd, ciHigh: sd, df: dfFormat(t.df) }, words: 'around the assigned value (the CI columns hold its ends)',
    },
    { section, name: 'Trueness', cells: {}, words: capital(truenessSentence(m, unit, decimals) ?? '') },
  ];
}

/** The Results sheet lines of a precision verification: per material its mean, components, trueness, flags and notes. */
export function precisionLines(r: PrecisionResult, unit: string, decimals: number): SheetLine[] {
  const section = 'Precision verification';
  const materials = r.materials ?? [];
  const lines: SheetLine[] = [
    { section, name: 'Materials', cells: { value: materials.length }, formats: { value: '0' } },
    { section, name: 'Significance level α', cells: { value: r.alpha ?? null }, formats: { value: numberFormat(finite(r.alpha) ? Math.max(2, decimalsOfValue(r.alpha)) : 2) },
      words: (r.materialsTested ?? 1) > 1 ? `shared by ${r.materialsTested} materials: each upper verification limit at α/${r.materialsTested}` : undefined },
    { section, name: 'Results excluded', cells: { value: r.excludedCount ?? 0 }, formats: { value: '0' } },
  ];
  const d = precisionDecimals(decimals);
  for (const m of materials) {
    const at = `Material: ${m.name}`;
    lines.push(
      { section: at, name: 'Results used', cells: { value: m.n }, formats: { value: '0' }, words: `over ${m.days} ${m.days === 1 ? 'day' : 'days'}; ${m.anova?.balanced === false ? 'unbalanced (days hold different numbers of results)' : 'balanced'}` },
      { section: at, name: 'Mean', cells: { value: m.mean, unit: unit || null }, formats: { value: numberFormat(d.sd) } },
      ...componentLines(at, 'Repeatability', m.repeatability, m.mean, judged(m, 'repeatability', decimals), unit, decimals),
      ...componentLines(at, 'Between-day', m.betweenDay, m.mean, null, unit, decimals),
      ...componentLines(at, 'Within-laboratory', m.withinLab, m.mean, judged(m, 'withinLab', decimals), unit, decimals),
      ...truenessLines(at, m, unit, decimals),
      ...(m.outliers ?? []).map((o): SheetLine => ({
        section: at, name: `Flagged replicate${o.position !== undefined ? `, row ${o.position}` : ''}`, cells: { value: o.value, unit: unit || null },
        formats: { value: numberFormat(d.value) }, words: `day ${o.day}${o.replicate !== null ? `, replicate ${o.replicate}` : ''}: ${o.why}`,
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
