import { analyzeInterval, binomialRankCi } from '@shared/stats';
import { fixture } from './support';

// Sources: CLSI EP28-A3c practice (as quoted by Ozarda et al., Clin Chem Lab Med 2019;57:30): for n = 120
// the 90% CI of the 2.5th percentile runs from rank 1 to 7 and of the 97.5th from 114 to 120 (also worked
// from the binomial distribution in the design notes). Other n: the same equal-tailed rule evaluated with
// scipy.stats.binom by make-fixtures/make_scipy_fixtures.py. Exact integers.
// Also: R 4.2's pbinom and qbinom (make-fixtures/make_outside_r.R, fixtures/outside-r.json; the script stops unless
// the two routes give the same ranks) for levels 0.90 and 0.95, p from 0.025 to 0.99 and n from 20 to 1000, with
// the coverage pbinom(s − 1) − pbinom(r − 1) (tolerance 1e-9; measured 1.5e-10); and the table of ranks of the
// 90% CI of the 2.5th percentile in CLSI EP28-A3c (after Reed, Henry & Mason, Clin Chem 1971;17:275), rows
// recalled from MEMORY: n 119–132 ranks 1 and 7, 133–160 ranks 1 and 8, 161–187 ranks 1 and 9, and no CI below
// 119; for the 97.5th percentile the mirrored ranks n + 1 − r.
const { rankCi } = fixture('scipy.json');
const outsideR: any[] = fixture('outside-r.json').rankCi;
const EP28_ROWS_MEMORY: [number, number, number, number][] = [
  [119, 132, 1, 7],
  [133, 160, 1, 8],
  [161, 187, 1, 9],
];

describe('binomial-rank CIs of percentiles', () => {
  it('gives ranks 1–7 and 114–120 at n = 120 (CLSI EP28-A3c practice)', () => {
    expect(binomialRankCi(120, 0.025, 0.9)).toMatchObject({ lowerRank: 1, upperRank: 7 });
    expect(binomialRankCi(120, 0.975, 0.9)).toMatchObject({ lowerRank: 114, upperRank: 120 });
  });

  it('reports the values at ranks 1–7 and 114–120 for 120 reference values (CLSI EP28-A3c practice)', () => {
    const values = Array.from({ length: 120 }, (_, i) => 100 + ((i * 37) % 120));
    const sorted = [...values].sort((a, b) => a - b);
    const result = analyzeInterval(values.map((value) => ({ value })), { resamples: 1000 });
    expect(result.lower!.rankCi).toEqual([sorted[0], sorted[6]]);
    expect(result.upper!.rankCi).toEqual([sorted[113], sorted[119]]);
  });

  it.each(rankCi.map((c: any) => [c.n, c.p, c]) as [number, number, any][])('n = %s, p = %s: ranks as scipy.stats.binom gives them', (_n, _p, c: any) => {
    const ci = binomialRankCi(c.n, c.p, 0.9);
    if (c.lowerRank === null || c.upperRank === null) expect(ci).toBeNull();
    else expect(ci).toMatchObject({ lowerRank: c.lowerRank, upperRank: c.upperRank });
  });
});

describe('binomial-rank CIs against R and the EP28 table', () => {
  const groups = [...new Set(outsideR.map((c) => `${c.level} ${c.p}`))].map((key) => outsideR.filter((c) => `${c.level} ${c.p}` === key));
  it.each(groups.map((g) => [g[0].level, g[0].p, g] as [number, number, any[]]))('level %s, p = %s: ranks and coverage as R pbinom/qbinom give them at every n', (_l, _p, group) => {
    for (const c of group) {
      const ci = binomialRankCi(c.n, c.p, c.level);
      if (c.ci === null) {
        expect(ci).toBeNull();
        continue;
      }
      expect(ci).toMatchObject({ lowerRank: c.ci.lowerRank, upperRank: c.ci.upperRank });
      expect(Math.abs(ci!.coverage - c.ci.coverage)).toBeLessThan(1e-9);
    }
  });

  it('gives the EP28 table rows for every n from 119 to 187 and no CI at 118 (table from memory)', () => {
    for (const [from, to, lower, upper] of EP28_ROWS_MEMORY) {
      for (let n = from; n <= to; n++) {
        expect(binomialRankCi(n, 0.025, 0.9)).toMatchObject({ lowerRank: lower, upperRank: upper });
        expect(binomialRankCi(n, 0.975, 0.9)).toMatchObject({ lowerRank: n + 1 - upper, upperRank: n + 1 - lower });
      }
    }
    expect(binomialRankCi(118, 0.025, 0.9)).toBeNull();
    expect(binomialRankCi(118, 0.975, 0.9)).toBeNull();
  });
});
