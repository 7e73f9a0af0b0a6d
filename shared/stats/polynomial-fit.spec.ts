import { evaluatePolynomial, fitPolynomial, polynomialDesign, solveDesign, type PolynomialFit } from './polynomial-fit';

const rel = (actual: number, expected: number): number => Math.abs(actual - expected) / Math.max(Math.abs(expected), 1e-300);
const raw = (fit: PolynomialFit, x: number): number => fit.coefficients.reduce((s, b, k) => s + b * x ** k, 0);

/** Seeded, deterministic noise (a small linear congruential generator; the values only need to be irregular). */
function noise(n: number, seed: number, size: number): number[] {
  let s = seed >>> 0;
  return Array.from({ length: n }, () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return (s / 2 ** 32 - 0.5) * 2 * size;
  });
}

/**
 * An independent least-squares solution for small, well-conditioned designs: the normal equations XᵀX·b = Xᵀy on
 * raw powers of x, inverted by Gauss–Jordan elimination with partial pivoting; Cov(b) = s²·(XᵀX)⁻¹.
 */
function normalEquations(x: number[], y: number[], degree: number): { b: number[]; se: number[]; rss: number } {
  const p = degree + 1;
  const a = Array.from({ length: p }, (_, i) => Array.from({ length: 2 * p }, (_, j) => (j < p ? x.reduce((s, v) => s + v ** (i + j), 0) : j - p === i ? 1 : 0)));
  for (let c = 0; c < p; c++) {
    let piv = c;
    for (let r = c + 1; r < p; r++) if (Math.abs(a[r][c]) > Math.abs(a[piv][c])) piv = r;
    [a[c], a[piv]] = [a[piv], a[c]];
    const d = a[c][c];
    for (let j = 0; j < 2 * p; j++) a[c][j] /= d;
    for (let r = 0; r < p; r++) {
      if (r === c) continue;
      const f = a[r][c];
      for (let j = 0; j < 2 * p; j++) a[r][j] -= f * a[c][j];
    }
  }
  const inv = a.map((row) => row.slice(p));
  const xty = Array.from({ length: p }, (_, i) => x.reduce((s, v, k) => s + v ** i * y[k], 0));
  const b = inv.map((row) => row.reduce((s, v, j) => s + v * xty[j], 0));
  const rss = x.reduce((s, v, k) => s + (y[k] - b.reduce((t, bj, j) => t + bj * v ** j, 0)) ** 2, 0);
  const s2 = rss / (x.length - p);
  return { b, se: inv.map((row, i) => Math.sqrt(s2 * row[i])), rss };
}

