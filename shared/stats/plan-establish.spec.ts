import { optionOf } from './option-of.testing';
import { ESTABLISH_GRID, expectedOrderStatistic, planEstablish, type EstablishPlanOptions } from './plan-establish';

const population = { shape: 'normal' as const, lower: 3.5, upper: 5.3 };

describe('planEstablish', () => {
  it('has no 90% CI of the 2.5th and 97.5th percentiles below 119 individuals', () => {
    const r = planEstablish({ n: [100, 118, 119, 120], population });
    const ranks = r.rows.map((row) => row.limits.map((l) => [l.lowerRank, l.upperRank]));
    expect(ranks[0]).toEqual([[null, null], [null, null]]);
    expect(ranks[1]).toEqual([[null, null], [null, null]]);
    expect(ranks[2][0][0]).toBe(1);
    expect(ranks[3]).toEqual([[1, 7], [114, 120]]);
    expect(r.rows[1].limits[0]).toMatchObject({ coverage: null, expectedSpan: null, expectedWidth: null });
    expect(r.rows[3].limits[0].coverage).toBeGreaterThan(0.9);
  });

  it('narrows the CIs from 120 to 400 individuals, in percentile points and in the unit', () => {
    const r = planEstablish({ population });
    expect(r.rows.map((row) => row.n)).toEqual([...ESTABLISH_GRID]);
    const first = r.rows[0].limits;
    const last = r.rows[r.rows.length - 1].limits;
    for (const k of [0, 1]) {
      // 120: ranks 1–7, 6/121 of the population; 400: 11/401 (the ranks are whole, so not every step narrows).
      expect(last[k].expectedSpan!).toBeLessThan(0.6 * first[k].expectedSpan!);
      expect(last[k].expectedWidth!).toBeLessThan(0.6 * first[k].expectedWidth!);
      expect(last[k].expectedWidth!).toBeGreaterThan(0);
    }
    // Expected span: (s − r)/(n + 1) of the population, ranks 1 to 7 at n = 120.
    expect(first[0].expectedSpan).toBeCloseTo((100 * 6) / 121, 12);
  });

  it('gives spans but no widths without a presumed population', () => {
    const r = planEstablish({ n: [120] });
    expect(r.population).toBeNull();
    expect(r.rows[0].limits[0].expectedSpan).toBeGreaterThan(0);
    expect(r.rows[0].limits[0].expectedWidth).toBeNull();
  });

  it('mirrors the limits of a normal population, and skews them for a log-normal one', () => {
    const normal = planEstablish({ n: [120], population }).rows[0].limits;
    expect(normal[0].expectedWidth!).toBeCloseTo(normal[1].expectedWidth!, 10);
    const logNormal = planEstablish({ n: [120], population: { shape: 'log-normal', lower: 1, upper: 9 } }).rows[0].limits;
    expect(logNormal[1].expectedWidth!).toBeGreaterThan(3 * logNormal[0].expectedWidth!);
  });

  it('places E[x(k)] of a normal population symmetrically about its middle', () => {
    for (const [n, k] of [[120, 7], [240, 3], [20, 20]]) {
      const sum = expectedOrderStatistic(population, n, k) + expectedOrderStatistic(population, n, n + 1 - k);
      expect(sum).toBeCloseTo(2 * 4.4, 10);
    }
    expect(expectedOrderStatistic(population, 1, 1)).toBeCloseTo(4.4, 10);
  });

  it('follows the level: at 95% n = 120 is too few for the 2.5th percentile', () => {
    expect(planEstablish({ n: [120], level: 0.95 }).rows[0].limits[0].lowerRank).toBeNull();
    expect(planEstablish({ n: [120], level: 0.95 }).level).toBe(0.95);
  });

  it.each<[string, string, EstablishPlanOptions]>([
    ['a lower limit missing', 'population.lower', { population: { upper: 5 } }],
    ['no limits at all', 'population.lower', { population: {} }],
    ['an upper limit missing', 'population.upper', { population: { lower: 5 } }],
    ['upper below lower', 'population.upper', { population: { lower: 5, upper: 4 } }],
    ['upper equal to lower', 'population.upper', { population: { lower: 5, upper: 5 } }],
    ['a log-normal population from 0', 'population.lower', { population: { shape: 'log-normal', lower: 0, upper: 4 } }],
    ['an unknown shape', 'population.shape', { population: { shape: 'gamma' as never, lower: 1, upper: 2 } }],
    ['n of 1', 'n', { n: [1] }],
    ['13 grid points', 'n', { n: Array.from({ length: 13 }, (_, i) => 120 + i) }],
    ['an empty grid', 'n', { n: [] }],
    ['percentile 100', 'percentiles', { percentiles: [2.5, 100] }],
    ['level 1', 'level', { level: 1 }],
  ])('%s: names %s', (_what, option, options) => {
    expect(optionOf(() => planEstablish(options))).toBe(option);
  });
});
