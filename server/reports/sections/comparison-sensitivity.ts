import type { ComparisonCore, Estimate } from '../../../shared/stats';
import { integer, num, withCi, withUnit } from '../format';
import type { Layout } from '../layout';
import type { ComparisonFindings, StudyReport } from '../report-model';
import { drawTable } from '../table';
import { NARROW_CI_SHORT } from '../../../shared/types/resolution-words';
import { nounFor } from '../../../shared/types/plural';
import { VERDICT_WORDS } from '../words';
import { decimalsOf, stepWords } from './comparison-data';

const lowerFirst = (text: string): string => text.charAt(0).toLowerCase() + text.slice(1);

/** The main estimates with the excluded rows left out (as analysed) and put back in, side by side. */
export function comparisonSensitivity(layout: Layout, report: StudyReport, results: ComparisonFindings): void {
  layout.subheading('Sensitivity: with and without the excluded rows');
  const other = results.sensitivity;
  if (!other) {
    layout.paragraph('No row was excluded, so there is no second analysis to compare.');
    return;
  }
  const d = decimalsOf(report);
  const { notes } = stepWords(report, results);
  const cell = (e: Estimate | undefined, decimals = d.stat): string => withCi(e, decimals);
  // The path names the estimate in resolution.limitedEstimates, which describes the analysed rows only.
  const lines: [string, string, (c: ComparisonCore) => string][] = [
    ['Pairs (n)', '', (c) => integer(c.n)],
    ['Mean bias (CI)', 'bias.mean', (c) => cell(c.bias?.mean)],
    ['Median bias (CI)', 'bias.median', (c) => cell(c.bias?.median)],
    ['SD of the differences (CI)', 'sd', (c) => cell(c.sd)],
    ['Lower limit of agreement (CI)', 'limitsOfAgreement.lower', (c) => cell(c.limitsOfAgreement?.lower)],
    ['Upper limit of agreement (CI)', 'limitsOfAgreement.upper', (c) => cell(c.limitsOfAgreement?.upper)],
    ['Slope (CI)', 'regression.slope', (c) => cell(c.regression?.slope, 4)],
    ['Intercept (CI)', 'regression.intercept', (c) => cell(c.regression?.intercept)],
    ...(results.decisionLevels ?? []).map((l, k): [string, string, (c: ComparisonCore) => string] => [
      `Bias at ${withUnit(num(l.level, d.value), report.analyte.unit)}`,
      `decisionLevels.${k}`,
      (c) => {
        const at = c.decisionLevels?.[k];
        return at ? `${cell(at.bias)}: ${at.verdict ? lowerFirst(VERDICT_WORDS[at.verdict]) : 'no verdict'}` : '—';
      },
    ]),
  ];
  drawTable(layout, [
    { header: 'Statistic', weight: 1.6 },
    { header: `Excluded rows left out (as analysed)`, weight: 2 },
    { header: `All rows, ${integer(other.excludedCount)} ${nounFor(other.excludedCount ?? 0, 'excluded row')} included`, weight: 2 },
  ], lines.map(([label, path, f]) => [label, notes[path] ? `${f(results)}; ${NARROW_CI_SHORT}` : f(results), f(other)]));
}
