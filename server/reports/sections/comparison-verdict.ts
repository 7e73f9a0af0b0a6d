import { decisionPicture, PICTURE_TITLE, type DecisionPicture } from '@shared/types/decision-track';
import { plural } from '@shared/types/plural';
import { VERDICT_DEFINITIONS } from '@shared/text/verdict-words';
import { integer } from '../format';
import type { Layout } from '../layout';
import { decisionTrackParts, drawDecisionTrackPart, type TrackPart } from '../plots/decision-track';
import type { ComparisonFindings, StudyReport } from '../report-model';
import { COLOR } from '../theme';
import { cautionCallout } from './caution';
import { stepRule, stepWords } from './comparison-data';

/** The height of the picture's title (a subheading with its space). */
const SUBHEADING = 22;

/** The decision-level picture of these findings, as the findings page and the review page draw it. */
export function pictureOf(report: StudyReport, results: ComparisonFindings): DecisionPicture {
  const s = report.settings;
  return decisionPicture(results, {
    absolute: s.allowableBiasAbsolute, percent: s.allowableBiasPercent, source: s.allowableBiasSource,
  }, { unit: report.analyte.unit, decimals: s.decimals });
}

/**
 * Page 1 of a method comparison, the conclusion first: one or two sentences, the decision-level picture,
 * the counts of pairs analysed, entered and excluded, and the caution beside them.
 */
export function comparisonLead(layout: Layout, report: StudyReport, results: ComparisonFindings): void {
  const picture = pictureOf(report, results);
  layout.conclusion('Conclusion', picture.conclusion);
  if (picture.tracks.length) {
    // The picture flows: where it does not fit below the conclusion it goes on between tracks on the next page.
    const cut = (): TrackPart[] => decisionTrackParts(layout.doc, picture, layout.width, layout.room - SUBHEADING, layout.pageRoom - SUBHEADING);
    let parts = cut();
    if (parts[0].newPage) {
      // Not even two tracks fit under the conclusion: the title goes with the picture to the next page.
      layout.newPage();
      parts = cut();
    }
    layout.subheading(PICTURE_TITLE, parts[0].height);
    for (const part of parts) {
      if (part.newPage) layout.newPage();
      layout.block(part.height, (y) => drawDecisionTrackPart(layout.doc, picture, part, layout.left, y, layout.width));
    }
  }
  layout.keyValues([['Pairs', pairCounts(report, results)]], 60);
  cautionCallout(layout);
}

/** "39 analysed of 40 entered; 1 excluded with its reason (row 7)", and rows lacking a result when there are any. */
export function pairCounts(report: StudyReport, results: ComparisonFindings): string {
  const excluded = report.rows.filter((r) => r.excluded);
  const entered = report.rows.length;
  const analysed = results.n ?? 0;
  const incomplete = entered - analysed - excluded.length;
  const rows = excluded.map((r) => r.position);
  const parts = [
    `${integer(analysed)} analysed of ${integer(entered)} entered`,
    excluded.length ? `${integer(excluded.length)} excluded with ${excluded.length === 1 ? 'its reason' : 'their reasons'} (${rows.length === 1 ? 'row' : 'rows'} ${rows.join(', ')})` : 'none excluded',
    ...(incomplete > 0 ? [`${plural(incomplete, 'row')} without both results`] : []),
  ];
  return parts.join('; ');
}

/**
 * The findings at the decision levels in words, after page 1: the reporting step's rule, each level in a
 * sentence (the same sentences as the findings page), and what the verdict words mean.
 */
export function comparisonVerdictDetails(layout: Layout, report: StudyReport, results: ComparisonFindings): void {
  const picture = pictureOf(report, results);
  const steps = stepWords(report, results);
  const first = picture.tracks[0]?.sentence ?? '';
  layout.heading('Findings at the decision levels', (steps.rule ? 70 : 0) + 30 + (first.length > 120 ? 24 : 12));
  stepRule(layout, steps.rule);
  if (!picture.tracks.length) {
    layout.paragraph('No medical decision levels were set, so no verdict is given; see the bias and regression below.');
    return;
  }
  for (const t of picture.tracks) layout.paragraph(`${t.word}. ${t.sentence}`, { size: 8 });
  layout.paragraph(
    `Predicted bias at a level Xc is a + (b − 1)·Xc from the regression. ${VERDICT_DEFINITIONS} ` +
    '"Not significant" does not mean equivalent: the decision rests on the CI against the goal, not on a p-value.',
    { size: 7.5, color: COLOR.muted },
  );
}
