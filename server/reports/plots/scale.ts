import { num } from '../format';

/** A linear map from data to page coordinates, with "nice" tick values (steps of 1, 2, 2.5 or 5 × 10^k). */
export interface Axis {
  min: number;
  max: number;
  ticks: number[];
  /** Decimals that print every tick exactly. */
  decimals: number;
}

export function niceAxis(lo: number, hi: number, count = 5): Axis {
  if (!Number.isFinite(lo) || !Number.isFinite(hi)) return niceAxis(0, 1, count);
  if (hi - lo < 1e-12) {
    const half = Math.abs(lo) > 0 ? Math.abs(lo) * 0.05 : 0.5;
    return niceAxis(lo - half, hi + half, count);
  }
  const raw = (hi - lo) / count;
  const power = Math.pow(10, Math.floor(Math.log10(raw)));
  const step = [1, 2, 2.5, 5, 10].map((m) => m * power).find((s) => s >= raw) ?? 10 * power;
  const min = Math.floor(lo / step + 1e-9) * step;
  const max = Math.ceil(hi / step - 1e-9) * step;
  const ticks: number[] = [];
  const steps = Math.round((max - min) / step);
  for (let i = 0; i <= steps; i++) {
    const t = Number((min + i * step).toPrecision(12));
    ticks.push(t === 0 ? 0 : t);
  }
  const decimals = Math.max(0, -Math.floor(Math.log10(step) + 1e-9) + (step / power === 2.5 ? 1 : 0));
  return { min, max, ticks, decimals };
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
