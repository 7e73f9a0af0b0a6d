import { binomialCdf, binomialSf } from './binomial';
import { jsonClean } from './json-clean';
import { magnitudeProblem } from './magnitude';
import { decimalsOption } from './options';
import { resolutionStep, type Resolution } from './resolution';
import { sideOfStated } from './stated-limits';

export { outsideStated, sideOfStated, type StatedLimits } from './stated-limits';

/**
 * Verification (transference) of a stated reference interval with local values (CLSI EP28-A3c practice,
 * from memory): with 20 or more values, accept when at most 10% fall outside the interval (2 of 20).
 * probability: P(X ≥ outside), X ~ Binomial(n, 1 − coverage), the chance of at least this many values
 * outside if the stated interval (coverage 0.95) fits the local population.
 * passRiskAt10Percent: P(X ≤ allowed), X ~ Binomial(n, 0.10): how often the rule still accepts when in
 * truth 10% of the population falls outside (68% at n = 20), the rule's low power shown beside it.
 */
export interface VerifyIntervalResult {
  kind: 'verify-interval';
  n: number;
  outside: number;
  below: number;
  above: number;
  allowedOutside: number;
  accepted: boolean;
  probability: number;
  passRiskAt10Percent: number;
  advice: string;
  /** The step of the values (no CI here, so nothing is limited by it). */
  resolution: Resolution;
  warnings: string[];
}

export function verifyInterval(values: ArrayLike<number>, stated: { lower: number; upper: number; coverage?: number }, decimals?: number | null): VerifyIntervalResult {
  const { lower, upper } = stated;
  const coverage = stated.coverage ?? 0.95;
  if (!(Number.isFinite(lower) && Number.isFinite(upper) && lower < upper)) throw new RangeError('verifyInterval requires finite lower < upper');
  let below = 0;
  let above = 0;
  for (let i = 0; i < values.length; i++) {
    if (!Number.isFinite(values[i])) throw new RangeError(`verifyInterval requires finite values (value ${i + 1})`);
    const problem = magnitudeProblem(values[i]);
    if (problem) throw new RangeError(`verifyInterval: value ${i + 1}: ${problem}`);
    const side = sideOfStated(values[i], stated);
    if (side === 'below') below++;
    else if (side === 'above') above++;
  }
  const n = values.length;
  const outside = below + above;
  const allowedOutside = Math.floor(0.1 * n + 1e-9);
  const accepted = n > 0 && outside <= allowedOutside;
  const warnings = n < 20 ? [`Only ${n} ${n === 1 ? 'value' : 'values'}: verification needs at least 20 (CLSI EP28-A3c practice).`] : [];
  const advice = accepted
    ? 'Accepted: the stated interval may be transferred.'
    : 'Not accepted: test 20 more reference individuals; if that also fails, re-examine the population and methods or establish the interval locally.';
  return jsonClean({
    kind: 'verify-interval', n, outside, below, above, allowedOutside, accepted,
    probability: binomialSf(outside, n, 1 - coverage),
    passRiskAt10Percent: binomialCdf(allowedOutside, n, 0.1),
    advice, resolution: { ...resolutionStep([values], decimalsOption(decimals)), limitedEstimates: [] }, warnings,
  });
}
