import type { LimitResult } from '@shared/stats';
import { chance, integer, num, orDash, percent, range, withUnit } from '../format';
import type { Layout } from '../layout';
import type { EstablishFindings, StudyReport } from '../report-model';
import { drawTable } from '../table';
import { COLOR } from '../theme';
import { INTERVAL_METHOD_WORDS } from '../words';
import { decimalsOf, stepParagraph, stepRule, stepWords } from './comparison-data';
import { cautionCallout } from './caution';

/** The limits with their bootstrap and rank-based CIs, the method and why, and the counts. */
export function establishFindings(layout: Layout, report: StudyReport, results: EstablishFindings): void {
  const d = decimalsOf(report);
  const unit = report.analyte.unit;
  const level = percent(results.settings?.level ?? report.settings.confidenceLevel);
  const steps = stepWords(report, results);
  layout.heading('Reference interval', steps.rule ? 170 : 90);
  stepRule(layout, steps.rule);
  const limits = ([['Lower limit', results.lower, 'lower'], ['Upper limit', results.upper, 'upper']] as [string, LimitResult | null | undefined, string][])
    .filter((entry): entry is [string, LimitResult, string] => Boolean(entry[1]));
  drawTable(layout, [
    { header: 'Limit', weight: 1 }, { header: 'Percentile', weight: 0.8, align: 'right' }, { header: `Estimate (${unit || 'units'})`, weight: 1, align: 'right' },
    { header: `${level} CI, rank-based`, weight: 1.4, align: 'right' }, { header: `${level} CI, bootstrap`, weight: 1.4, align: 'right' },
    { header: 'Ranks (coverage)', weight: 1.1, align: 'right' },
  ], limits.map(([name, l]) => [
    // In the order and words of the findings page's limits table: rank-based CI first, where the method gives one.
    name, `${l.percentile}th`, num(l.estimate, d.stat), l.rankCi ? range(l.rankCi, d.stat) : 'not used by this method', range(l.ci, d.stat),
    l.ranks ? `${l.ranks.lowerRank}–${l.ranks.upperRank} (${chance(l.ranks.coverage)})` : '—',
  ]), { size: 8.5 });
  for (const [name, , path] of limits) if (steps.notes[path]) stepParagraph(layout, `${name}: bootstrap ${steps.notes[path]}`);
  if (!results.lower && !results.upper) layout.paragraph('No limit could be estimated; see the warnings.', { color: COLOR.bad });
  const method = INTERVAL_METHOD_WORDS[results.method];
  layout.keyValues([
    ['Interval', withUnit(`${num(results.lower?.estimate, d.stat)} to ${num(results.upper?.estimate, d.stat)}`, unit)],
    ['Values', `${integer(results.n)} analysed; ${integer(results.excludedCount)} excluded of ${integer(results.nTotal)}`],
    ['Method', method?.name ?? orDash(results.method)],
    ['Why this method', method?.why ?? '—'],
    ...(results.boxCoxLambda != null ? [['Box–Cox λ', num(results.boxCoxLambda, 3)] as [string, string]] : []),
    ['Bootstrap', `${integer(results.settings?.resamples)} resamples, seed ${results.settings?.seed ?? report.settings.seed}; percentile CIs`],
  ]);
  cautionCallout(layout);
}
