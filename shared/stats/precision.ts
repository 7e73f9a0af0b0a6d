/**
 * Reported precision of the inputs, so that ties are judged as a laboratory would judge them:
 * 5.2 − 4.9 and 0.3 are the same difference, although in binary floating point
 * 5.2 − 4.9 = 0.30000000000000027. The number of decimals of a value is read from its shortest
 * round-trip decimal form (ECMAScript Number.prototype.toString), e.g. 4.90 typed as "4.90" arrives as 4.9.
 */
export function decimalsOf(value: number): number {
  return Math.max(0, decimalPlace(value));
}

/**
 * The place of the last non-zero digit of the shortest round-trip form: 2 for 4.25, 0 for 141, −1 for 140,
 * 15 for 1.2e-14, −19 for 1.2e+20; −∞ for 0 (no digit) and for non-finite values.
 */
export function decimalPlace(value: number): number {
  if (!Number.isFinite(value) || value === 0) return -Infinity;
  const text = String(Math.abs(value));
  const exponent = text.indexOf('e');
  const mantissa = exponent >= 0 ? text.slice(0, exponent) : text;
  const shift = exponent >= 0 ? -Number(text.slice(exponent + 1)) : 0;
  const dot = mantissa.indexOf('.');
  if (dot >= 0) return mantissa.length - dot - 1 + shift;
  let zeros = 0;
  while (mantissa[mantissa.length - 1 - zeros] === '0') zeros++;
  return shift - zeros;
}

/**
 * The largest number of decimals among the values. Not capped: values of 1e-13 carry 14 or more decimals,
 * and their differences must keep them (precision is relative to the data's magnitude).
 */
export function reportedDecimals(values: ArrayLike<number>): number {
  let decimals = 0;
  for (let i = 0; i < values.length; i++) decimals = Math.max(decimals, decimalsOf(values[i]));
  return decimals;
}

/**
 * Rounds to a number of decimals (negative: to tens, hundreds, ...), half away from zero, by way of the
 * decimal string (no binary drift). A place finer than the 17 significant digits a double holds leaves
 * the value as it is; a value below half a step rounds to 0.
 */
export function roundTo(value: number, decimals: number): number {
  if (!Number.isFinite(value) || value === 0) return value;
  const size = Math.abs(value);
  const digits = decimals + Math.floor(Math.log10(size)) + 1;
  if (digits > 17) return value;
  let rounded: number;
  if (decimals >= 0 && decimals <= 100 && size < 1e21) rounded = Number(size.toFixed(decimals));
  else if (digits >= 1) rounded = Number(size.toPrecision(digits));
  else rounded = size >= 0.5 * Number(`1e${-decimals}`) ? Number(`1e${-decimals}`) : 0;
  return value < 0 ? -rounded : rounded;
}

/** Rounds to 12 significant digits: used for ratios (percent differences), which have no reported decimals. */
export function roundSignificant(value: number, digits = 12): number {
  return value === 0 || !Number.isFinite(value) ? value : Number(value.toPrecision(digits));
}
