import { analyzeInterval, binomialRankCi } from '@shared/stats';
import { fixture } from './support';

// Sources: CLSI EP28-A3c practice (as quoted by Ozarda et al., Clin Chem Lab Med 2019;57:30): for n = 120
// the 90% CI of the 2.5th percentile runs from rank 1 to 7 and of the 97.5th from 114 to 120 (also worked
// from the binomial distribution in the design notes). Other n: the same equal-tailed rule evaluated with
// scipy.stats.binom by make-fixtures/make_scipy_fixtures.py. Exact integers.
const { rankCi } = fixture('scipy.json');

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
