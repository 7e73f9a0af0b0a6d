import { reportedDecimals } from './precision';

/**
 * Mean and sum of squared deviations computed on the decimal values the inputs report (precision.ts),
 * exactly in integer arithmetic: with D the reported decimals, k_i = round(x_i·10^D) are the reported
 * values as integers; centred on their middle value c, the deviations δ_i = k_i − c and the sums Σδ_i,
 * Σδ_i² are exact while they stay below 2^53. Then
 *   mean = (c + Σδ/n)/10^D,  Σ(x − x̄)² = (Σδ² − (Σδ)²/n)/10^(2D).
 * This keeps the 15 certified digits of NIST StRD NumAcc3/NumAcc4 (values near 1e6–1e7 with spread 0.1),
 * which no binary algorithm can on the nearest doubles alone. Returns null when the exact path does not
 * apply (too many decimals or too large values), and callers fall back to compensated binary arithmetic.
 */
export function decimalMoments(values: ArrayLike<number>): { mean: number; sumSquares: number } | null {
  const n = values.length;
  if (n === 0) return null;
  const decimals = reportedDecimals(values);
  if (decimals > 12) return null;
  const scale = 10 ** decimals;
  const ints = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    ints[i] = Math.round(values[i] * scale);
    if (!(Math.abs(ints[i]) < 2 ** 52) || Math.abs(ints[i] / scale - values[i]) > 1e-9 * Math.max(1, Math.abs(values[i]))) return null;
  }
  const centre = ints[n >> 1];
  let sum = 0;
  let sumSq = 0;
  for (let i = 0; i < n; i++) {
    const d = ints[i] - centre;
    sum += d;
    sumSq += d * d;
  }
  if (!(Math.abs(sum) < 2 ** 53 && sumSq < 2 ** 53)) return null;
  return { mean: (centre + sum / n) / scale, sumSquares: (sumSq - (sum * sum) / n) / (scale * scale) };
}
