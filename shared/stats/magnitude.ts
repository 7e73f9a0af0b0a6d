/**
 * The range of magnitudes the engine computes in. Squares and sums of squares of values near 1e300
 * overflow double precision (largest finite ≈ 1.8e308), and squares of values near 1e-200 underflow to 0,
 * so results would silently become null or 0. Nonzero values must lie within 1e-100 to 1e100 in magnitude:
 * squares of the values and of their spread then stay far inside the double range (1e±200), with room for
 * sums of 200,000 terms. No clinical result comes near either bound in any unit.
 */
export const SMALLEST_MAGNITUDE = 1e-100;
export const LARGEST_MAGNITUDE = 1e100;

/** Null when the value is inside the range, else the reason in words. */
export function magnitudeProblem(value: number): string | null {
  const a = Math.abs(value);
  if (a === 0 || (a >= SMALLEST_MAGNITUDE && a <= LARGEST_MAGNITUDE)) return null;
  return `${value} is outside the range the engine computes in (magnitudes 1e-100 to 1e100, or 0): squares of such values ${a > 1 ? 'overflow' : 'underflow'} double precision; express the results in another unit`;
}

/** @throws RangeError naming the 1-based row and the reason */
export function checkMagnitudes(values: ArrayLike<number>, caller: string, rowNumber: (i: number) => number = (i) => i + 1): void {
  for (let i = 0; i < values.length; i++) {
    const problem = magnitudeProblem(values[i]);
    if (problem) throw new RangeError(`${caller}: row ${rowNumber(i)}: ${problem}`);
  }
}
