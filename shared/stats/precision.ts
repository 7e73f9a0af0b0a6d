/**
 * Reported precision of the inputs, so that ties are judged as a laboratory would judge them:
 * 5.2 − 4.9 and 0.3 are the same difference, although in binary floating point
 * 5.2 − 4.9 = 0.30000000000000027. The number of decimals of a value is read from its shortest
 * round-trip decimal form (ECMAScript Number.prototype.toString), e.g. 4.90 typed as "4.90" arrives as 4.9.
 */
export function decimalsOf(value: number): number {
  if (!Number.isFinite(value)) return 0;
  const text = String(value);
  const exponent = text.indexOf('e');
  const mantissa = exponent >= 0 ? text.slice(0, exponent) : text;
  const shift = exponent >= 0 ? -Number(text.slice(exponent + 1)) : 0;
  const dot = mantissa.indexOf('.');
  return Math.max(0, (dot >= 0 ? mantissa.length - dot - 1 : 0) + shift);
}

/** The largest number of decimals among the values (capped at 15). */
export function reportedDecimals(values: ArrayLike<number>): number {
  let decimals = 0;
  for (let i = 0; i < values.length; i++) decimals = Math.max(decimals, decimalsOf(values[i]));
  return Math.min(15, decimals);
}

/** Rounds to a number of decimals, half away from zero, by way of the decimal string (no binary drift). */
export function roundTo(value: number, decimals: number): number {
  if (!Number.isFinite(value)) return value;
  const rounded = Number(Math.abs(value).toFixed(decimals));
  return value < 0 ? -rounded : rounded;
}

/** Rounds to 12 significant digits: used for ratios (percent differences), which have no reported decimals. */
export function roundSignificant(value: number, digits = 12): number {
  return value === 0 || !Number.isFinite(value) ? value : Number(value.toPrecision(digits));
}