describe('fitPolynomial', () => {
  it.each([
    [1, [4.2, -0.37]],
    [2, [3, -2, 0.5]],
    [3, [-12.5, 0.8, 0.031, -4.4e-5]],
    // terms of comparable size over the x range (else the small ones are below the rounding of y itself)
    [5, [2, -3e-2, 4e-4, -2e-6, 5e-9, -1e-11]],
  ])('recovers a known polynomial of degree %i without noise, to 1e-10 relative on every coefficient', (degree, beta) => {
    // x away from 0 and unevenly spaced, so the centring and the raw-coefficient map are both exercised
    const x = [12, 15, 21, 30, 33, 47, 52, 60, 71, 88, 90, 104, 117, 130];
    const y = x.map((v) => beta.reduce((s, b, k) => s + b * v ** k, 0));
    const fit = fitPolynomial(x, y, degree);
    expect(fit.degree).toBe(degree);
    expect(fit.coefficients).toHaveLength(degree + 1);
    fit.coefficients.forEach((b, k) => expect(rel(b, beta[k])).toBeLessThan(1e-10));
    const syy = y.reduce((s, v) => s + v * v, 0);
    expect(fit.rss / syy).toBeLessThan(1e-24);
    expect(fit.df).toBe(x.length - degree - 1);
  });

  it('degree 1 is the textbook least-squares line: b1 = Sxy/Sxx, se(b1) = s/√Sxx, se(b0) = s·√(1/n + x̄²/Sxx), p from t with 2 df', () => {
    // by hand: x̄ = 2.5, ȳ = 3.5, Sxx = 5, Sxy = 4, Syy = 5 → b1 = 0.8, b0 = 1.5, RSS = 5 − 4²/5 = 1.8, s² = 0.9
    const fit = fitPolynomial([1, 2, 3, 4], [2, 3, 5, 4], 1);
    expect(fit.coefficients[1]).toBeCloseTo(0.8, 14);
    expect(fit.coefficients[0]).toBeCloseTo(1.5, 14);
    expect(fit.rss).toBeCloseTo(1.8, 14);
    expect(fit.df).toBe(2);
    expect(fit.syx).toBeCloseTo(Math.sqrt(0.9), 14);
    expect(rel(fit.se[1], Math.sqrt(0.9 / 5))).toBeLessThan(1e-13);
    expect(rel(fit.se[0], Math.sqrt(0.9 * (1 / 4 + 2.5 ** 2 / 5)))).toBeLessThan(1e-13);
    const t = 0.8 / Math.sqrt(0.18);
    expect(rel(fit.t, t)).toBeLessThan(1e-13);
    // Student's t with 2 df: P(|T| > t) = 1 − t/√(2 + t²)
    expect(rel(fit.p, 1 - t / Math.sqrt(2 + t * t))).toBeLessThan(1e-9);
  });

  it('degree 1 on a larger set: slope, intercept, SEs and RSS by the textbook sums', () => {
    const x = [5, 9, 14, 20, 27, 33, 41, 48, 56, 63, 70, 81];
    const e = noise(x.length, 7, 1.5);
    const y = x.map((v, i) => 2.5 + 0.97 * v + e[i]);
    const n = x.length;
    const xbar = x.reduce((s, v) => s + v, 0) / n;
    const ybar = y.reduce((s, v) => s + v, 0) / n;
    const sxx = x.reduce((s, v) => s + (v - xbar) ** 2, 0);
    const sxy = x.reduce((s, v, i) => s + (v - xbar) * (y[i] - ybar), 0);
    const syy = y.reduce((s, v) => s + (v - ybar) ** 2, 0);
    const b1 = sxy / sxx;
    const rss = syy - b1 * sxy;
    const s2 = rss / (n - 2);
    const fit = fitPolynomial(x, y, 1);
    expect(rel(fit.coefficients[1], b1)).toBeLessThan(1e-12);
    expect(rel(fit.coefficients[0], ybar - b1 * xbar)).toBeLessThan(1e-12);
    expect(rel(fit.rss, rss)).toBeLessThan(1e-9);
    expect(rel(fit.se[1], Math.sqrt(s2 / sxx))).toBeLessThan(1e-9);
    expect(rel(fit.se[0], Math.sqrt(s2 * (1 / n + xbar ** 2 / sxx)))).toBeLessThan(1e-9);
    expect(rel(fit.t, b1 / Math.sqrt(s2 / sxx))).toBeLessThan(1e-9);
  });

  it('degree 2 at x = 0…3 by orthogonal polynomials: b2 = (y0 − y1 − y2 + y3)/4, RSS from the cubic contrast, p from t with 1 df', () => {
    // P2 = x² − 3x + 1 = (1, −1, −1, 1), ΣP2² = 4, so b2 = P2·y/4 and se(b2) = s/2; the residual lies along the
    // cubic contrast (−1, 3, −3, 1), ΣP3² = 20, so RSS = (P3·y)²/20. For y = (1, 2, 2, 4): b2 = 1/4, RSS = 9/20.
    const fit = fitPolynomial([0, 1, 2, 3], [1, 2, 2, 4], 2);
    expect(fit.coefficients[2]).toBeCloseTo(0.25, 14);
    expect(fit.rss).toBeCloseTo(0.45, 14);
    expect(fit.df).toBe(1);
    const se2 = Math.sqrt(0.45) / 2;
    expect(rel(fit.se[2], se2)).toBeLessThan(1e-13);
    const t = 0.25 / se2;
    expect(rel(fit.t, t)).toBeLessThan(1e-13);
    // Student's t with 1 df (Cauchy): P(|T| > t) = 1 − (2/π)·atan(t)
    expect(rel(fit.p, 1 - (2 / Math.PI) * Math.atan(t))).toBeLessThan(1e-9);
    // the whole fit: b = (XᵀX)⁻¹Xᵀy by the normal equations, exact on this small design
    const ne = normalEquations([0, 1, 2, 3], [1, 2, 2, 4], 2);
    fit.coefficients.forEach((b, k) => expect(rel(b, ne.b[k])).toBeLessThan(1e-12));
    fit.se.forEach((s, k) => expect(rel(s, ne.se[k])).toBeLessThan(1e-12));
  });

  it('degree 3: every coefficient and SE as the normal equations give on a small well-conditioned design', () => {
    const x = [0, 0, 1, 1, 2, 2, 3, 3, 4, 4, 5, 5, 6, 6];
    const e = noise(x.length, 11, 0.2);
    const y = x.map((v, i) => 1 + 0.9 * v + 0.05 * v * v - 0.012 * v ** 3 + e[i]);
    const fit = fitPolynomial(x, y, 3);
    const ne = normalEquations(x, y, 3);
    fit.coefficients.forEach((b, k) => expect(rel(b, ne.b[k])).toBeLessThan(1e-9));
    fit.se.forEach((s, k) => expect(rel(s, ne.se[k])).toBeLessThan(1e-9));
    expect(rel(fit.rss, ne.rss)).toBeLessThan(1e-9);
    expect(rel(fit.t, ne.b[3] / ne.se[3])).toBeLessThan(1e-9);
    expect(fit.syx).toBeCloseTo(Math.sqrt(fit.rss / 10), 14);
    // RSS is the sum of squares of the residuals from the raw coefficients
    expect(rel(x.reduce((s, v, i) => s + (y[i] - raw(fit, v)) ** 2, 0), fit.rss)).toBeLessThan(1e-9);
  });

  it('a clearly bent set has a small p for its quadratic term and a straight one does not', () => {
    const x = [1, 1, 2, 2, 3, 3, 4, 4, 5, 5, 6, 6, 7, 7];
    const e = noise(x.length, 3, 0.05);
    const bent = fitPolynomial(x, x.map((v, i) => 10 * v - 0.4 * v * v + e[i]), 2);
    const straight = fitPolynomial(x, x.map((v, i) => 10 * v + e[i]), 2);
    expect(bent.p).toBeLessThan(1e-6);
    expect(straight.p).toBeGreaterThan(0.01);
    expect(Math.sign(bent.t)).toBe(-1);
  });

  it('refuses too few distinct x values, no residual df, values that are not finite, unequal lengths and a bad degree', () => {
    expect(() => fitPolynomial([1, 1, 2, 2, 2], [1, 2, 3, 4, 5], 2)).toThrow('A polynomial of degree 2 needs at least 3 distinct x values');
    expect(() => fitPolynomial([1, 2, 3, 1, 2, 3], [1, 2, 3, 4, 5, 6], 3)).toThrow('at least 4 distinct x values');
    expect(() => fitPolynomial([1, 2, 3], [1, 2, 4], 2)).toThrow('A polynomial of degree 2 needs more than 3 results to estimate its error');
    expect(() => fitPolynomial([1, 2], [1, 2], 1)).toThrow('needs more than 2 results');
    expect(() => fitPolynomial([1, 2, Number.NaN, 4], [1, 2, 3, 4], 1)).toThrow('fitPolynomial: value 3 is not a finite number');
    expect(() => fitPolynomial([1, 2, 3, 4], [1, Number.POSITIVE_INFINITY, 3, 4], 1)).toThrow('value 2 is not a finite number');
    expect(() => fitPolynomial([1, 2, 3, 4], [1, 2, 3], 1)).toThrow('fitPolynomial: x and y differ in length');
    expect(() => fitPolynomial([1, 2, 3, 4], [1, 2, 3, 4], 0)).toThrow('the degree must be a whole number');
    expect(() => fitPolynomial([1, 2, 3, 4], [1, 2, 3, 4], 1.5)).toThrow('the degree must be a whole number');
    expect(() => fitPolynomial([1, 2, 3, 4], [1, 2, 3, 4], 1)).not.toThrow();
    expect(() => fitPolynomial([1, 2, 3], [1, 2, 3], 2)).toThrow(RangeError);
  });
});

