import type { Interval } from './confidence-interval';

/**
 * Verdict of a predicted bias at a medical decision level Xc against the allowable bias there.
 * Allowable bias at Xc: the absolute limit A, the percentage P of Xc, or, when both are given, whichever is
 * greater (the "A or P%, whichever is greater" form of proficiency-testing limits; a laboratory policy).
 *   within:       the whole CI inside [−allowable, +allowable]
 *   exceeds:      the whole CI outside it (entirely above +allowable or entirely below −allowable)
 *   inconclusive: the CI crosses a limit
 * Null when no allowable bias is given or the CI is not available.
 */
export type Verdict = 'within' | 'inconclusive' | 'exceeds';

export function allowableBiasAt(level: number, absolute: number | null, percent: number | null): number | null {
  const fromPercent = percent === null ? null : (Math.abs(level) * percent) / 100;
  if (absolute === null) return fromPercent;
  if (fromPercent === null) return absolute;
  return Math.max(absolute, fromPercent);
}

export function verdict(ci: Interval | null, allowable: number | null): Verdict | null {
  if (!ci || allowable === null) return null;
  const [lo, hi] = ci;
  if (lo >= -allowable && hi <= allowable) return 'within';
  if (lo > allowable || hi < -allowable) return 'exceeds';
  return 'inconclusive';
}
