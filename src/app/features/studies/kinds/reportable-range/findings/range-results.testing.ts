import { analyzeReportableRange } from '@shared/stats/analyze-reportable-range';
import type { RangeOptions, RangeResult } from '@shared/stats/reportable-range-types';

/**
 * Results of invented reportable-range studies for the client's tests, made by the real engine (shared/stats) so the
 * panel is tested on what the server would hand it, never on JSON written by hand. The browser itself runs no engine:
 * only these tests import it.
 */

/** Rows of a study: each level's results in replicate order. */
function rows(values: readonly (readonly number[])[], names: readonly string[]) {
  return values.flatMap((vs, i) => vs.map((value, j) => ({ level: names[i], replicate: j + 1, value })));
}

const ASSIGNED = [2, 8, 14, 20, 26, 32];
const NAMES = ASSIGNED.map((_, i) => `Level ${i + 1}`);
const BASE: Partial<RangeOptions> = { claimedLow: 2, claimedHigh: 32, resamples: 1000, seed: 'client-spec', decimals: 1, unit: 'mmol/L' };

/** Glucose in mmol/L whose top level curves off: the cubic fits best and the verified range ends one level short. */
export function shortenedRange(): RangeResult {
  return analyzeReportableRange(
    rows([[2.0, 2.1], [8.1, 7.9], [14.0, 14.2], [20.1, 19.9], [25.8, 26.0], [29.6, 29.8]], NAMES),
    { ...BASE, levels: ASSIGNED.map((assigned, i) => ({ name: NAMES[i], assigned })), allowableNonlinearity: 0.8, allowableNonlinearityPercent: 3 },
  );
}

/** The same results judged against a tight goal: some levels within, one within but its CI reaching beyond, some beyond. */
export function tightRange(): RangeResult {
  return analyzeReportableRange(
    rows([[2.0, 2.1], [8.1, 7.9], [14.0, 14.2], [20.1, 19.9], [25.8, 26.0], [29.6, 29.8]], NAMES),
    { ...BASE, levels: ASSIGNED.map((assigned, i) => ({ name: NAMES[i], assigned })), allowableNonlinearity: 0.4, allowableNonlinearityPercent: 2 },
  );
}

/** Straight results: no higher degree's top coefficient differs from 0, so the straight line fits best and every level is within. */
export function straightRange(): RangeResult {
  return analyzeReportableRange(
    rows([[2.0, 2.1], [8.1, 7.9], [14.0, 14.1], [20.1, 19.9], [26.0, 26.1], [31.9, 32.1]], NAMES),
    { ...BASE, levels: ASSIGNED.map((assigned, i) => ({ name: NAMES[i], assigned })), allowableNonlinearity: 0.5 },
  );
}

/** Five mixtures given as fractions of the high pool without the pools' values: drawn against the fraction, no recovery. */
export function fractionRange(): RangeResult {
  const names = ['Low pool', 'Mix 1', 'Mix 2', 'Mix 3', 'High pool'];
  return analyzeReportableRange(
    rows([[1.9, 2.0, 2.1], [9.6, 9.5, 9.7], [17.1, 17.0, 17.3], [24.6, 24.4, 24.5], [31.7, 31.9, 31.8]], names),
    { ...BASE, claimedLow: null, claimedHigh: null, levels: [0, 0.25, 0.5, 0.75, 1].map((fraction, i) => ({ name: names[i], fraction })), allowableNonlinearityPercent: 5 },
  );
}
