import { evaluatePolynomial, fitPolynomial } from '@shared/stats/polynomial-fit';
import { dataFile, logRelativeError } from './support';

// Source: NIST Statistical Reference Datasets, linear least-squares regression (certified with multiple-precision
// arithmetic, given to 15 significant digits): Pontius (40 observations, degree 2; a load-cell calibration and
// NIST's "average" difficulty, from memory) and Filip (82 observations, degree 10; NIST's "higher" difficulty, from
// memory; so ill-conditioned that a solve of the normal equations on raw powers of x keeps no correct digit, as the
// shared reference data's README records).
// Data and certified coefficients, standard errors and residual sum of squares copied from the project's shared
// reference data into reference-checks/data/nist-strd-linear/ (Pontius.csv and Filip.csv: column 0 is x, column 1
// is y; certified.json; provenance in README.md).
// Tolerance: NIST's log relative error (LRE, correct significant digits). Pontius ≥ 11 and Filip ≥ 12 for every
// coefficient, standard error and the RSS. Measured when this check was written: Pontius coefficients LRE ≥ 12.1,
// SEs ≥ 13.4, RSS 13.1; Filip coefficients ≥ 13.7, SEs ≥ 14.1, RSS 14.1 (the thresholds leave a digit or so for a
// different order of summation, not more: a relative error of 1e-11 in any of them fails). Pontius's
// quadratic coefficient is −3.16e-15 on x up to 3e6: its SE in raw x is the sharpest test of the map from
// centred-and-scaled x back to raw powers.
interface Certified {
  model: string;
  n: number;
  coefficients: number[];
  standardErrors: number[];
  residualSumOfSquares: number;
}
const certified = JSON.parse(dataFile('nist-strd-linear', 'certified.json')) as Record<'Pontius' | 'Filip', Certified>;

function nistData(name: string): { x: number[]; y: number[] } {
  const lines = dataFile('nist-strd-linear', `${name}.csv`).split(/\r?\n/).filter((l) => l.trim() !== '');
  expect(lines[0].trim()).toBe('x,y');
  const rows = lines.slice(1).map((l) => l.split(',').map(Number));
  return { x: rows.map((r) => r[0]), y: rows.map((r) => r[1]) };
}

const CASES: ['Pontius' | 'Filip', number, number][] = [
  ['Pontius', 2, 11],
  ['Filip', 10, 12],
];

describe('NIST StRD linear regression: polynomial fits against the certified values', () => {
  it.each(CASES)('%s, degree %i: every coefficient, standard error and the RSS to LRE ≥ %i (NIST StRD)', (name, degree, minLre) => {
    const c = certified[name];
    const { x, y } = nistData(name);
    expect(x).toHaveLength(c.n);
    expect(c.coefficients).toHaveLength(degree + 1);
    const fit = fitPolynomial(x, y, degree);
    expect(fit.df).toBe(c.n - degree - 1);
    const lre = {
      coefficients: fit.coefficients.map((b, k) => logRelativeError(b, c.coefficients[k])),
      se: fit.se.map((s, k) => logRelativeError(s, c.standardErrors[k])),
      rss: logRelativeError(fit.rss, c.residualSumOfSquares),
    };
    for (const v of [...lre.coefficients, ...lre.se, lre.rss]) expect(v).toBeGreaterThanOrEqual(minLre);
    // the residual SD NIST derives from the RSS, and the top coefficient's t from the certified figures
    expect(logRelativeError(fit.syx, Math.sqrt(c.residualSumOfSquares / (c.n - degree - 1)))).toBeGreaterThanOrEqual(minLre);
    expect(logRelativeError(fit.t, c.coefficients[degree] / c.standardErrors[degree])).toBeGreaterThanOrEqual(minLre);
  });

  it.each(CASES)('%s, degree %i: the fitted values (evaluated in centred x) are the certified polynomial\'s to the rounding of its 15 digits', (name, degree) => {
    const c = certified[name];
    const { x, y } = nistData(name);
    const fit = fitPolynomial(x, y, degree);
    // Certified coefficients rounded to 15 significant digits pin the polynomial's value at x only to about
    // 5e-15·Σ|b_k·x^k|; on Filip the terms reach 6e6 times the value itself, so no reference can say more than ~8
    // digits of its fitted values (measured: |ours − certified| ≤ 2.7e-15·Σ|b_k·x^k| on Pontius, ≤ 5.5e-16 on
    // Filip; double evaluation of the certified raw polynomial adds ~1e-16·Σ|b_k·x^k|). Tolerance 1e-14·Σ|b_k·x^k|.
    for (const v of x) {
      const terms = c.coefficients.map((b, k) => b * v ** k);
      const expected = terms.reduce((s, t) => s + t, 0);
      const size = terms.reduce((s, t) => s + Math.abs(t), 0);
      expect(Math.abs(evaluatePolynomial(fit, v) - expected)).toBeLessThanOrEqual(1e-14 * size);
    }
    if (name === 'Pontius') for (const v of x) expect(logRelativeError(evaluatePolynomial(fit, v), c.coefficients.reduce((s, b, k) => s + b * v ** k, 0))).toBeGreaterThanOrEqual(13);
  });
});
