/**
 * The acceptance band of a simulated CI coverage: M independent trials of an interval of nominal level L cover
 * the true value C times; C/M has binomial SE sqrt(L(1 − L)/M). The band is two-sided, so that an interval that
 * covers too often (too wide, or always covering) fails as surely as one that covers too rarely:
 *   low  = L − 4·SE − shortfall   (shortfall: a known small-sample undercoverage of the method, stated by the caller)
 *   high = L + 4·SE               (no allowance above: over-coverage is never excused)
 * With M = 2000 and L = 0.95 the band's top is 0.9695, so an interval covering 99% of the time or more fails
 * (its expected count is 4.2 SE above the top). Four SE: a false alarm about once in 16,000 seeds per side (normal
 * approximation), and the simulations are seeded, so a result never changes between runs.
 */
export interface CoverageVerdict {
  coverage: number;
  low: number;
  high: number;
  within: boolean;
}

export function coverageVerdict(covered: number, trials: number, nominal: number, shortfall = 0): CoverageVerdict {
  if (!(trials > 0) || covered < 0 || covered > trials) throw new RangeError('coverageVerdict needs 0 ≤ covered ≤ trials, trials > 0');
  const se = Math.sqrt((nominal * (1 - nominal)) / trials);
  const coverage = covered / trials;
  const low = nominal - 4 * se - shortfall;
  const high = nominal + 4 * se;
  return { coverage, low, high, within: coverage >= low && coverage <= high };
}
