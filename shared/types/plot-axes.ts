import { resolutionStep } from '../stats/resolution';

/**
 * Axes and bins the plots of the findings and of the PDF share, so a page and its printed report draw the
 * same picture: axes padded so no extreme point sits on (or past) the edge, "nice" ticks (steps of 1, 2 or 5
 * × 10^k, and 2.5 × 10^k only where the data carry the decimals to write it), and histogram bins whose
 * edges fall half-way between reportable values, so results reported in whole steps never land on an edge.
 * Drawing only: nothing here is an estimate.
 */

/** A linear axis: its ends, the step between ticks, the ticks, and the decimals that write every tick exactly. */
export interface PlotAxis {
  min: number;
  max: number;
  step: number;
  ticks: number[];
  decimals: number;
}

/** How many decimals write a step exactly: 0.5 → 1, 0.25 → 2, 10 → 0, 1e-3 → 3. */
export function stepDecimals(step: number): number {
  if (!(step > 0) || !Number.isFinite(step)) return 0;
  for (let d = 0; d <= 12; d++) {
    const scaled = step * 10 ** d;
    if (Math.abs(scaled - Math.round(scaled)) < 1e-9 * Math.max(1, scaled)) return d;
  }
  return 12;
}

/** Rounds away binary drift (0.1 × 3 = 0.30000000000000004 → 0.3) and turns −0 into 0. */
export function clean(value: number): number {
  const v = Number(value.toPrecision(12));
  return v === 0 ? 0 : v;
}

/**
 * Ticks over [lo, hi]: about `count` intervals of a nice step; the axis ends are the ticks at or beyond lo and
 * hi. With a reporting step (`resolution`), the tick step is never finer than it, and 2.5 × 10^k is used only
 * when the data carry that many decimals (whole-number data get ticks at 130, 135, 140, not 132.5).
 */
export function niceAxis(lo: number, hi: number, options: { count?: number; resolution?: number | null } = {}): PlotAxis {
  const count = options.count ?? 5;
  if (!Number.isFinite(lo) || !Number.isFinite(hi)) return niceAxis(0, 1, options);
  if (lo > hi) [lo, hi] = [hi, lo];
  if (hi - lo < 1e-12 * Math.max(1, Math.abs(lo))) {
    const half = Math.abs(lo) > 0 ? Math.abs(lo) * 0.05 : 0.5;
    return niceAxis(lo - half, hi + half, options);
  }
  const resolution = options.resolution && options.resolution > 0 ? options.resolution : null;
  const raw = (hi - lo) / count;
  const power = 10 ** Math.floor(Math.log10(raw));
  const writable = (m: number): boolean => resolution === null || stepDecimals(m * power) <= stepDecimals(resolution);
  const factors = [1, 2, 2.5, 5, 10].filter((m) => m !== 2.5 || writable(m));
  let step = factors.map((m) => m * power).find((s) => s >= raw * (1 - 1e-9)) ?? 10 * power;
  if (resolution !== null && step < resolution) step = resolution;
  step = clean(step);
  const min = clean(Math.floor(lo / step + 1e-9) * step);
  const max = clean(Math.ceil(hi / step - 1e-9) * step);
  const ticks: number[] = [];
  const steps = Math.round((max - min) / step);
  for (let i = 0; i <= steps; i++) ticks.push(clean(min + i * step));
  return { min, max, step, ticks, decimals: stepDecimals(step) };
}

/**
 * The smallest and largest finite values widened by `share` of their span on each side (at least `least` in
 * data units, and something when every value is the same), so the extreme points sit inside the plot.
 */
export function paddedDomain(values: Iterable<number>, options: { share?: number; least?: number } = {}): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of values) {
    if (!Number.isFinite(v)) continue;
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  if (lo === Infinity) return [0, 1];
  const span = hi - lo;
  const base = span > 0 ? span : Math.abs(lo) > 0 ? Math.abs(lo) : 1;
  const pad = Math.max(base * (options.share ?? 0.05), options.least ?? 0);
  return [lo - pad, hi + pad];
}