describe('evaluatePolynomial', () => {
  it('equals the polynomial of the raw coefficients, inside the levels and beyond them', () => {
    const x = [20, 20, 60, 60, 110, 110, 180, 180, 250, 250, 340, 340, 400, 400];
    const e = noise(x.length, 5, 2);
    const y = x.map((v, i) => 3 + 1.02 * v - 4e-4 * v * v + 6e-7 * v ** 3 + e[i]);
    for (const degree of [1, 2, 3]) {
      const fit = fitPolynomial(x, y, degree);
      for (const at of [0, 20, 95.5, 210, 400, 520]) expect(rel(evaluatePolynomial(fit, at), raw(fit, at))).toBeLessThan(1e-11);
      // and it is the least-squares fit: residuals orthogonal to every column 1, x, …, x^d
      const r = x.map((v, i) => y[i] - evaluatePolynomial(fit, v));
      for (let k = 0; k <= degree; k++) {
        const dot = r.reduce((s, ri, i) => s + ri * ((x[i] - fit.centre) / fit.scale) ** k, 0);
        expect(Math.abs(dot)).toBeLessThan(1e-9);
      }
    }
  });
});

describe('polynomialDesign and solveDesign', () => {
  it('a design reused for many y (and one work array) gives each y the coefficients of a fresh fit', () => {
    const x = [1, 1, 1, 2, 2, 2, 4, 4, 4, 7, 7, 7, 9, 9, 9];
    const design = polynomialDesign(x, 3);
    const work = new Float64Array(x.length);
    const ys = [0, 1, 2, 3].map((s) => {
      const e = noise(x.length, 100 + s, 0.3);
      return x.map((v, i) => 2 + (1 + s) * v - 0.1 * s * v * v + 0.01 * v ** 3 + e[i]);
    });
    // twice over, so a design or work array left changed by an earlier solve would show
    for (let round = 0; round < 2; round++) {
      for (const y of ys) {
        const fresh = fitPolynomial(x, y, 3);
        const b = solveDesign(design, y, work);
        expect(b).toHaveLength(4);
        Array.from(b).forEach((bj, j) => expect(rel(bj, fresh.zCoefficients[j])).toBeLessThan(1e-13));
      }
    }
    expect(design.centre).toBe(5);
    expect(design.scale).toBe(4);
    expect(design.n).toBe(15);
  });
});

