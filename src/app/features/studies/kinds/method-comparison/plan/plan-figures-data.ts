import type { ComparisonPlanResult, PlanLevelFigures } from '@shared/stats/plan-comparison';
import { findingsDecimals, formatNumber } from '../../../findings/comparison/number-format';
import { CURVE_MARKERS, type Curves } from '../../../findings/charts/curves';
import { PALETTE } from '../../../findings/charts/palette';
import { percent, target } from './plan-words';

/**
 * The three truths each decision level is simulated under, and how their curves are drawn: the dash tells the truth,
 * the point shape (and the colour) tells the level.
 */
export const SCENARIOS = [
  { key: 'powerAtHalf', words: 'true bias half the allowable bias (power)', dash: [] as number[] },
  { key: 'powerAtZero', words: 'no true bias', dash: [2, 3] },
  { key: 'falsePass', words: 'true bias equal to the allowable bias (false pass)', dash: [8, 4] },
] as const satisfies readonly { key: keyof PlanLevelFigures; words: string; dash: number[] }[];

const LEVEL_COLOURS = [PALETTE.bias, PALETTE.regression, PALETTE.observed, PALETTE.allowableEdge] as const;

/** The decision level as the study writes it, with its unit: "7.0 mmol/L". */
export const levelText = (level: number, decimals: number, unit: string): string => `${formatNumber(level, decimals)}${unit ? ` ${unit}` : ''}`;

/** One line of the plan's table: an n at one decision level, every figure in words. */
export interface PlanTableRow {
  n: number;
  /** The first line of its n (it carries the n, spanning the n's lines). */
  first: boolean;
  span: number;
  recommended: boolean;
  level: string;
  allowable: string;
  powerAtZero: string;
  powerAtHalf: string;
  falsePass: string;
  halfWidth: string;
  /** The targets this line misses, in words ('' when it meets both). */
  misses: string;
}

/** The table: one line per n and decision level, the recommended n's lines marked. */
export function planTable(r: ComparisonPlanResult, unit: string): PlanTableRow[] {
  const d = findingsDecimals(r.settings.decimals);
  return r.rows.flatMap((row) =>
    row.levels.map((l, k) => {
      const misses = [
        l.powerAtHalf < r.targetPower ? 'power below target' : '',
        l.falsePass > r.maxFalsePass ? 'false pass above limit' : '',
      ].filter(Boolean).join('; ');
      return {
        n: row.n, first: k === 0, span: row.levels.length, recommended: row.n === r.recommendedN,
        level: levelText(l.level, d.value, unit),
        allowable: `±${formatNumber(l.allowable, d.stat)}`,
        powerAtZero: percent(l.powerAtZero),
        powerAtHalf: percent(l.powerAtHalf),
        falsePass: percent(l.falsePass),
        halfWidth: l.medianHalfWidth === null ? '—' : `±${formatNumber(l.medianHalfWidth, d.stat)}`,
        misses,
      };
    }),
  );
}

/** The probability that a planned study ends "within" against n: one curve per truth and decision level, the two targets as lines. */
export function powerCurves(r: ComparisonPlanResult, unit: string): Curves {
  const d = findingsDecimals(r.settings.decimals);
  const levels = r.settings.decisionLevels;
  const series = levels.flatMap((level, k) =>
    SCENARIOS.map((s) => ({
      label: `At ${levelText(level, d.value, unit)}, ${s.words}`,
      points: r.rows.map((row) => ({ x: row.n, y: row.levels[k][s.key] as number })),
      color: LEVEL_COLOURS[k % LEVEL_COLOURS.length],
      dash: [...s.dash],
      marker: CURVE_MARKERS[k % CURVE_MARKERS.length],
    })),
  );
  const grid = r.rows.map((row) => row.n);
  return {
    series,
    lines: [
      { axis: 'y', value: r.targetPower, color: PALETTE.zero, width: 1.5, dash: [12, 3, 2, 3], label: `Target power ${target(r.targetPower)}` },
      { axis: 'y', value: r.maxFalsePass, color: PALETTE.zero, width: 1.5, dash: [1, 3], label: `Most false passes accepted ${target(r.maxFalsePass)}` },
    ],
    xTitle: 'Number of specimens (n)',
    yTitle: 'Simulated studies ending "within"',
    xText: (x) => `n = ${x}`,
    yText: (y) => `${Math.round(y * 1000) / 10}%`,
    yMin: 0,
    yMax: 1,
    summary: `Share of ${r.simulations.toLocaleString('en-US')} simulated studies ending "within" at n = ${grid.join(', ')}, ` +
      `per decision level (${levels.map((l) => levelText(l, d.value, unit)).join('; ')}) and true bias; target power ${target(r.targetPower)}, ` +
      `most false passes accepted ${target(r.maxFalsePass)}.`,
  };
}
