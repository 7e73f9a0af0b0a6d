import { DEMING_RATIO_CONVENTION } from '@shared/stats';
import { integer, num, orDash, percent } from '../format';
import type { Layout } from '../layout';
import type { ComparisonFindings, StudyReport } from '../report-model';
import { CI_WORDS, DIFFERENCE_WORDS, REGRESSION_WORDS } from '../words';
import { plural } from '@shared/types/plural';
import { regressionCiWords } from '@shared/types/regression-words';

/**
 * How the numbers were made. The engine's resolved settings are printed when there are results (they
 * are what the numbers mean); the study's settings otherwise.
 */
/** "at most 1 outlier", "at most 3 outliers", or the engine's default when none is set. */
const maxOutliersWords = (max: number | null | undefined): string => (typeof max === 'number' ? plural(max, 'outlier') : 'the default number of outliers');

export function comparisonSettings(layout: Layout, report: StudyReport, results: ComparisonFindings | null): void {
  const s = report.settings;
  const r = results?.settings;
  const regression = r?.regression ?? s.regression;
  const isDeming = regression === 'deming' || regression === 'weighted-deming';
  const ratio = r?.demingRatio ?? s.demingRatio;
  const regressionCi = results?.regression?.ciMethod ?? (regression === 'passing-bablok' ? 'rank' : r?.regressionCi ?? 'bootstrap');
  const engine = results?.engine;
  layout.heading('Analysis settings');
  layout.keyValues([
    ['Bootstrap resamples', `${integer(r?.resamples ?? s.resamples)} for the bias; ${integer(r?.regressionResamples ?? s.regressionResamples)} for the regression`],
    ['Seed', orDash(r?.seed ?? s.seed)],
    ['Confidence level', percent(r?.level ?? s.confidenceLevel)],
    ['CI method (bias, limits)', CI_WORDS[r?.interval ?? s.interval] ?? (r?.interval ?? s.interval)],
    ['Difference type', DIFFERENCE_WORDS[r?.difference ?? s.differenceType]],
    ['Regression', `${REGRESSION_WORDS[regression] ?? regression}; CIs of slope and intercept: ${regressionCiWords(regressionCi, r?.interval ?? s.interval)}`],
    ...(isDeming ? [['Deming error ratio', `λ = ${num(ratio, 3)}, where ${results?.settings?.demingRatioConvention ?? DEMING_RATIO_CONVENTION}`] as [string, string]] : []),
    ['Limits of agreement', `mean difference ± ${num(r?.loaMultiplier ?? s.loaMultiplier, 2)} SD of the differences`],
    ['Outlier test', `Generalized ESD (Rosner 1983) on the differences, α = ${num(r?.esdAlpha ?? s.esdAlpha, 3)}, at most ${maxOutliersWords(results?.outlierTest?.maxOutliers ?? s.esdMax)}; flags only`],
    ['Engine', engine ? `${engine.version}; generator ${engine.generator}` : orDash(report.engineVersion)],
  ]);
}
