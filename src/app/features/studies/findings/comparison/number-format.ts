import type { Interval } from './engine-types';

const MINUS = '\u2212';

/** A number with a fixed number of decimals and a true minus sign; "—" when there is none. */
export function formatNumber(value: number | null | undefined, decimals: number): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const text = value.toFixed(decimals);
  const zero = Number(text) === 0;
  return zero ? text.replace('-', '') : text.replace('-', MINUS);
}

/** A confidence interval: "−0.12 to 0.31"; "not available" when it could not be formed. */
export function formatCi(ci: Interval | null | undefined, decimals: number): string {
  if (!ci) return 'not available';
  return `${formatNumber(ci[0], decimals)} to ${formatNumber(ci[1], decimals)}`;
}

/** A p-value: three decimals, or "< 0.001"; "—" when the test was not run. */
export function formatP(p: number | null | undefined): string {
  if (p === null || p === undefined || !Number.isFinite(p)) return '—';
  return p < 0.001 ? '< 0.001' : p.toFixed(3);
}

/** A confidence level as a percentage label: 0.95 → "95%". */
export function levelLabel(level: number): string {
  return `${Number((level * 100).toFixed(1))}%`;
}
