import { passingBablok } from '@shared/stats';
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
