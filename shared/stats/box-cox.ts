/**
 * Box–Cox power transformation (G. E. P. Box and D. R. Cox (1964), J. R. Stat. Soc. B 26, 211–252):
 *   y = (x^λ − 1)/λ for λ ≠ 0, ln x for λ = 0 (x > 0);
 * λ by maximum likelihood under normality of y: maximise the profile log-likelihood
 *   ℓ(λ) = −(n/2)·ln σ̂²(λ) + (λ − 1)·Σ ln x,  σ̂² the variance of y with divisor n,
 * over [−5, 5] by a grid (step 0.1) then golden-section search (the criterion of scipy's boxcox_normmax
 * with method 'mle', checked against it in reference-checks).
 */
export function boxCox(x: number, lambda: number): number {
  return lambda === 0 ? Math.log(x) : (Math.pow(x, lambda) - 1) / lambda;
}

/** The inverse; NaN where it is undefined (λy + 1 ≤ 0). */
export function inverseBoxCox(y: number, lambda: number): number {
  if (lambda === 0) return Math.exp(y);
  const base = lambda * y + 1;
  return base > 0 ? Math.pow(base, 1 / lambda) : NaN;
}

export function boxCoxLogLikelihood(values: ArrayLike<number>, lambda: number): number {
  const n = values.length;
  let sumLog = 0;
  let sum = 0;
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    sumLog += Math.log(values[i]);
    y[i] = boxCox(values[i], lambda);
    sum += y[i];
  }
  const m = sum / n;
  let ss = 0;
  for (let i = 0; i < n; i++) ss += (y[i] - m) ** 2;
  return -(n / 2) * Math.log(ss / n) + (lambda - 1) * sumLog;
}

/** @throws RangeError unless every value is positive and not all are equal */
export function boxCoxLambda(values: ArrayLike<number>): number {
  for (let i = 0; i < values.length; i++) if (!(values[i] > 0)) throw new RangeError('boxCoxLambda requires positive values');
  const f = (l: number): number => boxCoxLogLikelihood(values, l);
  let best = -5;
  for (let l = -5; l <= 5.0001; l += 0.1) if (f(l) > f(best)) best = l;
  let a = Math.max(-5, best - 0.1);
  let b = Math.min(5, best + 0.1);
  const g = (Math.sqrt(5) - 1) / 2;
  while (b - a > 1e-10) {
    const c = b - g * (b - a);
    const d = a + g * (b - a);
    if (f(c) > f(d)) b = d;
    else a = c;
  }
  if (!Number.isFinite(f((a + b) / 2))) throw new RangeError('boxCoxLambda requires values that are not all equal');
  return (a + b) / 2;
}