/** A padded axis with nice ticks over the values (points, lines and bands alike): every value lies strictly inside. */
export function paddedAxis(values: Iterable<number>, options: { count?: number; resolution?: number | null; share?: number; least?: number } = {}): PlotAxis {
  const [lo, hi] = paddedDomain(values, options);
  return niceAxis(lo, hi, options);
}

/** One histogram bin, [from, to), and how many values it holds. */
export interface ValueBin {
  from: number;
  to: number;
  count: number;
}

/** A bin count that suits n values: about √n, between 8 and 30. */
export function binTarget(n: number): number {
  return Math.min(30, Math.max(8, Math.round(Math.sqrt(n))));
}

/** The reporting step of the values when none is known: the finest decimal place they carry (4.1 → 0.1; 140 → 1). */
export function dataStep(values: readonly number[]): number {
  const step = resolutionStep([values]).increment;
  return step > 0 && Number.isFinite(step) ? step : 1;
}

/** Up to this many reportable values across the data, each has a bin of its own. */
export const FEW_STEPS = 20;

/** The smallest of 1, 2, 5, 10, 20, 50 … steps per bin that makes at most `target` bins of `slots` steps. */
export function binSteps(slots: number, target: number): number {
  for (let power = 1; ; power *= 10) {
    for (const f of [1, 2, 5]) if (slots / (f * power) <= Math.max(1, target)) return f * power;
  }
}

/**
 * The step h of a histogram's bins: the stated reporting step, unless the values are coarser (whole numbers under a
 * step of 0.1 would leave nine bins in ten empty), and the values' own step when none is stated.
 */
export function binStep(values: readonly number[], resolution?: number | null): number {
  const own = dataStep(values.filter(Number.isFinite));
  return resolution && resolution > 0 && Number.isFinite(resolution) ? Math.max(resolution, own) : own;
}

/**
 * A histogram of reported values as the findings page and the PDF both draw it (the one rule): its bins
 * (resolutionBins) and their step h (binStep), which is the x axis's finest tick and the unit a bar's range is
 * written in ("58 to 60": the reportable values it holds, from + h/2 to to − h/2).
 */
export function valueBins(values: readonly number[], resolution?: number | null): { step: number; bins: ValueBin[] } {
  return { step: binStep(values, resolution), bins: resolutionBins(values, resolution) };
}

/**
 * Histogram bins for reported values. Every bin is a whole number m of reporting steps h wide, and its edges
 * lie at (k + ½)·h: a value reported in steps of h is never on an edge, and every bin holds the same number
 * (m) of reportable values, so whole-number data do not pile into alternate bins as they do when an edge
 * falls on a reportable value. m is 1 when the data span at most 20 reportable values (a bar for each), else
 * the smallest of 1, 2, 5, 10, 20, 50 … that gives at most `target` bins (about √n). h is the reporting step, or the values' own when they are coarser. Bins run from the lowest
 * value to the highest with no empty bin at either end.
 */
export function resolutionBins(values: readonly number[], resolution?: number | null, target = binTarget(values.length)): ValueBin[] {
  const finite = values.filter(Number.isFinite);
  if (finite.length === 0) return [];
  const h = binStep(finite, resolution);
  let lowest = Infinity;
  let highest = -Infinity;
  for (const v of finite) {
    lowest = Math.min(lowest, v);
    highest = Math.max(highest, v);
  }
  const first = Math.round(lowest / h);
  const last = Math.round(highest / h);
  const slots = last - first + 1;
  // Few reportable values (at most 20 steps apart): one bin each. Otherwise about `target` bins.
  const m = slots <= FEW_STEPS ? 1 : binSteps(slots, target);
  // Bins start at multiples of m steps so their edges are round numbers too (49.5, 54.5 ... for m = 5).
  const start = Math.floor(first / m) * m;
  const count = Math.floor((last - start) / m) + 1;
  const counts = new Array<number>(count).fill(0);
  for (const v of finite) {
    const k = Math.floor((v / h + 0.5 - start) / m);
    counts[Math.min(count - 1, Math.max(0, k))]++;
  }
  return counts.map((n, k) => ({ from: clean((start + k * m - 0.5) * h), to: clean((start + (k + 1) * m - 0.5) * h), count: n }));
}
