import { jStat } from 'jstat';
import type { PrecisionVerdict } from './precision-types';

/**
 * Upper verification limit of a precision claim σ (an SD, or a CV in %): the largest estimate s with ν degrees
 * of freedom that is still consistent with σ at a family-wise level α over ℓ materials,
 *   UVL = σ·√(χ²(1 − α/ℓ; ν)/ν),
 * the one-sided upper (1 − α/ℓ) limit of s when ν·s²/σ² ~ χ²(ν) (Bonferroni over the ℓ materials).
 * Source: CLSI EP15-A3 practice, as the design notes state it (DOMAIN.md "Precision"; from memory).
 * A CV claim scales the same way, since CV = 100·s/x̄ for a fixed mean.
 * @throws RangeError for σ ≤ 0, ν ≤ 0, α outside (0, 1) or ℓ < 1
 */
export function upperVerificationLimit(claim: number, df: number, alpha: number, materials: number): number {
  if (!(claim > 0) || !(df > 0) || !(alpha > 0 && alpha < 1) || !(materials >= 1)) {
    throw new RangeError('upperVerificationLimit requires σ > 0, ν > 0, 0 < α < 1 and ℓ ≥ 1');
  }
  return claim * Math.sqrt(jStat.chisquare.inv(1 - alpha / materials, df) / df);
}

/**
 * The verdict of an estimate against its claim and UVL, in the claim's terms (SD against an SD claim, CV %
 * against a CV claim): 'verified' when s ≤ σ; 'consistent' when σ < s ≤ UVL (consistent with the claim);
 * 'not-verified' when s > UVL. Equality is judged with a relative allowance of 1e-12, so that an estimate
 * equal to the claim but for the last bits of binary rounding (a CV computed as 100·s/x̄) counts as equal.
 */
export function precisionVerdict(estimate: number, claim: number, uvl: number): PrecisionVerdict {
  const within = (value: number, limit: number): boolean => value <= limit + 1e-12 * Math.abs(limit);
  if (within(estimate, claim)) return 'verified';
  if (within(estimate, uvl)) return 'consistent';
  return 'not-verified';
}

/**
 * Judges one precision component against its claim: picks the SD or the CV as the claim is given, computes
 * the UVL (upperVerificationLimit) in those terms and the verdict (precisionVerdict).
 */
export function verifyPrecisionClaim(
  component: { sd: number; cv: number; df: number },
  claim: number, as: 'sd' | 'cv', alpha: number, materials: number,
): { estimate: number; uvl: number; verdict: PrecisionVerdict } {
  const estimate = as === 'sd' ? component.sd : component.cv;
  const uvl = upperVerificationLimit(claim, component.df, alpha, materials);
  return { estimate, uvl, verdict: precisionVerdict(estimate, claim, uvl) };
}
