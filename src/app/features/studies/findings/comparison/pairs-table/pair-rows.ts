import type { StudySettings } from '@shared/schemas';
import { difference, type PlotPoint } from '../../charts/plot-points';
import type { GridRow } from '../../../specimens/specimen-layout';
import type { ComparisonFindingsResult } from '../comparison-result';
import { withUnit } from '../comparison-result';
import { formatNumber } from '../number-format';

/** One analysed pair as the table of pairs shows it, and as its point's tooltip names it. */
export interface PairRow {
  /** Grid position (1-based): the key that joins a point, a table row and a grid row. */
  position: number;
  label: string;
  comparative: number;
  candidate: number;
  /** y − x in the unit of the results. */
  difference: number;
  /** The difference as a percentage of the pair mean (of x for a study whose differences are a percentage of x). */
  percent: number | null;
  /** (d − mean bias) / SD of the differences, d in the analysis's difference type; null without an SD. */
  standardized: number | null;
  excluded: boolean;
  reason: string;
  outlier: boolean;
  /** The analysed difference lies outside the limits of agreement. */
  beyondLimits: boolean;
}

/** How pairs are written: results as reported (the study's decimals), differences the same, % and z with fixed decimals. */
export interface PairFormat {
  unit: string;
  decimals: number;
  /** What the percentage is of, for the column's heading. */
  percentOf: 'pair mean' | 'comparative x';
  value: (v: number) => string;
  difference: (v: number) => string;
  percent: (v: number | null) => string;
  standardized: (v: number | null) => string;
}

export function pairFormat(settings: Pick<StudySettings, 'decimals'>, unit: string, type: StudySettings['differenceType']): PairFormat {
  const decimals = settings.decimals;
  return {
    unit, decimals,
    percentOf: type === 'percent-x' ? 'comparative x' : 'pair mean',
    value: (v) => formatNumber(v, decimals),
    difference: (v) => formatNumber(v, decimals),
    percent: (v) => formatNumber(v, 1),
    standardized: (v) => formatNumber(v, 2),
  };
}

/**
 * The table of pairs: every plotted pair with its differences, how far it stands from the mean bias in SDs,
 * and its flags (an outlier by the stated rule, excluded with its reason, beyond the limits of agreement).
 * Drawing aid only: the mean bias, SD and limits are the server's; nothing here is re-estimated.
 */
export function pairRows(points: readonly PlotPoint[], rows: readonly GridRow[], result: ComparisonFindingsResult): PairRow[] {
  const type = result.differenceType;
  const outliers = new Set(result.outlierPositions ?? result.outliers);
  const bias = result.bias.mean.estimate;
  const sd = result.sd.estimate;
  const lower = result.limitsOfAgreement.lower.estimate;
  const upper = result.limitsOfAgreement.upper.estimate;
  return points.map((p) => {
    const percent = difference(p.x, p.y, type === 'percent-x' ? 'percent-x' : 'percent-mean');
    return {
      position: p.position,
      label: p.label,
      comparative: p.x,
      candidate: p.y,
      difference: p.y - p.x,
      percent: Number.isFinite(percent) ? percent : null,
      standardized: bias !== null && sd !== null && sd > 0 ? (p.difference - bias) / sd : null,
      excluded: p.excluded,
      reason: String(rows[p.position - 1]?.['exclusionReason'] ?? '').trim(),
      outlier: outliers.has(p.position),
      beyondLimits: !p.excluded && ((lower !== null && p.difference < lower) || (upper !== null && p.difference > upper)),
    };
  });
}

/** A pair's flags in words, for the table and the tooltip. */
export function pairFlags(row: Pick<PairRow, 'excluded' | 'reason' | 'outlier' | 'beyondLimits'>): string[] {
  const flags: string[] = [];
  if (row.outlier) flags.push('Possible outlier');
  if (row.excluded) flags.push(row.reason ? `Excluded: ${row.reason}` : 'Excluded');
  if (row.beyondLimits) flags.push('Beyond the limits of agreement');
  return flags;
}

/** A specimen's name: its label, or its row when it has none. */
export function pairName(p: Pick<PlotPoint, 'label' | 'position'>): string {
  return p.label.trim() ? `${p.label.trim()} (row ${p.position})` : `Row ${p.position}`;
}

/** The tooltip of a pair's point: its label, both results and the difference (and the percentage). */
export function pairTip(p: PlotPoint, f: PairFormat, flags: readonly string[] = []): string[] {
  const percent = difference(p.x, p.y, f.percentOf === 'comparative x' ? 'percent-x' : 'percent-mean');
  return [
    pairName(p),
    `Comparative ${withUnit(f.value(p.x), f.unit)}`,
    `Candidate ${withUnit(f.value(p.y), f.unit)}`,
    `Difference ${withUnit(f.difference(p.y - p.x), f.unit)}${Number.isFinite(percent) ? ` (${f.percent(percent)} %)` : ''}`,
    ...flags,
  ];
}
