import { ESTABLISH_GRID, planEstablish, type PopulationShape } from '@shared/stats/plan-establish';
import { binomialRankCi } from '@shared/stats/rank-ci';
import { formatChance, formatNumber, levelLabel } from '../../../findings/comparison/number-format';
import { CURVE_MARKERS, type Curves } from '../../../findings/charts/curves';
import { PALETTE } from '../../../findings/charts/palette';

/** A presumed population: its central 95% from lower to upper, normal or normal on the log scale. */
export interface Population { shape: PopulationShape; lower: number; upper: number }

export interface EstablishLimitCells {
  ranks: string;
  coverage: string;
  span: string;
  width: string;
}

export interface EstablishRow {
  n: number;
  planned: boolean;
  limits: EstablishLimitCells[];
}

export interface EstablishPlanView {
  level: string;
  limits: string[];
  rows: EstablishRow[];
  /** Below this many individuals no rank-based CI of a limit at the level exists (null beyond 20,000); limits alike share a line. */
  smallest: { percentiles: string; n: number | null }[];
  curves: Curves;
}

/** A percentile in words: 2.5 → "2.5th". */
export const percentileName = (p: number): string => `${p}th`;

/** The individuals in the grid: 120, 150, 200, 240, 300, 400 and the planned n (from 2 to 100,000). */
export function establishGrid(planned: number | null | undefined): number[] {
  const ok = typeof planned === 'number' && Number.isInteger(planned) && planned >= 2 && planned <= 100_000;
  return [...new Set([...ESTABLISH_GRID, ...(ok ? [planned] : [])])].sort((a, b) => a - b);
}

/** The smallest n for which a rank-based CI of the percentile at the level exists (null when above `cap`). */
export function smallestN(percentile: number, level: number, cap = 20_000): number | null {
  for (let n = 2; n <= cap; n++) if (binomialRankCi(n, percentile / 100, level)) return n;
  return null;
}

/** Two curves drawn alike: the same n and, to a millionth of their size, the same values. */
function alike(a: { x: number; y: number }[], b: { x: number; y: number }[]): boolean {
  return a.length === b.length && a.every((p, k) => p.x === b[k].x && Math.abs(p.y - b[k].y) <= 1e-6 * Math.max(1, Math.abs(p.y)));
}

/** The smallest n of each limit, limits with the same smallest n in one line: "2.5th or 97.5th". */
function smallestLines(percentiles: number[], level: number): { percentiles: string; n: number | null }[] {
  const lines: { names: string[]; n: number | null }[] = [];
  for (const p of percentiles) {
    const n = smallestN(p, level);
    const same = lines.find((l) => l.n === n);
    if (same) same.names.push(percentileName(p));
    else lines.push({ names: [percentileName(p)], n });
  }
  return lines.map((l) => ({ percentiles: l.names.join(' or '), n: l.n }));
}

/**
 * What more reference individuals buy, for the percentiles and CI level of the Setup: per n and limit the ranks of the CI,
 * its coverage, its expected span in percentile points and, for a presumed population, its expected width in the unit.
 */
export function establishPlan(o: { planned: number | null; percentiles: number[]; level: number; population: Population | null; unit: string; decimals: number }): EstablishPlanView {
  const result = planEstablish({ n: establishGrid(o.planned), percentiles: o.percentiles, level: o.level, population: o.population });
  const widthDecimals = o.decimals + 1;
  const rows = result.rows.map((r) => ({
    n: r.n,
    planned: r.n === o.planned,
    limits: r.limits.map((l) => ({
      ranks: l.lowerRank === null ? 'no CI' : `${l.lowerRank}–${l.upperRank}`,
      coverage: formatChance(l.coverage),
      span: l.expectedSpan === null ? '—' : l.expectedSpan.toFixed(2),
      width: l.expectedWidth === null ? '—' : formatNumber(l.expectedWidth, widthDecimals),
    })),
  }));
  const inUnit = o.population !== null;
  const colours = [PALETTE.bias, PALETTE.regression];
  const points = (i: number) => result.rows.flatMap((r) => {
    const l = r.limits[i];
    const y = inUnit ? l.expectedWidth : l.expectedSpan;
    return y === null ? [] : [{ x: r.n, y }];
  });
  // Limits whose curves coincide (the 2.5th and 97.5th of a symmetric population) are drawn, and named, once.
  const curves = o.percentiles.map((p, i) => ({ names: [percentileName(p)], points: points(i) }));
  const drawn = curves.filter((c, i) => !curves.slice(0, i).some((d) => {
    if (!alike(d.points, c.points)) return false;
    d.names.push(...c.names);
    return true;
  }));
  const series = drawn.map((c, i) => ({
    label: c.names.length > 1 ? `${c.names.join(' and ')} percentiles (alike)` : `${c.names[0]} percentile`,
    points: c.points,
    color: colours[i % colours.length],
    dash: i === 0 ? [] : [8, 4],
    marker: CURVE_MARKERS[i % CURVE_MARKERS.length],
  }));
  const yTitle = inUnit ? `Expected width of the CI${o.unit ? ` (${o.unit})` : ''}` : 'Expected span of the CI (percentile points)';
  return {
    level: levelLabel(o.level),
    limits: o.percentiles.map(percentileName),
    rows,
    smallest: smallestLines(o.percentiles, o.level),
    curves: {
      series,
      lines: [],
      xTitle: 'Reference individuals (n)',
      yTitle,
      xText: (x) => `n = ${x}`,
      yText: (y) => (inUnit ? `${formatNumber(y, widthDecimals)}${o.unit ? ` ${o.unit}` : ''}` : `${Number(y.toFixed(2))} points`),
      yTick: (y) => (inUnit ? formatNumber(y, widthDecimals) : String(Number(y.toFixed(2)))),
      yMin: 0,
      summary: `${yTitle} of each limit's ${levelLabel(o.level)} rank-based CI against the number of reference individuals, n = ${result.rows.map((r) => r.n).join(', ')}.`,
    },
  };
}