describe('the top coefficient under an affine change of x', () => {
  it.each([
    [1, 0], [10, 0], [0.001, 0], [1, 1e6], [-2.5, 40], [3e4, -7e8],
  ])('x → %d·x + %d leaves t (up to the sign of a^d), p, RSS and the fitted values as they were', (a, b) => {
    const x = [0.5, 0.5, 1.2, 1.2, 2.0, 2.0, 3.1, 3.1, 4.4, 4.4, 5.0, 5.0, 6.3, 6.3];
    const e = noise(x.length, 21, 0.08);
    const y = x.map((v, i) => 4 + 2 * v - 0.15 * v * v + 0.01 * v ** 3 + e[i]);
    const moved = x.map((v) => a * v + b);
    for (const degree of [1, 2, 3]) {
      const f0 = fitPolynomial(x, y, degree);
      const f1 = fitPolynomial(moved, y, degree);
      expect(rel(f1.t, Math.sign(a) ** degree * f0.t)).toBeLessThan(1e-9);
      expect(rel(f1.p, f0.p)).toBeLessThan(1e-8);
      expect(rel(f1.rss, f0.rss)).toBeLessThan(1e-9);
      x.forEach((v, i) => expect(rel(evaluatePolynomial(f1, moved[i]), evaluatePolynomial(f0, v))).toBeLessThan(1e-11));
      // the top coefficient itself scales by a^−d
      expect(rel(f1.coefficients[degree], f0.coefficients[degree] / a ** degree)).toBeLessThan(1e-9);
    }
  });
});
