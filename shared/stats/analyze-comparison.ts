import { progressSpan, type ProgressFn } from './bootstrap';
import { comparisonCore } from './comparison-core';
import { resolveComparisonOptions, type ComparisonOptions } from './comparison-options';
import { CAUTION, DEMING_RATIO_CONVENTION, type ComparisonCore, type ComparisonResult, type ComparisonRow, type TailTest } from './comparison-types';
import { comparisonWarnings } from './comparison-warnings';
import { engineInfo } from './engine';
import { defaultEsdMax, generalizedEsd } from './generalized-esd';
import { jsonClean } from './json-clean';
import { signTest } from './sign-test';
import type { ShiftedNullTest } from './shifted-null-test';
import { wilcoxonSignedRank } from './wilcoxon';
import { splitRows } from './comparison-rows';
import type { Interval } from './confidence-interval';
import type { DifferenceType } from './differences';
import { median } from './quantile';
import { narrowerThanStep, resolutionStep, type ComparisonResolution } from './resolution';

/**
 * The warning for flagged differences: "Generalized ESD flags 1 possible outlier in the differences (row 7); …".
 * (shared/stats imports nothing from outside itself, so it words its one plural here instead of using shared/types/plural.)
 */
function outlierWarning(indexes: readonly number[]): string {
  const one = indexes.length === 1;
  const rows = indexes.map((i) => i + 1).join(', ');
  return `Generalized ESD flags ${indexes.length} possible ${one ? 'outlier' : 'outliers'} in the differences (${one ? 'row' : 'rows'} ${rows}); exclude only with a documented reason.`;
}

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
  const step = resolutionStep([split.allX, split.allY], o.decimals);
  const main = comparisonCore(split.x, split.y, o, step.increment, progressSpan(onProgress, 0, hasExcluded ? 0.8 : 1));
  const d = main.paired.differences;
  const esdMax = o.esdMax ?? defaultEsdMax(d.length);
  const esd = d.length >= 4 ? generalizedEsd(d, o.esdAlpha, esdMax) : { outliers: [], steps: [] };
  const outlierIndexes = esd.outliers.map((k) => split.index[k]).sort((a, b) => a - b);
  const warnings = [...main.warnings, ...comparisonWarnings({
    n: d.length, x: split.x, means: main.paired.means, differences: d, differenceType: o.difference, r: main.core.regression.correlation,
  })];
  if (d.length < 4) warnings.push('The outlier test needs at least 4 pairs; no outliers are flagged.');
  if (outlierIndexes.length > 0) warnings.push(outlierWarning(outlierIndexes));
  const sensitivity = hasExcluded
    ? { ...comparisonCore(split.allX, split.allY, o, step.increment, progressSpan(onProgress, 0.8, 1)).core, includesExcluded: true as const, excludedCount: split.excluded.length }
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
      medianNull: main.bias?.medianTest ? { ...main.bias.medianTest.nullDistribution, nullValue: 0 } : null,
    },
    sensitivity,
    settings: { ...o, demingRatioConvention: DEMING_RATIO_CONVENTION },
    resolution: comparisonResolution(main.core, step, split.x, main.paired.means, o.difference),
    warnings,
    caution: CAUTION,
    engine: engineInfo(o.seed, o.resamples, o.regressionResamples),
  };
  return jsonClean(result);
}

/**
 * The resolution of a comparison: the step h of the results, of a difference (h, or 100·h/median |pair mean|
 * for percent differences) and of the slope (h over the comparative range), and the estimates whose CI is
 * narrower than the step in its own unit.
 */
function comparisonResolution(
  core: ComparisonCore, step: { increment: number; source: 'analyte' | 'data' }, x: Float64Array, means: Float64Array, type: DifferenceType,
): ComparisonResolution {
  const h = step.increment;
  const typical = means.length ? median(Array.from(means, Math.abs)) : NaN;
  const differenceIncrement = type === 'absolute' ? h : typical > 0 ? (100 * h) / typical : NaN;
  let min = Infinity;
  let max = -Infinity;
  for (const v of x) { if (v < min) min = v; if (v > max) max = v; }
  const slopeIncrement = max > min ? h / (max - min) : null;
  const checks: [string, Interval | null, number | null][] = [
    ['bias.median', core.bias.median.ci, differenceIncrement],
    ['bias.mean', core.bias.mean.ci, differenceIncrement],
    ['sd', core.sd.ci, differenceIncrement],
    ['limitsOfAgreement.lower', core.limitsOfAgreement.lower.ci, differenceIncrement],
    ['limitsOfAgreement.upper', core.limitsOfAgreement.upper.ci, differenceIncrement],
    ['regression.slope', core.regression.slope.ci, slopeIncrement],
    ['regression.intercept', core.regression.intercept.ci, h],
    ...core.decisionLevels.map((d, k): [string, Interval | null, number] => [`decisionLevels.${k}`, d.bias.ci, h]),
  ];
  const limitedEstimates = checks.filter(([, ci, unit]) => narrowerThanStep(ci, unit)).map(([name]) => name);
  return { ...step, limitedEstimates, differenceIncrement, slopeIncrement };
}

function tail(test: ShiftedNullTest | null | undefined): TailTest | null {
  return test ? { observed: test.observed, nullValue: test.nullValue, pValue: test.pValue, upperTail: test.upperTail, lowerTail: test.lowerTail } : null;
}
