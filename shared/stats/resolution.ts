import type { Interval } from './confidence-interval';
import { decimalPlace } from './precision';

/**
 * The reporting step (resolution) of the results, and which CIs are narrower than it.
 *
 * Results reported in steps h (1 mmol/L for sodium) carry a rounding error of up to ±h/2 each
 * (Sheppard, 1898; from memory). A bootstrap CI of a median, a percentile or a Passing–Bablok slope on
 * such data can collapse to one value ("1.0 to 1.0"): the CI then says nothing finer than the step.
 * Our rule (common practice, stated in the findings): an estimate whose CI is narrower than one step is
 * named in `limitedEstimates`, and a decision-level verdict is judged on an interval no narrower than the
 * estimate ± h/2.
 *
 * The step comes from the analyte's decimals when the study gives them (h = 10^−decimals, source
 * 'analyte'), otherwise from the data: the finest decimal place the values carry, read from their shortest
 * round-trip decimal form (precision.ts), so 140, 141, 139 give h = 1, 4.1, 3.95 give h = 0.01, and
 * values that are all multiples of 10 give h = 10 (source 'data'; the analyte's decimals, where set, decide).
 */
export interface Resolution {
  /** The reporting step in the unit of the results. */
  increment: number;
  source: 'analyte' | 'data';
  /**
   * The estimates whose CI is narrower than one step, as paths into the result: 'bias.median',
   * 'bias.mean', 'sd', 'limitsOfAgreement.lower', 'limitsOfAgreement.upper', 'regression.slope',
   * 'regression.intercept', 'decisionLevels.<k>' (0-based); interval kinds: 'lower', 'upper',
   * 'partitions.<p>.intervals.<g>.lower' and '.upper'. Empty for fine-grained data.
   */
  limitedEstimates: string[];
}

/** The comparison's resolution, with the steps of its differences and its slope. */
export interface ComparisonResolution extends Resolution {
  /** The step of a difference in its own unit: h for absolute differences, 100·h/median |pair mean| in %. */
  differenceIncrement: number;
  /** The slope change that moves the line by one step across the comparative range: h/(max x − min x); null without spread. */
  slopeIncrement: number | null;
}

/** 10^−decimals of the given decimals, or of the finest decimal place among the values. */
export function resolutionStep(values: ArrayLike<number>[], decimals?: number | null): { increment: number; source: 'analyte' | 'data' } {
  if (decimals !== undefined && decimals !== null) return { increment: stepOf(decimals), source: 'analyte' };
  let finest = -Infinity;
  for (const list of values) for (let i = 0; i < list.length; i++) finest = Math.max(finest, decimalPlace(list[i]));
  return { increment: Number.isFinite(finest) ? stepOf(finest) : 1, source: 'data' };
}

/** 10^−d as the nearest double of the decimal (1e-2 is 0.01, not 0.010000000000000002). */
export function stepOf(decimals: number): number {
  return Number(`1e${-decimals}`);
}

/** A CI narrower than the step: its width is less than the step (a relative 1e-9 allowed for rounding). */
export function narrowerThanStep(ci: Interval | null | undefined, step: number | null): boolean {
  if (!ci || step === null || !(step > 0)) return false;
  const [lo, hi] = ci;
  if (!Number.isFinite(lo) || !Number.isFinite(hi)) return false;
  return hi - lo < step * (1 - 1e-9);
}

/** The interval a verdict is judged on: the CI widened, where needed, to the estimate ± step/2. */
export function judgedInterval(estimate: number, ci: Interval, step: number): Interval {
  return [Math.min(ci[0], estimate - step / 2), Math.max(ci[1], estimate + step / 2)];
}
