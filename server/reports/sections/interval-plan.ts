import { intervalVerifyMeta } from '@shared/kinds/interval-verify/meta';
import { ESTABLISH_GRID, planEstablish } from '@shared/stats/plan-establish';
import { allowedOutside, planTransference } from '@shared/stats/plan-transference';
import { binomialRankCi } from '@shared/stats/rank-ci';
import { chance, integer, num, orDash, percent, withUnit } from '../format';
import type { Layout } from '../layout';
import type { StudyReport } from '../report-model';
import { drawTable } from '../table';
import { COLOR, SIZE } from '../theme';
import { INTERVAL_METHOD_WORDS, PARTITION_WORDS } from '../words';
import { decimalsOf } from './comparison-data';
import { planApprovalWords } from './plan';
import { share } from './sample-plan';

/** The plan of a reference-interval study: population, percentiles or stated interval, rules. */
export function intervalPlan(layout: Layout, report: StudyReport): void {
  const s = report.settings;
  const d = decimalsOf(report).value;
  const unit = report.analyte.unit;
  const verifying = report.study.kind === intervalVerifyMeta.kind;
  const stated = `${withUnit(`${num(s.statedLower, d)} to ${num(s.statedUpper, d)}`, unit)}`;
  const pairs: [string, string][] = [
    ['Reference population', orDash(s.populationDescription)],
    ...(verifying
      ? [
        ['Stated interval', stated], ['Source of the stated interval', orDash(s.statedSource)],
        ['Rule the engine applies', 'Accept when at most 10% of the local values (2 of 20) fall outside the stated interval'],
      ] as [string, string][]
      : [
        ['Percentiles', s.percentiles.map((p) => `${p}th`).join(' and ')],
        ['Method', INTERVAL_METHOD_WORDS[s.intervalMethod]?.name ?? s.intervalMethod],
        ['Partitions tested', s.partitionFields.length ? s.partitionFields.map((f) => PARTITION_WORDS[f] ?? f).join(', ') : 'None'],
        ['Confidence level of the limits', percent(s.confidenceLevel)],
      ] as [string, string][]),
    ['Acceptance rule (as planned)', orDash(s.acceptanceRule)],
    ['Outlier rule', verifying ? 'Values are not screened; an exclusion needs a recorded reason' : 'Tukey fences (1.5 × IQR) and Dixon’s gap rule (D/R > 1/3); flags only'],
    ['Plan approval', planApprovalWords(report)],
  ];
  layout.heading('Plan and acceptance criteria', layout.keyValuesHeight(pairs, 150, 2));
  layout.keyValues(pairs);
  if (verifying) acceptanceTable(layout, report);
  else establishTable(layout, report);
}

/** The true shares of the population outside the stated interval the verification's table shows. */
export const TRUE_OUTSIDE = [0.025, 0.05, 0.1, 0.15, 0.2, 0.25];

/**
 * How often the transference rule accepts the stated interval at the planned n, as the share of the local
 * population that truly falls outside it grows (plan-transference.ts: binomial, retest judged on its own).
 */
function acceptanceTable(layout: Layout, report: StudyReport): void {
  const n = report.settings.plannedSpecimens ?? 20;
  const k = allowedOutside(n);
  const plan = planTransference({ n, maxOutside: k, outside: TRUE_OUTSIDE });
  const at10 = plan.rows.find((r) => r.trueOutside === 0.1)!;
  layout.subheading('How often the rule accepts', 120);
  layout.paragraph(
    `With ${integer(n)} values${report.settings.plannedSpecimens === null ? ' (the usual number; none is planned)' : ' (as planned)'}, the interval is accepted at first when at most ${integer(k)} fall outside it; ` +
    `otherwise ${integer(n)} more are tested and it is accepted when at most ${integer(k)} of those fall outside. The count outside follows a binomial distribution, ` +
    `so the rule is weak against a population that differs: with 10% of it truly outside the stated interval, it still accepts ${share(at10.acceptFirst)} of the time at first ` +
    `and ${share(at10.acceptWithRetest)} with the retest.`,
  );
  drawTable(layout, [
    { header: 'True share of the population outside the interval', weight: 2, align: 'right' },
    { header: `Accepted at first (at most ${integer(k)} of ${integer(n)} outside)`, weight: 1.6, align: 'right' },
    { header: 'Accepted, counting the retest', weight: 1.6, align: 'right' },
  ], plan.rows.map((r) => [percent(r.trueOutside), share(r.acceptFirst), share(r.acceptWithRetest)]), { breakAtSpaces: true });
}

/** The smallest n at which every percentile has a rank-based CI at this level (119 for the 2.5th and 97.5th at 90%). */
export function smallestN(percentiles: number[], level: number): number | null {
  for (let n = 2; n <= 5000; n++) if (percentiles.every((p) => binomialRankCi(n, p / 100, level))) return n;
  return null;
}

/**
 * What more reference individuals buy when establishing the interval (plan-establish.ts): for each n the ranks of
 * each limit's CI, its exact coverage and the share of the population it spans on average.
 */
function establishTable(layout: Layout, report: StudyReport): void {
  const s = report.settings;
  const planned = s.plannedSpecimens;
  const level = s.confidenceLevel;
  const grid = [...ESTABLISH_GRID, ...(planned !== null && !(ESTABLISH_GRID as readonly number[]).includes(planned) ? [planned] : [])];
  const plan = planEstablish({ n: grid, percentiles: s.percentiles, level });
  const ci = `${num(100 * level, 0)}% CI`;
  const limits = s.percentiles.map((p) => `${p}th`);
  const least = smallestN(s.percentiles, level);
  layout.subheading('What more reference values buy', 140);
  layout.paragraph(
    `The ${ci} of a limit runs between two of the sorted values (their ranks from the lowest); its coverage is exact (binomial), and the span is the share ` +
    `of the population between those two values on average, in percentile points (the same for any population). With partitions, each partition needs this many values of its own.`,
  );
  drawTable(layout, [
    { header: 'n', weight: 0.7, align: 'right' },
    ...limits.flatMap((l) => [
      { header: `${l}: ranks of the ${ci}`, weight: 1.3, align: 'right' as const },
      { header: `${l}: coverage`, weight: 1, align: 'right' as const },
      { header: `${l}: expected span (percentile points)`, weight: 1.4, align: 'right' as const },
    ]),
  ], plan.rows.map((row) => [
    integer(row.n),
    ...row.limits.flatMap((l) => (l.lowerRank === null || l.upperRank === null ? ['none', '—', '—'] : [
      `${l.lowerRank}–${l.upperRank}`, chance(l.coverage), num(l.expectedSpan, 1),
    ])),
  ]), { breakAtSpaces: true, strong: (k) => planned !== null && plan.rows[k].n === planned });
  const notes = [
    least !== null ? `n below ${integer(least)} gives no ${ci} of the ${limits.join(limits.length === 2 ? ' or ' : ', ')} percentile from ranks.` : '',
    planned !== null ? `Row in semibold: the planned n (${integer(planned)}).` : '',
  ].filter(Boolean).join(' ');
  if (notes) layout.paragraph(notes, { size: SIZE.small, color: COLOR.muted });
}
