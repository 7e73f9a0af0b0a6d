import { progressSpan, type ProgressFn } from './bootstrap';
import { comparisonCore } from './comparison-core';
import { resolveComparisonOptions, type ComparisonOptions } from './comparison-options';
import { CAUTION, DEMING_RATIO_CONVENTION, type ComparisonResult, type ComparisonRow, type TailTest } from './comparison-types';
import { comparisonWarnings } from './comparison-warnings';
import { engineInfo } from './engine';
import { defaultEsdMax, generalizedEsd } from './generalized-esd';
import { jsonClean } from './json-clean';
import { signTest } from './sign-test';
import type { ShiftedNullTest } from './shifted-null-test';
import { wilcoxonSignedRank } from './wilcoxon';
import { splitRows } from './comparison-rows';

/**
 * Method comparison of paired specimens (x = comparative, y = candidate): the whole analysis the server
 * runs in a worker and `npm run analyze -- comparison` prints. Excluded rows are left out of the main
 * run and counted; `sensitivity` repeats the main estimates with every row included.
 * Row numbers: `outliers` are 1-based data row numbers (row 1 = rows[0], the first data line of a CSV),
 * `outlierIndexes` the same rows 0-based.
 * @throws OptionError (a RangeError) naming a bad option; RangeError for a non-finite x or y
 */
export function analyzeComparison(rows: ComparisonRow[], options: ComparisonOptions = {}, onProgress?: ProgressFn): ComparisonResult {
  const o = resolveComparisonOptions(options);
  const split = splitRows(rows);
  const hasExcluded = split.excluded.length > 0;
  const main = comparisonCore(split.x, split.y, o, progressSpan(onProgress, 0, hasExcluded ? 0.8 : 1));
  const d = main.paired.differences;
  const esdMax = o.esdMax ?? defaultEsdMax(d.length);
  const esd = d.length >= 4 ? generalizedEsd(d, o.esdAlpha, esdMax) : { outliers: [], steps: [] };
  const outlierIndexes = esd.outliers.map((k) => split.index[k]).sort((a, b) => a - b);
  const warnings = [...main.warnings, ...comparisonWarnings({
    n: d.length, x: split.x, means: main.paired.means, differences: d, differenceType: o.difference, r: main.core.regression.correlation,
  })];
  if (d.length < 4) warnings.push('The outlier test needs at least 4 pairs; no outliers are flagged.');
  if (outlierIndexes.length > 0) warnings.push(`Generalized ESD flags ${outlierIndexes.length} possible outlier(s) in the differences (rows ${outlierIndexes.map((i) => i + 1).join(', ')}); exclude only with a documented reason.`);
  const sensitivity = hasExcluded
    ? { ...comparisonCore(split.allX, split.allY, o, progressSpan(onProgress, 0.8, 1)).core, includesExcluded: true as const, excludedCount: split.excluded.length }
    : null;
  const result: ComparisonResult = {
    kind: 'comparison',
    ...main.core,
    nTotal: rows.length,
    excluded: { count: split.excluded.length, rows: split.excluded },
    differenceType: o.difference,
    signTest: signTest(d),
    wilcoxon: wilcoxonSignedRank(d),
    biasTests: { median: tail(main.bias?.medianTest), mean: tail(main.bias?.meanTest) },
    outliers: outlierIndexes.map((i) => i + 1),
    outlierIndexes,
    outlierTest: { method: 'generalized ESD (Rosner 1983)', alpha: o.esdAlpha, maxOutliers: esdMax, steps: esd.steps.map((s) => ({ row: split.index[s.index] + 1, statistic: s.statistic, critical: s.critical })) },
    plots: {
      medianBias: main.bias?.distributions.median ?? null,
      meanBias: main.bias?.distributions.mean ?? null,
      medianNull: main.bias ? { ...main.bias.medianTest.nullDistribution, nullValue: 0 } : null,
    },
    sensitivity,
    settings: { ...o, demingRatioConvention: DEMING_RATIO_CONVENTION },
    warnings,
    caution: CAUTION,
    engine: engineInfo(o.seed, o.resamples, o.regressionResamples),
  };
  return jsonClean(result);
}

function tail(test: ShiftedNullTest | undefined): TailTest | null {
  return test ? { observed: test.observed, nullValue: test.nullValue, pValue: test.pValue, upperTail: test.upperTail, lowerTail: test.lowerTail } : null;
}
