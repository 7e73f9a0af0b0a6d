/**
 * Cusum test for linearity of Passing–Bablok regression (Passing & Bablok 1983, §3; described from memory of
 * the paper, checked here by its defining properties). With the fitted line y = a + b·x:
 *   l = #points above the line, L = #points below; score r_i = +sqrt(L/l) above, −sqrt(l/L) below, 0 on it
 *   (so the scores sum to 0); points ordered by their projection on the line,
 *   D_i = (y_i + x_i/b − a)/sqrt(1 + 1/b²); cusum S_k = Σ_{i ≤ k} r_i.
 * Statistic H = max|S_k| / sqrt(L + 1), compared with the Kolmogorov–Smirnov distribution
 * (critical value 1.36 at the 5% level, as in the paper); the p-value is the asymptotic Kolmogorov
 * survival function Q(H) = 2 Σ_{j ≥ 1} (−1)^{j−1} exp(−2 j² H²).
 * p is null when all points lie on the line or all on one side of it.
 */
export interface CusumLinearity {
  statistic: number | null;
  pValue: number | null;
  above: number;
  below: number;
}

export function cusumLinearity(x: ArrayLike<number>, y: ArrayLike<number>, slope: number, intercept: number): CusumLinearity {
  const n = x.length;
  const residualSign = new Int8Array(n);
  let above = 0;
  let below = 0;
  const scale = Math.max(1e-300, ...Array.from(y, Math.abs));
  for (let i = 0; i < n; i++) {
    const r = y[i] - (intercept + slope * x[i]);
    residualSign[i] = Math.abs(r) <= 1e-12 * scale ? 0 : r > 0 ? 1 : -1;
    if (residualSign[i] > 0) above++;
    else if (residualSign[i] < 0) below++;
  }
  if (above === 0 || below === 0 || slope === 0) return { statistic: null, pValue: null, above, below };
  const projection = (i: number): number => (y[i] + x[i] / slope - intercept) / Math.sqrt(1 + 1 / (slope * slope));
  const order = Array.from({ length: n }, (_, i) => i).sort((p, q) => projection(p) - projection(q) || p - q);
  const up = Math.sqrt(below / above);
  const down = -Math.sqrt(above / below);
  let cusum = 0;
  let max = 0;
  for (const i of order) {
    cusum += residualSign[i] > 0 ? up : residualSign[i] < 0 ? down : 0;
    max = Math.max(max, Math.abs(cusum));
  }
  const statistic = max / Math.sqrt(below + 1);
  return { statistic, pValue: kolmogorovSurvival(statistic), above, below };
}

/** Q(h) = P(K > h) for the Kolmogorov distribution, by its alternating series. */
export function kolmogorovSurvival(h: number): number {
  if (h <= 0) return 1;
  if (h < 0.2) return 1;
  let sum = 0;
  for (let j = 1; j <= 100; j++) {
    const term = Math.exp(-2 * j * j * h * h);
    sum += (j % 2 === 1 ? 1 : -1) * term;
    if (term < 1e-16) break;
  }
  return Math.min(1, Math.max(0, 2 * sum));
}
