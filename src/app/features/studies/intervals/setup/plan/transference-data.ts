import { formatChance, formatPercent } from '@shared/format/number-format';
import { TRANSFERENCE_OUTSIDE, allowedOutside, planTransference } from '@shared/stats/plan-transference';
import type { Curves } from '../../../findings/charts/curves';
import { PALETTE } from '../../../findings/charts/palette';

/** The individuals a verification plans when the Setup names none (CLSI EP28-A3c practice, DOMAIN.md). */
export const DEFAULT_VERIFY_N = 20;

/** A share as the panel and the PDF write it: 0.1 → "10%", 0.025 → "2.5%", 0.0125 → "1.25%" (formatPercent). */
export const share = (p: number): string => formatPercent(p);

/** A chance as the panel and the PDF write it: 0.677 → "67.7%", 0.37 → "37.0%"; "> 99.9%" and "< 0.1%" rather than a rounded certainty (formatChance). */
export const chance = (p: number): string => formatChance(p);

export interface TransferenceRow {
  outside: string;
  acceptFirst: string;
  acceptWithRetest: string;
}

/** How often the rule accepts a stated interval, for the planned n, in words and as curves. */
export interface TransferencePlan {
  n: number;
  /** The most outside the rule allows: 10% of n. */
  k: number;
  rows: TransferenceRow[];
  /** The one sentence: what the rule does when a tenth of the population falls outside. */
  sentence: string;
  curves: Curves;
}

/** The planned n as the panel reads it: a whole number from 1 to 10,000, else the usual 20. */
export function verifyN(planned: number | null | undefined): number {
  return typeof planned === 'number' && Number.isInteger(planned) && planned >= 1 && planned <= 10_000 ? planned : DEFAULT_VERIFY_N;
}

/** The chart's finer grid of true shares outside: 0 to 30% in steps of 1.25 points. */
const CURVE_OUTSIDE = Array.from({ length: 25 }, (_, i) => Number((i * 0.0125).toFixed(4)));

export function transferencePlan(n: number): TransferencePlan {
  const k = allowedOutside(n);
  const table = planTransference({ n, maxOutside: k, outside: [...TRANSFERENCE_OUTSIDE] });
  const curve = planTransference({ n, maxOutside: k, outside: CURVE_OUTSIDE });
  const tenth = table.rows.find((r) => r.trueOutside === 0.1)!;
  return {
    n, k,
    rows: table.rows.map((r) => ({ outside: share(r.trueOutside), acceptFirst: chance(r.acceptFirst), acceptWithRetest: chance(r.acceptWithRetest) })),
    sentence: `With 10% of your population outside the stated interval, the rule still accepts ${chance(tenth.acceptFirst)} of the time ` +
      `(${chance(tenth.acceptWithRetest)} with the retest).`,
    curves: {
      series: [
        { label: `Accepted at first (at most ${k} of ${n} outside)`, points: curve.rows.map((r) => ({ x: r.trueOutside, y: r.acceptFirst })), color: PALETTE.regression, dash: [8, 4], marker: 'triangle' },
        { label: `Accepted at first or with the retest of ${n} more`, points: curve.rows.map((r) => ({ x: r.trueOutside, y: r.acceptWithRetest })), color: PALETTE.bias, dash: [], marker: 'circle' },
      ],
      lines: [{ axis: 'x', value: 0.1, color: PALETTE.zero, width: 1.5, dash: [1, 3], label: '10% outside' }],
      xTitle: 'True share of the local population outside the stated interval',
      yTitle: 'Chance the rule accepts',
      xText: (x) => `${share(x)} outside`,
      xTick: (x) => share(x),
      yText: (y) => `${Math.round(y * 100)}%`,
      xMin: 0,
      xMax: CURVE_OUTSIDE[CURVE_OUTSIDE.length - 1],
      yMin: 0,
      yMax: 1,
      summary: `Chance of accepting the stated interval with ${n} individuals (at most ${k} outside), against the true share outside from 0% to 30%: ` +
        `at 10% outside, ${chance(tenth.acceptFirst)} at first and ${chance(tenth.acceptWithRetest)} with the retest.`,
    },
  };
}
