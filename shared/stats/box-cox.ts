/**
 * Box–Cox power transformation (G. E. P. Box and D. R. Cox (1964), J. R. Stat. Soc. B 26, 211–252):
 *   y = (x^λ − 1)/λ for λ ≠ 0, ln x for λ = 0 (x > 0);
 * λ by maximum likelihood under normality of y: maximise the profile log-likelihood
 *   ℓ(λ) = −(n/2)·ln σ̂²(λ) + (λ − 1)·Σ ln x,  σ̂² the variance of y with divisor n,
 * the criterion of scipy's boxcox_normmax with method 'mle' (checked against it in reference-checks).
 *
 * Computed stably (engine 1.2):
 * - the data are divided by their geometric mean g first: ℓ(λ; x) = ℓ(λ; x/g) − n·ln g, so the maximiser
 *   is the same, and values near 1e-4 or 1e200 become values near 1, with Σ ln(x/g) = 0;
 * - y = expm1(λ·ln(x/g))/λ, which keeps its digits as λ → 0 (where (x^λ − 1)/λ is rounding noise);
 * - a grid of λ = k/10 for integers k = −50..50 (so λ = 0 is exactly 0, not 1e-15), then golden-section
 *   search on the two grid cells around the best point, to 1e-10;
 * - a λ at a bound of [−5, 5] is reported (atBound) so the caller can warn.
 * Limits are computed on the scaled values and mapped back with g (scaledBoxCox / inverseScaledBoxCox).
 */
export const LAMBDA_BOUND = 5;

export interface BoxCoxFit {
  lambda: number;
  /** The geometric mean the values were divided by. */
  geometricMean: number;
  /** True when λ lies on a bound of the search (±5): the likelihood still rises beyond it. */
  atBound: boolean;
}

/** (x^λ − 1)/λ, or ln x at λ = 0, computed as expm1(λ·ln x)/λ. */
export function boxCox(x: number, lambda: number): number {
  const log = Math.log(x);
  return lambda === 0 ? log : Math.expm1(lambda * log) / lambda;
}

/** The inverse; NaN where it is undefined (λy + 1 ≤ 0). */
export function inverseBoxCox(y: number, lambda: number): number {
  if (lambda === 0) return Math.exp(y);
  const base = lambda * y + 1;
  return base > 0 ? Math.exp(Math.log1p(lambda * y) / lambda) : NaN;
}

/** The transform of x/g, the scale the fit works on. */
export function scaledBoxCox(x: number, fit: BoxCoxFit): number {
  return boxCox(x / fit.geometricMean, fit.lambda);
}

/** Back from the fit's scale to the data's unit; NaN where undefined. */
export function inverseScaledBoxCox(y: number, fit: BoxCoxFit): number {
  return fit.geometricMean * inverseBoxCox(y, fit.lambda);
}

/** ℓ(λ) of the values already divided by their geometric mean (logs z = ln(x/g)); −∞ where it overflows. */
function profileLogLikelihood(z: Float64Array, lambda: number): number {
  const n = z.length;
  let sum = 0;
  let sumZ = 0;
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    y[i] = lambda === 0 ? z[i] : Math.expm1(lambda * z[i]) / lambda;
    sum += y[i];
    sumZ += z[i];
  }
  const m = sum / n;
  let ss = 0;
  for (let i = 0; i < n; i++) ss += (y[i] - m) ** 2;
  const value = -(n / 2) * Math.log(ss / n) + (lambda - 1) * sumZ;
  return Number.isFinite(value) ? value : -Infinity;
}

function scaledLogs(values: ArrayLike<number>): { z: Float64Array; logG: number } {
  const n = values.length;
  const logs = new Float64Array(n);
  let sum = 0;
  for (let i = 0; i < n; i++) { logs[i] = Math.log(values[i]); sum += logs[i]; }
  let logG = sum / n;
  let residual = 0;
  for (let i = 0; i < n; i++) residual += logs[i] - logG;
  logG += residual / n;
  return { z: logs.map((l) => l - logG), logG };
}

/** @throws RangeError unless every value is positive and not all are equal */
export function boxCoxFit(values: ArrayLike<number>): BoxCoxFit {
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < values.length; i++) {
    if (!(values[i] > 0) || !Number.isFinite(values[i])) throw new RangeError('boxCoxLambda requires positive values');
    if (values[i] < min) min = values[i];
    if (values[i] > max) max = values[i];
  }
  if (!(min < max)) throw new RangeError('boxCoxLambda requires values that are not all equal');
  const { z, logG } = scaledLogs(values);
  const f = (l: number): number => profileLogLikelihood(z, l);
  const steps = LAMBDA_BOUND * 10;
  let bestK = -steps;
  let bestF = f(-LAMBDA_BOUND);
  for (let k = -steps + 1; k <= steps; k++) {
    const value = f(k / 10);
    if (value > bestF) { bestF = value; bestK = k; }
  }
  let a = Math.max(-steps, bestK - 1) / 10;
  let b = Math.min(steps, bestK + 1) / 10;
  const g = (Math.sqrt(5) - 1) / 2;
  let c = b - g * (b - a);
  let d = a + g * (b - a);
  let fc = f(c);
  let fd = f(d);
  while (b - a > 1e-10) {
    if (fc > fd) { b = d; d = c; fd = fc; c = b - g * (b - a); fc = f(c); }
    else { a = c; c = d; fc = fd; d = a + g * (b - a); fd = f(d); }
  }
  let lambda = (a + b) / 2;
  if (f(-LAMBDA_BOUND) >= f(lambda)) lambda = -LAMBDA_BOUND;
  if (f(LAMBDA_BOUND) >= f(lambda)) lambda = LAMBDA_BOUND;
  return { lambda, geometricMean: Math.exp(logG), atBound: Math.abs(lambda) >= LAMBDA_BOUND - 1e-6 };
}

/** The maximum-likelihood λ alone. @throws RangeError as boxCoxFit */
export function boxCoxLambda(values: ArrayLike<number>): number {
  return boxCoxFit(values).lambda;
}
