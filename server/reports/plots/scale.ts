import { niceAxis as sharedNiceAxis, paddedAxis as sharedPaddedAxis } from '@shared/types/plot-axes';
import { num } from '../format';

/**
 * A linear map from data to page coordinates, with "nice" tick values (steps of 1, 2, 2.5 or 5 × 10^k). The
 * ticks and the padding come from shared/types/plot-axes.ts, as the plots of the findings page take them.
 */
export interface Axis {
  min: number;
  max: number;
  ticks: number[];
  /** Decimals that print every tick exactly. */
  decimals: number;
}

/** Ticks over [lo, hi]; with a reporting step, never finer than it and 2.5 × 10^k only where it can be written. */
export function niceAxis(lo: number, hi: number, count = 5, resolution?: number | null): Axis {
  return sharedNiceAxis(lo, hi, { count, resolution });
}

/** An axis over the values padded on both sides, so no extreme point sits on the frame. */
export function paddedAxis(values: Iterable<number>, options: { count?: number; resolution?: number | null; share?: number } = {}): Axis {
  return sharedPaddedAxis(values, options);
}

export const tickLabel = (axis: Axis, value: number): string => num(value, axis.decimals);

/** The smallest and largest finite values, widened by a share of the span on each side. */
export function extent(values: Iterable<number>, pad = 0.04): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of values) {
    if (!Number.isFinite(v)) continue;
    lo = Math.min(lo, v);
    hi = Math.max(hi, v);
  }
  if (lo === Infinity) return [0, 1];
  const span = hi - lo;
  return [lo - span * pad, hi + span * pad];
}

export function scale(axis: Axis, from: number, to: number): (value: number) => number {
  const span = axis.max - axis.min || 1;
  return (value) => from + ((value - axis.min) / span) * (to - from);
}
