import { num, percent, range, withUnit } from '../format';
import type { Layout } from '../layout';
import type { ComparisonFindings, StudyReport } from '../report-model';
import { drawTable } from '../table';
import { COLOR } from '../theme';
import { VERDICT_WORDS } from '../words';
import { judgedOnSentence } from '../../../shared/types/resolution-words';
import type { StepWords } from '../../../shared/types/resolution-words';
import { decimalsOf, stepParagraph, stepRule, stepWords } from './comparison-data';
import { cautionCallout } from './caution';

const VERDICT_COLOR = { within: COLOR.good, inconclusive: COLOR.warm, exceeds: COLOR.bad } as const;

/** The finding per decision level: predicted bias with its CI against the allowable bias, in words. */
export function comparisonVerdict(layout: Layout, report: StudyReport, results: ComparisonFindings): void {
  const d = decimalsOf(report);
  const unit = report.analyte.unit;
  const level = percent(results.settings?.level ?? report.settings.confidenceLevel);
  const steps = stepWords(report, results);
  layout.heading('Findings at the decision levels', 150 + 22 * (results.decisionLevels?.length ?? 0) + (steps.rule ? 70 : 0));
  stepRule(layout, steps.rule);
  const levels = results.decisionLevels ?? [];
  if (!levels.length) {
    layout.paragraph('No medical decision levels were set, so no verdict is given; see the bias and regression below.');
  } else {
    const rows = levels.map((l) => [
      withUnit(num(l.level, d.value), unit),
      withUnit(num(l.bias.estimate, d.stat), unit),
      l.biasPercent === null ? '—' : `${num(l.biasPercent, 1)}%`,
      l.judgedOn ? `${range(l.bias.ci, d.stat)}\njudged on\n${range(l.judgedOn, d.stat)}` : range(l.bias.ci, d.stat),
      l.allowable === null ? 'Not set' : `±${num(l.allowable, d.stat)}`,
      l.verdict ? VERDICT_WORDS[l.verdict] : 'No verdict (no allowable bias or no CI)',
    ]);
    drawTable(layout, [
      { header: 'Decision level', weight: 1.1 }, { header: 'Predicted bias', weight: 1.1, align: 'right' },
      { header: 'Bias %', weight: 0.7, align: 'right' }, { header: `${level} CI`, weight: 1.3, align: 'right' },
      { header: `Allowable (${unit || 'units'})`, weight: 1, align: 'right' }, { header: 'Verdict', weight: 2.1 },
    ], rows, {
      size: 8.5,
      color: (r, c) => (c === 5 && levels[r].verdict ? VERDICT_COLOR[levels[r].verdict!] : undefined),
    });
    levels.forEach((l, k) => {
      const words = levelStepWords(withUnit(num(l.level, d.value), unit), l.judgedOn ? withUnit(range(l.judgedOn, d.stat), unit) : null, steps, k);
      if (words) stepParagraph(layout, words);
    });
    layout.paragraph(
      'Predicted bias at a level Xc is a + (b − 1)·Xc from the regression. Within: the whole CI lies inside ±allowable. ' +
      'Exceeds: the whole CI lies outside it. Inconclusive: the CI crosses a limit, so the data can neither show agreement nor its absence. ' +
      '"Not significant" does not mean equivalent: the decision rests on the CI against the goal, not on a p-value.',
      { size: 7.5, color: COLOR.muted },
    );
  }
  cautionCallout(layout);
}

/**
 * Under the table, for a level whose CI is narrower than the step: on what interval its verdict was judged
 * and why, or (with no verdict) that the CI says nothing finer than the step; null for any other level.
 */
function levelStepWords(at: string, judged: string | null, steps: StepWords, k: number): string | null {
  const path = `decisionLevels.${k}`;
  if (judged) {
    const sentence = judgedOnSentence(judged, steps.step(path));
    return `At ${at}: ${sentence.charAt(0).toLowerCase()}${sentence.slice(1)}; the data cannot show a difference finer than the step.`;
  }
  return steps.notes[path] ? `At ${at}: ${steps.notes[path]}` : null;
}
