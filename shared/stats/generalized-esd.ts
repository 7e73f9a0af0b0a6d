import { jStat } from 'jstat';

/**
 * Generalized extreme studentized deviate (ESD) many-outlier test (B. Rosner (1983), "Percentage points for
 * a generalized ESD many-outlier procedure", Technometrics 25(2), 165–172; as set out in the NIST/SEMATECH
 * e-Handbook of Statistical Methods, §1.3.5.17.3). For i = 1..r: R_i = max|x − x̄|/s over the values not yet
 * removed (x̄ and s, divisor m − 1, of the m = n − i + 1 remaining values); remove that value; critical
 *   λ_i = (n − i)·t(p, n − i − 1) / sqrt((n − i − 1 + t²)(n − i + 1)),  p = 1 − α/(2(n − i + 1)).
 * The number of outliers is the largest i with R_i > λ_i; the flagged values are the first that many removed.
 * Flags only: excluding a row is the user's act, with a reason.
 */
export interface EsdStep {
  index: number;
  statistic: number;
  critical: number;
}

export interface EsdResult {
  /** Indexes (into the input) of the flagged values, in the order they were removed. */
  outliers: number[];
  steps: EsdStep[];
}

export function generalizedEsd(values: ArrayLike<number>, alpha = 0.05, maxOutliers = 1): EsdResult {
  const n = values.length;
  if (!(alpha > 0 && alpha < 1)) throw new RangeError('generalizedEsd requires 0 < alpha < 1');
  const r = Math.min(maxOutliers, n - 3);
  const active = new Uint8Array(n).fill(1);
  const steps: EsdStep[] = [];
  for (let i = 1; i <= r; i++) {
    const remaining = n - i + 1;
    let sum = 0;
    for (let k = 0; k < n; k++) if (active[k]) sum += values[k];
    const m = sum / remaining;
    let ss = 0;
    let worst = -1;
    let worstDistance = -1;
    for (let k = 0; k < n; k++) {
      if (!active[k]) continue;
      const d = Math.abs(values[k] - m);
      ss += d * d;
      if (d > worstDistance) { worstDistance = d; worst = k; }
    }
    const s = Math.sqrt(ss / (remaining - 1));
    if (s === 0) break;
    const p = 1 - alpha / (2 * remaining);
    const t = jStat.studentt.inv(p, n - i - 1);
    const critical = ((n - i) * t) / Math.sqrt((n - i - 1 + t * t) * remaining);
    steps.push({ index: worst, statistic: worstDistance / s, critical });
    active[worst] = 0;
  }
  let count = 0;
  steps.forEach((step, k) => { if (step.statistic > step.critical) count = k + 1; });
  return { outliers: steps.slice(0, count).map((step) => step.index), steps };
}

/** The default upper bound on outliers: 5% of n, at least 1 (a Parallax default, common practice). */
export function defaultEsdMax(n: number): number {
  return Math.max(1, Math.floor(0.05 * n));
}
