import { jStat } from 'jstat';

/**
 * Least-squares polynomial y = b0 + b1·x + … + b_d·x^d, with the coefficients' standard errors and the t-test of
 * the top coefficient (the reportable-range kind fits degrees 1 to 3; the NIST StRD checks go to 10).
 *
 * Method: x is centred and scaled to z = (x − c)/s on [−1, 1] (c the midrange, s the half range), the design
 * matrix of 1, z, …, z^d is factored by Householder QR (G. H. Golub and C. F. Van Loan, "Matrix Computations",
 * 4th ed., 2013, §5.2 and §5.3: least squares by QR; from memory), and the coefficients in z solve R·β_z = Q₁ᵀy.
 * The residual variance is σ̂² = RSS/(n − d − 1) and Cov(β_z) = σ̂²·R⁻¹R⁻ᵀ. The coefficients on raw x follow by the
 * binomial expansion of ((x − c)/s)^j, a linear map T with T[k][j] = C(j, k)·(−c)^(j−k)/s^j (j ≥ k), so
 * β = T·β_z and Cov(β) = T·Cov(β_z)·Tᵀ. A plain solve of the normal equations on raw powers of x loses every digit
 * on NIST's Filip (degree 10) and about six on Pontius; this keeps 7 or more on Filip and 12 or more on Pontius
 * (reference-checks/nist-polynomial.check.ts).
 *
 * The top coefficient's t = b_d/se(b_d) is the same in z and in x (both scale by s^−d), so its test is taken in z:
 * p = 2·P(T_(n−d−1) > |t|).
 */
export interface PolynomialFit {
  degree: number;
  /** b0 … b_d on raw x. */
  coefficients: number[];
  se: number[];
  /** t and two-sided p of the top coefficient. */
  t: number;
  p: number;
  rss: number;
  df: number;
  /** Residual SD √(RSS/df). */
  syx: number;
  /** The fit in z, for evaluation without the raw coefficients' cancellation. */
  centre: number;
  scale: number;
  zCoefficients: number[];
}

/** y = b0 + b1·x + … at x on the raw coefficients (RangeFit.coefficients), by Horner's rule: for drawing a fit. */
export function polynomialAt(coefficients: readonly number[], x: number): number {
  let y = 0;
  for (let i = coefficients.length - 1; i >= 0; i--) y = y * x + coefficients[i];
  return y;
}

/** The fit's value at x, evaluated in z by Horner's rule. */
export function evaluatePolynomial(fit: { centre: number; scale: number; zCoefficients: ArrayLike<number> }, x: number): number {
  const z = (x - fit.centre) / fit.scale;
  let v = 0;
  for (let j = fit.zCoefficients.length - 1; j >= 0; j--) v = v * z + fit.zCoefficients[j];
  return v;
}

/**
 * The factored design of a polynomial fit at fixed x: reused for every y on the same x (the bootstrap of the
 * reportable range refits the same levels thousands of times).
 */
export interface PolynomialDesign {
  degree: number;
  n: number;
  centre: number;
  scale: number;
  /** Householder vectors (column j in v[j], from row j) and their β; R's upper triangle (p × p, row-major). */
  v: Float64Array[];
  beta: Float64Array;
  r: Float64Array;
}

/**
 * Factors the design of degree `degree` at x.
 * @throws RangeError when x has fewer than degree + 1 distinct values or n ≤ degree + 1 (no residual df)
 */
export function polynomialDesign(x: ArrayLike<number>, degree: number): PolynomialDesign {
  const n = x.length;
  const p = degree + 1;
  if (!Number.isInteger(degree) || degree < 1) throw new RangeError('polynomialDesign: the degree must be a whole number from 1');
  for (let i = 0; i < n; i++) if (!Number.isFinite(x[i])) throw new RangeError(`polynomialDesign: x value ${i + 1} is not a finite number`);
  if (new Set(Array.from(x)).size < p) throw new RangeError(`A polynomial of degree ${degree} needs at least ${p} distinct x values`);
  if (n <= p) throw new RangeError(`A polynomial of degree ${degree} needs more than ${p} results to estimate its error`);
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < n; i++) { lo = Math.min(lo, x[i]); hi = Math.max(hi, x[i]); }
  const centre = (lo + hi) / 2;
  const scale = (hi - lo) / 2;
  // column-major design a[j][i] = z_i^j
  const a: Float64Array[] = [];
  for (let j = 0; j < p; j++) a.push(new Float64Array(n));
  for (let i = 0; i < n; i++) {
    const z = (x[i] - centre) / scale;
    let w = 1;
    for (let j = 0; j < p; j++) { a[j][i] = w; w *= z; }
  }
  const v: Float64Array[] = [];
  const beta = new Float64Array(p);
  const r = new Float64Array(p * p);
  for (let j = 0; j < p; j++) {
    const col = a[j];
    let norm = 0;
    for (let i = j; i < n; i++) norm = Math.hypot(norm, col[i]);
    const alpha = col[j] > 0 ? -norm : norm;
    const vj = new Float64Array(n);
    for (let i = j; i < n; i++) vj[i] = col[i];
    vj[j] -= alpha;
    let vv = 0;
    for (let i = j; i < n; i++) vv += vj[i] * vj[i];
    beta[j] = vv === 0 ? 0 : 2 / vv;
    v.push(vj);
    // apply H_j = I − β v vᵀ to the remaining columns
    for (let k = j; k < p; k++) applyReflector(vj, beta[j], j, a[k]);
    for (let k = j; k < p; k++) r[j * p + k] = a[k][j];
  }
  return { degree, n, centre, scale, v, beta, r };
}

