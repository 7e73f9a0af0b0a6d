/**
 * Harris & Boyd test for partitioning reference values between two subgroups (E. K. Harris and J. C. Boyd
 * (1990), "On dividing reference data into subgroups to produce separate reference ranges", Clin. Chem.
 * 36(2), 265–270):
 *   z = |x̄₁ − x̄₂| / sqrt(s₁²/n₁ + s₂²/n₂)  (SDs with divisor n − 1),
 *   partition when z > z* = 3·sqrt(n̄/120), n̄ = (n₁ + n₂)/2, the mean subgroup size,
 *   and also when the larger SD exceeds 1.5 times the smaller.
 * Constants used: 3 and 1.5 (other authors use other constants; these are the ones stated here).
 * A subgroup with no spread (SD 0, every value equal) is still tested: its SD ratio is infinite (so
 * partitioning is recommended) unless both have SD 0, when the ratio is 1 and z is infinite for different
 * means, 0 for equal ones. Infinite z or ratio reads as null in JSON results.
 */
export interface GroupSummary {
  group: string;
  n: number;
  mean: number;
  sd: number;
}

export interface HarrisBoyd {
  groups: [string, string];
  z: number;
  zCritical: number;
  sdRatio: number;
  recommended: boolean;
}

export const HARRIS_BOYD_CONSTANT = 3;
export const SD_RATIO_LIMIT = 1.5;

export function harrisBoyd(a: GroupSummary, b: GroupSummary): HarrisBoyd {
  if (a.n < 2 || b.n < 2) throw new RangeError('harrisBoyd requires at least 2 values in each subgroup');
  const difference = Math.abs(a.mean - b.mean);
  const se = Math.sqrt((a.sd * a.sd) / a.n + (b.sd * b.sd) / b.n);
  const z = se > 0 ? difference / se : difference === 0 ? 0 : Infinity;
  const zCritical = HARRIS_BOYD_CONSTANT * Math.sqrt((a.n + b.n) / 2 / 120);
  const larger = Math.max(a.sd, b.sd);
  const smaller = Math.min(a.sd, b.sd);
  const sdRatio = smaller > 0 ? larger / smaller : larger > 0 ? Infinity : 1;
  return { groups: [a.group, b.group], z, zCritical, sdRatio, recommended: z > zCritical || sdRatio > SD_RATIO_LIMIT };
}
