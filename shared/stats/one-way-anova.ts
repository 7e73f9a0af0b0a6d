import { reportedDecimals } from './precision';
import { neumaierSum } from './summation';

/** The one-way analysis of variance of results grouped by day (or run, instrument, ...). */
export interface OneWayAnova {
  /** Groups (k) and results (N = Σn_i). */
  k: number;
  n: number;
  groupSizes: number[];
  groupMeans: number[];
  /** The grand mean of all results, ΣΣx_ij/N (each result weighs the same, not each group). */
  mean: number;
  ssBetween: number;
  ssWithin: number;
  dfBetween: number;
  dfWithin: number;
  msBetween: number;
  msWithin: number;
  /** F = MS_B/MS_W (Infinity when MS_W = 0). */
  f: number;
  /** The effective group size n0 = (N − Σn_i²/N)/(k − 1); n0 = n when every group has n results. */
  n0: number;
  balanced: boolean;
}

/**
 * One-way ANOVA with unequal group sizes allowed. With k groups, n_i results in group i, N = Σn_i,
 * group means x̄_i and grand mean x̄:
 *   SS_W = ΣΣ(x_ij − x̄_i)², df_W = N − k, MS_W = SS_W/df_W;
 *   SS_B = Σn_i(x̄_i − x̄)², df_B = k − 1, MS_B = SS_B/df_B;
 *   n0 = (N − Σn_i²/N)/(k − 1), the coefficient of the between-group variance in E[MS_B] = σ_w² + n0·σ_b².
 * Source: the random-effects one-way model with unequal group sizes (S. R. Searle, G. Casella and
 * C. E. McCulloch (1992), "Variance Components", Wiley, chapter 3; from memory) and the CLSI EP15-A3 practice
 * stated in the design notes (DOMAIN.md, "Precision"; from memory). Checked against the NIST StRD one-way
 * ANOVA certified values and R's aov (reference-checks/nist-anova.check.ts, precision-r.check.ts).
 *
 * Rounding: like summation.ts, the sums are taken exactly on the decimal values the results report when
 * they can be (precision.ts): with D the reported decimals, the integers k_ij = x_ij·10^D centred on one of
 * them give exact group sums S_i and sums of squares Q_i, and
 *   SS_W·10^(2D) = Σ_i (n_i·Q_i − S_i²)/n_i,   SS_B·10^(2D) = Σ_i (N·S_i − n_i·S)²/(n_i·N²),
 * sums of non-negative terms with exact integer numerators (no cancellation), added by compensated
 * summation. This keeps NIST's SmLs07 (values 10^12 + 0.x) to its certified digits, which no binary
 * algorithm can on the nearest doubles alone. Otherwise (more than 12 decimals, or sums beyond 2^53) it falls
 * back to binary arithmetic centred on one value: group means by compensated sums refined once, then the
 * centred sums of squares (two-pass), each by Neumaier's compensated sum (summation.ts).
 * @param groups the results of each group, in any order; not modified
 * @throws RangeError if there are fewer than 2 groups, an empty group, or no replicate (N − k < 1)
 */
export function oneWayAnova(groups: ArrayLike<number>[]): OneWayAnova {
  const k = groups.length;
  if (k < 2) throw new RangeError('oneWayAnova requires at least 2 groups');
  const sizes = Array.from(groups, (g) => g.length);
  if (sizes.some((s) => s === 0)) throw new RangeError('oneWayAnova requires at least one value in every group');
  const n = sizes.reduce((a, b) => a + b, 0);
  if (n - k < 1) throw new RangeError('oneWayAnova requires at least one group with two or more values (N − k ≥ 1)');
  for (const g of groups) for (let j = 0; j < g.length; j++) if (!Number.isFinite(g[j])) throw new RangeError('oneWayAnova requires finite values');
  const sums = exactSums(groups, sizes, n) ?? binarySums(groups, sizes, n);
  const dfBetween = k - 1;
  const dfWithin = n - k;
  const msBetween = sums.ssBetween / dfBetween;
  const msWithin = sums.ssWithin / dfWithin;
  let squares = 0;
  for (const s of sizes) squares += s * s;
  return {
    k, n, groupSizes: sizes, groupMeans: sums.groupMeans, mean: sums.mean,
    ssBetween: sums.ssBetween, ssWithin: sums.ssWithin, dfBetween, dfWithin, msBetween, msWithin,
    f: msBetween / msWithin,
    n0: (n - squares / n) / (k - 1),
    balanced: sizes.every((s) => s === sizes[0]),
  };
}