function applyReflector(v: Float64Array, beta: number, from: number, y: Float64Array): void {
  let s = 0;
  for (let i = from; i < y.length; i++) s += v[i] * y[i];
  s *= beta;
  if (s !== 0) for (let i = from; i < y.length; i++) y[i] -= s * v[i];
}

/** β_z of y on the factored design (Qᵀy, then back substitution); `work` (length n) is overwritten. */
export function solveDesign(d: PolynomialDesign, y: ArrayLike<number>, work = new Float64Array(d.n)): Float64Array {
  const p = d.degree + 1;
  for (let i = 0; i < d.n; i++) work[i] = y[i];
  for (let j = 0; j < p; j++) applyReflector(d.v[j], d.beta[j], j, work);
  const b = new Float64Array(p);
  for (let j = p - 1; j >= 0; j--) {
    let s = work[j];
    for (let k = j + 1; k < p; k++) s -= d.r[j * p + k] * b[k];
    b[j] = s / d.r[j * p + j];
  }
  return b;
}

/**
 * The least-squares polynomial of degree `degree` through (x, y), with SEs and the top coefficient's t-test.
 * @throws RangeError for x and y of different lengths, values that are not finite, or too few distinct x (polynomialDesign)
 */
export function fitPolynomial(x: ArrayLike<number>, y: ArrayLike<number>, degree: number): PolynomialFit {
  if (x.length !== y.length) throw new RangeError('fitPolynomial: x and y differ in length');
  for (let i = 0; i < x.length; i++) {
    if (!Number.isFinite(x[i]) || !Number.isFinite(y[i])) throw new RangeError(`fitPolynomial: value ${i + 1} is not a finite number`);
  }
  const d = polynomialDesign(x, degree);
  const p = degree + 1;
  const bz = solveDesign(d, y);
  const zFit = { centre: d.centre, scale: d.scale, zCoefficients: Array.from(bz) };
  let rss = 0;
  for (let i = 0; i < d.n; i++) {
    const e = y[i] - evaluatePolynomial(zFit, x[i]);
    rss += e * e;
  }
  const df = d.n - p;
  const sigma2 = rss / df;
  // R⁻¹ (upper triangular) by back substitution, then Cov_z = σ²·R⁻¹R⁻ᵀ
  const rinv = new Float64Array(p * p);
  for (let c = 0; c < p; c++) {
    for (let j = c; j >= 0; j--) {
      let s = j === c ? 1 : 0;
      for (let k = j + 1; k <= c; k++) s -= d.r[j * p + k] * rinv[k * p + c];
      rinv[j * p + c] = s / d.r[j * p + j];
    }
  }
  const covZ = new Float64Array(p * p);
  for (let i = 0; i < p; i++) {
    for (let j = 0; j < p; j++) {
      let s = 0;
      for (let k = Math.max(i, j); k < p; k++) s += rinv[i * p + k] * rinv[j * p + k];
      covZ[i * p + j] = sigma2 * s;
    }
  }
  const t = rawMap(d.centre, d.scale, p);
  const coefficients: number[] = [];
  const se: number[] = [];
  for (let k = 0; k < p; k++) {
    let b = 0;
    for (let j = k; j < p; j++) b += t[k * p + j] * bz[j];
    coefficients.push(b);
    let v = 0;
    for (let i = k; i < p; i++) for (let j = k; j < p; j++) v += t[k * p + i] * covZ[i * p + j] * t[k * p + j];
    se.push(Math.sqrt(Math.max(v, 0)));
  }
  const seTop = Math.sqrt(covZ[p * p - 1]);
  const tTop = seTop > 0 ? bz[p - 1] / seTop : (bz[p - 1] === 0 ? 0 : Math.sign(bz[p - 1]) * Infinity);
  // from the lower tail, so a tiny p keeps its digits (2·(1 − F(|t|)) is 0 below about 1e-16)
  const pTop = Number.isFinite(tTop) ? 2 * jStat.studentt.cdf(-Math.abs(tTop), df) : 0;
  return { degree, coefficients, se, t: tTop, p: Math.min(1, Math.max(0, pTop)), rss, df, syx: Math.sqrt(sigma2), ...zFit };
}

/** T[k][j] = C(j, k)·(−c)^(j−k)/s^j for j ≥ k: raw coefficients from those in z = (x − c)/s. */
function rawMap(c: number, s: number, p: number): Float64Array {
  const t = new Float64Array(p * p);
  for (let j = 0; j < p; j++) {
    let binom = 1;
    const sj = s ** j;
    for (let k = 0; k <= j; k++) {
      if (k > 0) binom = (binom * (j - k + 1)) / k;
      t[k * p + j] = (binom * (-c) ** (j - k)) / sj;
    }
  }
  return t;
}
