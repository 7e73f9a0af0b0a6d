import { signTest, wilcoxonSignedRank } from '@shared/stats';
import { fixture } from './support';

// Source: scipy 1.10 (Debian python3-scipy), run once by make-fixtures/make_scipy_fixtures.py on invented
// differences: scipy.stats.wilcoxon (zeros dropped; method 'exact' for the untied set, 'approx' with
// correction=True and tie correction otherwise) and scipy.stats.binomtest(k, m, 0.5) for the sign test.
// Tolerance 1e-10 relative (the same formulas; floating-point summation order only).
const { signedRank } = fixture('scipy.json');

describe('Wilcoxon signed-rank and sign test against scipy', () => {
  it.each(signedRank.map((c: any) => [c.name, c]) as [string, any][])('%s: Wilcoxon p-value as scipy.stats.wilcoxon computes it', (_name, c: any) => {
    const result = wilcoxonSignedRank(c.differences);
    expect(result.method).toBe(c.wilcoxonMethod === 'exact' ? 'exact' : 'normal');
    expect(result.pValue! / c.wilcoxonP).toBeCloseTo(1, 10);
  });

  it.each(signedRank.map((c: any) => [c.name, c]) as [string, any][])('%s: exact sign-test p-value as scipy.stats.binomtest computes it', (_name, c: any) => {
    expect(signTest(c.differences).pValue! / c.signP).toBeCloseTo(1, 10);
  });
});