interface Sums { groupMeans: number[]; mean: number; ssBetween: number; ssWithin: number }

const EXACT = 2 ** 53;

/** The decimal path (see above); null when the values carry too many decimals or the sums leave 2^53. */
function exactSums(groups: ArrayLike<number>[], sizes: number[], n: number): Sums | null {
  let decimals = 0;
  for (const g of groups) decimals = Math.max(decimals, reportedDecimals(g));
  if (decimals > 12) return null;
  const scale = 10 ** decimals;
  const ints = groups.map((g) => {
    const out = new Float64Array(g.length);
    for (let j = 0; j < g.length; j++) out[j] = Math.round(g[j] * scale);
    return out;
  });
  for (let i = 0; i < groups.length; i++) {
    for (let j = 0; j < ints[i].length; j++) {
      const v = groups[i][j];
      if (!(Math.abs(ints[i][j]) < 2 ** 52) || Math.abs(ints[i][j] / scale - v) > 1e-9 * Math.max(1, Math.abs(v))) return null;
    }
  }
  const first = ints.find((g) => g.length > 0)!;
  const centre = first[first.length >> 1];
  const s: number[] = [];
  const q: number[] = [];
  let total = 0;
  let absolute = 0;
  for (const g of ints) {
    let sum = 0;
    let squares = 0;
    for (let j = 0; j < g.length; j++) {
      const d = g[j] - centre;
      sum += d;
      squares += d * d;
      absolute += Math.abs(d);
    }
    if (!(squares < EXACT)) return null;
    s.push(sum);
    q.push(squares);
    total += sum;
  }
  if (!(absolute < EXACT)) return null;
  const within: number[] = [];
  const between: number[] = [];
  for (let i = 0; i < s.length; i++) {
    const ni = sizes[i];
    if (!(ni * q[i] < EXACT && s[i] * s[i] < EXACT && Math.abs(n * s[i]) < EXACT && Math.abs(ni * total) < EXACT)) return null;
    within.push((ni * q[i] - s[i] * s[i]) / ni);
    const d = n * s[i] - ni * total;
    between.push((d * d) / ni / n / n);
  }
  return {
    groupMeans: s.map((sum, i) => (centre + sum / sizes[i]) / scale),
    mean: (centre + total / n) / scale,
    ssWithin: neumaierSum(within) / scale / scale,
    ssBetween: neumaierSum(between) / scale / scale,
  };
}

/** Binary fallback: values centred on one of them, means by compensated sums refined once, two-pass squares. */
function binarySums(groups: ArrayLike<number>[], sizes: number[], n: number): Sums {
  const centre = groups[0][groups[0].length >> 1];
  const centred = groups.map((g) => Float64Array.from(g, (v) => v - centre));
  const meanOf = (values: Float64Array): number => {
    const m = neumaierSum(values) / values.length;
    return m + neumaierSum(values.map((v) => v - m)) / values.length;
  };
  const means = centred.map(meanOf);
  const all = new Float64Array(n);
  let at = 0;
  for (const g of centred) { all.set(g, at); at += g.length; }
  const grand = meanOf(all);
  const within = centred.map((g, i) => neumaierSum(g.map((v) => (v - means[i]) ** 2)));
  const between = means.map((m, i) => sizes[i] * (m - grand) ** 2);
  return {
    groupMeans: means.map((m) => centre + m),
    mean: centre + grand,
    ssWithin: neumaierSum(within),
    ssBetween: neumaierSum(between),
  };
}
