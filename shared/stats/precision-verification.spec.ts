import { precisionVerdict, upperVerificationLimit, verifyPrecisionClaim } from './precision-verification';

// Expected factors from scipy.stats.chi2.ppf (reference-checks/fixtures/precision-scipy.json):
// √(χ²(0.95; 20)/20) = 1.2532045492303105 (ℓ = 1), √(χ²(0.975; 20)/20) = 1.3070884993533975 (ℓ = 2).
const UVL_20_1 = 1.2532045492303105;
const UVL_20_2 = 1.3070884993533975;

describe('precision claims against the upper verification limit', () => {
  it('computes UVL = σ·√(χ²(1 − α/ℓ; ν)/ν)', () => {
    expect(upperVerificationLimit(1, 20, 0.05, 1)).toBeCloseTo(UVL_20_1, 12);
    expect(upperVerificationLimit(1, 20, 0.05, 2)).toBeCloseTo(UVL_20_2, 12);
    expect(upperVerificationLimit(2.5, 20, 0.05, 2)).toBeCloseTo(2.5 * UVL_20_2, 12);
  });

  it('verifies an estimate at or below the claim', () => {
    expect(verifyPrecisionClaim({ sd: 1, cv: 9, df: 20 }, 1, 'sd', 0.05, 2).verdict).toBe('verified');
    expect(verifyPrecisionClaim({ sd: 0.999, cv: 9, df: 20 }, 1, 'sd', 0.05, 2).verdict).toBe('verified');
  });

  it('calls 1.28 consistent with a claim of 1 at ℓ = 2 (UVL 1.307), which α not divided by ℓ (UVL 1.253) would reject', () => {
    const r = verifyPrecisionClaim({ sd: 1.28, cv: 9, df: 20 }, 1, 'sd', 0.05, 2);
    expect(r.uvl).toBeCloseTo(UVL_20_2, 12);
    expect(r.verdict).toBe('consistent');
    expect(verifyPrecisionClaim({ sd: 1.28, cv: 9, df: 20 }, 1, 'sd', 0.05, 1).verdict).toBe('not-verified');
  });

  it('does not verify 1.32 against a claim of 1 at ℓ = 2, which a UVL without the square root (1.708) would accept', () => {
    expect(verifyPrecisionClaim({ sd: 1.32, cv: 9, df: 20 }, 1, 'sd', 0.05, 2).verdict).toBe('not-verified');
  });

  it('judges in the claim\'s terms: a CV claim is judged on the CV, not the SD', () => {
    const r = verifyPrecisionClaim({ sd: 0.5, cv: 2.6, df: 20 }, 2, 'cv', 0.05, 2);
    expect(r.estimate).toBe(2.6);
    expect(r.uvl).toBeCloseTo(2 * UVL_20_2, 12);
    expect(r.verdict).toBe('consistent');
  });

  it('counts an estimate equal to the claim but for binary rounding as equal', () => {
    expect(precisionVerdict(2.0000000000000004, 2, 2.6)).toBe('verified');
    expect(precisionVerdict(2.000001, 2, 2.6)).toBe('consistent');
  });

  it('refuses a claim ≤ 0, ν ≤ 0 or ℓ < 1', () => {
    expect(() => upperVerificationLimit(0, 20, 0.05, 1)).toThrow(RangeError);
    expect(() => upperVerificationLimit(1, 0, 0.05, 1)).toThrow(RangeError);
    expect(() => upperVerificationLimit(1, 20, 0.05, 0)).toThrow(RangeError);
  });
});
