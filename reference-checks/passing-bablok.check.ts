import { passingBablok } from '@shared/stats';
import { slopeOrder, type SlopeMode } from '@shared/stats/slope-selection';
import { fixture } from './support';

// Source: scipy.stats.theilslopes(y, x, 0.95, method='joint') (scipy 1.10), run once by
// make-fixtures/make_scipy_fixtures.py on invented data with no negative pairwise slopes and no ties, where
// Passing–Bablok (1983) coincides with the Theil–Sen median slope and Sen's (1968) rank interval, and
// 'joint' gives the Passing–Bablok intercept median(y − b·x). Tolerance 1e-12.
const ts = fixture('scipy.json').theilSen;

describe('Passing–Bablok against scipy theilslopes (no negative slopes)', () => {
  const pb = passingBablok(ts.x, ts.y, ts.level);

  it('has no slopes below −1, so K = 0 (precondition of the comparison)', () => {
    expect(pb.belowMinusOne).toBe(0);
    expect(pb.slopeCount).toBe((ts.x.length * (ts.x.length - 1)) / 2);
  });

  it('gives the Theil–Sen median slope and the joint intercept (scipy theilslopes)', () => {
    expect(pb.slope).toBeCloseTo(ts.slope, 12);
    expect(pb.intercept).toBeCloseTo(ts.intercept, 12);
  });

  it("gives the slope CI of Sen's ranks as scipy theilslopes computes them", () => {
    expect(pb.slopeCi![0]).toBeCloseTo(ts.lowSlope, 12);
    expect(pb.slopeCi![1]).toBeCloseTo(ts.highSlope, 12);
  });
});

// Source: an independent implementation in R written from the definitions of Passing & Bablok (1983), J. Clin.
// Chem. Clin. Biochem. 21, 709–720 (make-fixtures/make_outside_r.R: brute force over all pairs with outer(),
// every slope listed and sorted, the median shifted by K, the CI ranks from qnorm as the paper states; the
// paper's wording recalled from memory, see the script). Invented data with tied x (vertical pairs, +∞), tied y
// (slope 0), identical points (left out), slopes of exactly −1 (left out) and slopes below −1 (K > 0). Every set
// goes through each of the engine's three ways of ordering the slopes (the sorted table, exact-integer selection
// and floating-point selection). Slopes, N and K exactly (the same correctly rounded quotients); intercepts
// (medians of y − b·x in doubles) to 1e-12.
const outside: any[] = fixture('outside-r.json').passingBablok;
const finite = (v: number | string): number => (v === 'Infinity' ? Infinity : v === '-Infinity' ? -Infinity : (v as number));

describe('Passing–Bablok against a brute-force R implementation of the 1983 definitions', () => {
  it('covers every case the definitions single out (precondition of the comparison)', () => {
    const total = (key: string) => outside.reduce((sum, c) => sum + c[key], 0);
    expect(total('vertical')).toBeGreaterThan(0);
    expect(total('identical')).toBeGreaterThan(0);
    expect(total('minusOne')).toBeGreaterThan(0);
    expect(total('horizontal')).toBeGreaterThan(0);
    expect(outside.filter((c) => c.K > 0).length).toBeGreaterThanOrEqual(3);
    expect(outside.some((c) => c.N % 2 === 1) && outside.some((c) => c.N % 2 === 0)).toBe(true);
    expect(outside.some((c) => c.slopeCi === null)).toBe(true);
  });

  const modes = ['table', 'integer', 'general'] as const;
  const cases = outside.flatMap((c) => modes.map((mode) => [c.name, mode, c] as [string, SlopeMode, any]));

  it.each(cases)('%s (%s): N, K, slope, CI and intercept as R computes them', (_name, mode, c) => {
    const pb = passingBablok(c.x, c.y, c.level, slopeOrder(c.x, c.y, { mode }));
    expect(pb.slopeCount).toBe(c.N);
    expect(pb.belowMinusOne).toBe(c.K);
    expect(pb.slope).toBe(finite(c.slope));
    expect(Math.abs(pb.intercept - c.intercept)).toBeLessThan(1e-12);
    if (c.slopeCi === null) {
      expect(pb.slopeCi).toBeNull();
      expect(pb.interceptCi).toBeNull();
    } else {
      expect(pb.slopeCi).toEqual(c.slopeCi.map(finite));
      expect(Math.abs(pb.interceptCi![0] - c.interceptCi[0])).toBeLessThan(1e-12);
      expect(Math.abs(pb.interceptCi![1] - c.interceptCi[1])).toBeLessThan(1e-12);
    }
  });
});
