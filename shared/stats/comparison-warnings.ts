import { spearman } from './correlation';
import type { DifferenceType } from './differences';

/**
 * The warnings a laboratory expects beside a method comparison. Thresholds (stated in each message):
 * - fewer than 40 pairs (CLSI EP09 practice; Westgard's comparison-of-methods lesson);
 * - a narrow range: highest/lowest x below 2 (Linnet, Clin Chem 1999;45:882 shows how many more specimens
 *   a small range ratio needs; the cut-off 2 is common practice);
 * - r < 0.975, too low for ordinary least squares (common practice);
 * - spread of the differences growing with concentration: Spearman correlation of |d − median d| with the
 *   pair means, p < 0.05, for absolute differences (suggest percent differences);
 * - many ties: fewer distinct non-zero differences than a third of their number (a Parallax rule of thumb):
 *   the bootstrap distribution of the median is lumpy and Wilcoxon uses the normal approximation.
 */
export interface WarningInputs {
  n: number;
  x: Float64Array;
  means: Float64Array;
  differences: Float64Array;
  differenceType: DifferenceType;
  r: number | null;
}

export function comparisonWarnings(w: WarningInputs): string[] {
  const out: string[] = [];
  if (w.n < 40) out.push(`Only ${w.n} ${w.n === 1 ? 'pair' : 'pairs'}: at least 40 across the measuring range are recommended (CLSI EP09 practice).`);
  const rangeRatio = narrowRange(w.x);
  if (rangeRatio !== null) out.push(`Narrow measuring range: highest/lowest comparative value is ${rangeRatio.toFixed(2)} (below 2); slope and intercept are poorly determined.`);
  if (w.r !== null && w.r < 0.975) out.push(`Correlation r = ${w.r.toFixed(4)} is below 0.975: too low for ordinary least squares; use Deming or Passing–Bablok.`);
  if (w.differenceType === 'absolute' && growsWithConcentration(w.means, w.differences)) {
    out.push('The spread of the differences grows with concentration (Spearman p < 0.05): consider percent differences and weighted Deming.');
  }
  const ties = distinctShare(w.differences);
  if (ties && ties.distinct < ties.nonZero / 3) out.push(`Many ties: only ${ties.distinct} distinct values among ${ties.nonZero} non-zero differences; bootstrap distributions of medians are lumpy.`);
  return out;
}

function narrowRange(x: Float64Array): number | null {
  let min = Infinity;
  let max = -Infinity;
  for (const v of x) { if (v < min) min = v; if (v > max) max = v; }
  return min > 0 && max / min < 2 ? max / min : null;
}

function growsWithConcentration(means: Float64Array, d: Float64Array): boolean {
  const centre = Float64Array.from(d).sort()[d.length >> 1];
  const spread = d.map((v) => Math.abs(v - centre));
  const result = spearman(means, spread);
  return result !== null && result.rho > 0 && result.pValue < 0.05;
}

function distinctShare(d: Float64Array): { distinct: number; nonZero: number } | null {
  const seen = new Set<number>();
  let nonZero = 0;
  for (const v of d) if (v !== 0) { nonZero++; seen.add(v); }
  return nonZero === 0 ? null : { distinct: seen.size, nonZero };
}
