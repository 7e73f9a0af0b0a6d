import type { ProgressFn } from './bootstrap';
import { progressSpan } from './bootstrap';
import type { ResolvedComparisonOptions } from './comparison-options';
import type { ComparisonCore, ComparisonRegression, DecisionLevelResult, Estimate } from './comparison-types';
import { allowableBiasAt, verdict } from './decision-levels';
import { differenceBias, type DifferenceBias } from './difference-bias';
import { bcaFallbackWarning } from './bootstrap-estimate';
import { pairedDifferences, type PairedDifferences } from './differences';
import { pearson } from './correlation';
import { judgedInterval, narrowerThanStep } from './resolution';
import { regression, type RegressionResult } from './regression';
import { streamFor } from './rng';

const NONE: Estimate = { estimate: NaN, ci: null };

/** What the core run produced, beside the summary the result shows. */
export interface CoreRun {
  core: ComparisonCore;
  paired: PairedDifferences;
  bias: DifferenceBias | null;
  warnings: string[];
}

/**
 * The main estimates of a comparison on the given pairs: bias and agreement (difference-bias.ts),
 * regression with decision-level biases (regression.ts). A part that cannot be estimated is null
 * (estimates NaN → null in JSON) with a warning saying why; the rest is still reported.
 */
export function comparisonCore(x: Float64Array, y: Float64Array, o: ResolvedComparisonOptions, step: number, onProgress?: ProgressFn): CoreRun {
  const warnings: string[] = [];
  const n = x.length;
  const paired = pairedDifferences(x, y, o.difference);
  let bias: DifferenceBias | null = null;
  if (n >= 3) {
    bias = differenceBias(paired.differences, { ...o, onProgress: progressSpan(onProgress, 0, 0.6) });
    warnings.push(...bias.warnings);
  } else warnings.push(`Bias, SD and limits of agreement need at least 3 pairs (have ${n}); they are not estimated.`);
  const reg = fitRegression(x, y, o, warnings, progressSpan(onProgress, 0.6, 1));
  const core: ComparisonCore = {
    n,
    bias: {
      mean: bias ? { estimate: bias.mean.estimate, ci: bias.mean.ci, pValue: bias.mean.pValue, se: bias.mean.se } : { ...NONE, pValue: null, se: null },
      median: bias ? { estimate: bias.median.estimate, ci: bias.median.ci, pValue: bias.median.pValue, se: bias.median.se } : { ...NONE, pValue: null, se: null },
    },
    sd: bias ? pick(bias.sd) : NONE,
    limitsOfAgreement: { multiplier: o.loaMultiplier, lower: bias ? pick(bias.lower) : NONE, upper: bias ? pick(bias.upper) : NONE },
    regression: regressionSummary(reg, o, pearson(x, y)),
    decisionLevels: decisionLevels(reg, o, step),
  };
  return { core, paired, bias, warnings };
}

function pick(e: Estimate): Estimate {
  return { estimate: e.estimate, ci: e.ci };
}

function fitRegression(x: Float64Array, y: Float64Array, o: ResolvedComparisonOptions, warnings: string[], onProgress?: ProgressFn): RegressionResult | null {
  if (x.length < 3) {
    warnings.push(`Regression needs at least 3 pairs (have ${x.length}); it is not estimated.`);
    return null;
  }
  if (x.every((v) => v === x[0])) {
    warnings.push('Regression is not estimated: the comparative values (x) have no spread.');
    return null;
  }
  if (o.regression === 'weighted-deming' && !x.every((v, i) => v + y[i] > 0)) {
    warnings.push('Weighted Deming needs positive concentrations (weights 1/concentration²); regression is not estimated.');
    return null;
  }
  try {
    const result = regression(x, y, {
      method: o.regression, lambda: o.demingRatio, level: o.level, interval: o.interval, ciMethod: o.regressionCi,
      decisionLevels: o.decisionLevels,
      settings: { resamples: o.regressionResamples, stream: streamFor(o.seed, 'regression'), onProgress },
    });
    if (result.undefinedResamples > 0) warnings.push(`${result.undefinedResamples} regression resamples had no defined line and were left out of the CIs.`);
    if (result.bcaFailed.length > 0) warnings.push(bcaFallbackWarning(result.bcaFailed)!);
    return result;
  } catch (error) {
    if (!(error instanceof RangeError)) throw error;
    warnings.push(`Regression is not estimated: ${error.message}.`);
    return null;
  }
}

function regressionSummary(reg: RegressionResult | null, o: ResolvedComparisonOptions, r: number | null): ComparisonRegression {
  const isDeming = o.regression === 'deming' || o.regression === 'weighted-deming';
  return {
    method: o.regression,
    demingRatio: isDeming ? o.demingRatio : null,
    slope: reg ? reg.slope : NONE,
    intercept: reg ? reg.intercept : NONE,
    linearityP: reg ? reg.linearityP : null,
    ciMethod: reg ? reg.ciMethod : null,
    correlation: r,
    band: reg ? reg.band : null,
  };
}

/**
 * Verdicts at the decision levels. Where the bias CI is narrower than the reporting step, the verdict is
 * judged on the estimate ± step/2 joined with the CI (resolution.ts), and `judgedOn` says so.
 */
function decisionLevels(reg: RegressionResult | null, o: ResolvedComparisonOptions, step: number): DecisionLevelResult[] {
  return o.decisionLevels.map((level, k) => {
    const bias = reg ? reg.decisionLevelBias[k] : NONE;
    const allowable = allowableBiasAt(level, o.allowableBias, o.allowableBiasPercent);
    const judgedOn = bias.ci && bias.estimate !== null && Number.isFinite(bias.estimate) && narrowerThanStep(bias.ci, step) ? judgedInterval(bias.estimate, bias.ci, step) : null;
    return {
      level,
      bias,
      biasPercent: level !== 0 && bias.estimate !== null && Number.isFinite(bias.estimate) ? (100 * bias.estimate) / level : null,
      allowable,
      verdict: verdict(judgedOn ?? bias.ci, allowable),
      judgedOn,
    };
  });
}
