/** The percentiles a laboratory may choose: a two-sided interval, or one limit (one above 50 is an upper limit). */
export const PERCENTILE_CHOICES: { value: number[]; label: string }[] = [
  { value: [2.5, 97.5], label: '2.5th and 97.5th (central 95%)' },
  { value: [0.5, 99.5], label: '0.5th and 99.5th (central 99%)' },
  { value: [5, 95], label: '5th and 95th (central 90%)' },
  { value: [97.5], label: '97.5th only (upper limit)' },
  { value: [99], label: '99th only (upper limit, e.g. cardiac troponin)' },
  { value: [95], label: '95th only (upper limit)' },
  { value: [2.5], label: '2.5th only (lower limit)' },
];

/** mat-select's compareWith for arrays of percentiles. */
export function samePercentiles(a: readonly number[] | null, b: readonly number[] | null): boolean {
  return !!a && !!b && a.length === b.length && a.every((v, i) => v === b[i]);
}

/** "2.5th–97.5th percentile" or "99th percentile (one-sided upper)". */
export function percentileWords(percentiles: readonly number[]): string {
  if (percentiles.length === 2) return `${percentiles[0]}th–${percentiles[1]}th percentiles`;
  const p = percentiles[0];
  return `${p}th percentile (one-sided ${p > 50 ? 'upper' : 'lower'} limit)`;
}
