import { planComparison, type ComparisonPlanOptions, type ComparisonPlanResult } from '@shared/stats/plan-comparison';

/**
 * Plan runs of invented glucose comparisons for the client's tests, made by the real engine (shared/stats) so the panel
 * is tested on what the server would hand it, never on JSON written by hand. Small (100 simulated studies of 100
 * resamples) so they take a moment. The browser itself runs no simulation: only these tests import it.
 */
const BASE: ComparisonPlanOptions = {
  errorModel: 'proportional', regression: 'deming', demingRatio: 1, n: [10, 20], simulations: 100, resamples: 100, seed: 'client-spec', decimals: 2,
};

/** Precise methods over a wide range against a 10% goal at 7 mmol/L: 20 specimens meet both targets. */
export const recommendingPlan = (): ComparisonPlanResult =>
  planComparison({ ...BASE, cvComparative: 0.5, cvCandidate: 0.5, low: 2, high: 20, decisionLevels: [7], allowableBiasPercent: 10 });

/** Imprecise methods over a narrow range against a 1% goal: no n on the grid will do. */
export const hopelessPlan = (): ComparisonPlanResult =>
  planComparison({ ...BASE, cvComparative: 5, cvCandidate: 5, low: 5, high: 9, decisionLevels: [7], allowableBiasPercent: 1 });
