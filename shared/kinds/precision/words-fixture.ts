import type { PrecisionMaterialResult, PrecisionResult } from '../../stats/precision-types';

/**
 * A small hand-made precision result for the specs of the precision wording (words.spec.ts here) and of the
 * client's Findings panel (not engine output: the SDs, CVs, limits and verdicts are set by hand so that each
 * verdict and each wording case appears once). Glucose-like numbers in mmol/L, reported with 2 decimals;
 * 3 days × 3 replicates a material. Test data only: nothing but specs imports it.
 */
export const LEVEL_1: PrecisionMaterialResult = {
  name: 'Level 1',
  n: 9,
  days: 3,
  mean: 5.443333,
  anova: { msBetween: 0.0079, msWithin: 0.0004, dfBetween: 2, dfWithin: 6, n0: 3, balanced: true },
  byDay: [
    { day: '2026-03-02', values: [5.41, 5.45, 5.43], mean: 5.43 },
    { day: '2026-03-03', values: [5.5, 5.52, 5.48], mean: 5.5 },
    { day: '2026-03-04', values: [5.38, 5.4, 5.42], mean: 5.4 },
  ],
  repeatability: { sd: 0.0523, cv: 0.961, df: 6, ci: { lower: 0.0337, upper: 0.1152 } },
  betweenDay: { sd: 0.0502, cv: 0.922 },
  withinLab: { sd: 0.0871, cv: 1.6, df: 3.27, ci: { lower: 0.0497, upper: 0.2869 } },
  claims: { repeatability: 0.06, withinLab: 0.08, as: 'sd' },
  uvl: { repeatability: 0.0899, withinLab: 0.1106 },
  verdicts: { repeatability: 'verified', withinLab: 'consistent' },
  trueness: null,
  outliers: [],
  notes: [],
};

export const LEVEL_2: PrecisionMaterialResult = {
  name: 'Level 2',
  n: 9,
  days: 3,
  mean: 11.85,
  anova: { msBetween: 0.21, msWithin: 0.083, dfBetween: 2, dfWithin: 5, n0: 2.89, balanced: false },
  byDay: [
    { day: '1', values: [11.6, 11.9, 11.8], mean: 11.766667 },
    { day: '2', values: [12.2, 11.9, 12.0, 11.9], mean: 12.0 },
    { day: '3', values: [11.7, 11.6], mean: 11.65 },
  ],
  repeatability: { sd: 0.2879, cv: 2.43, df: 6, ci: { lower: 0.1856, upper: 0.634 } },
  betweenDay: { sd: 0.2096, cv: 1.769 },
  withinLab: { sd: 0.4029, cv: 3.4, df: 7.54, ci: { lower: 0.2691, upper: 0.8102 } },
  claims: { repeatability: 2, withinLab: 3, as: 'cv' },
  uvl: { repeatability: 2.41, withinLab: 3.6 },
  verdicts: { repeatability: 'not-verified', withinLab: 'consistent' },
  trueness: {
    assigned: 12, uncertainty: 0.1, source: 'Control insert, lot 4471', bias: -0.15, biasPercent: -1.27, se: 0.1399, seDf: 2.37, df: 7.54, multiplier: 2.943,
    interval: { lower: 11.62, upper: 12.38 }, verdict: 'verified',
  },
  outliers: [{ position: 14, day: '2', replicate: 1, value: 12.2, why: 'More than 5.5 repeatability SDs from the day mean' }],
  notes: ['Unbalanced design: the days have 2 to 4 results.'],
};

export function precisionResult(materials: PrecisionMaterialResult[] = [LEVEL_1, LEVEL_2]): PrecisionResult {
  return {
    kind: 'precision',
    materials,
    alpha: 0.05,
    materialsTested: materials.length,
    excludedCount: 1,
    warnings: ['Fewer days than planned: 3 of 5.'],
    caution: "Decision support only: final acceptance follows local accreditation rules and the laboratory director's professional judgement.",
    engine: { version: '1.3.0', seed: 'p-1', resamples: 0, generator: 'xoshiro128**' },
    resolution: { increment: 0.01, source: 'analyte', limitedEstimates: [] },
  };
}
