import { integer, orDash } from '../format';
import { plural } from '@shared/types/plural';
import type { Layout } from '../layout';
import type { InstrumentInfo, StudyReport } from '../report-model';
import { drawTable } from '../table';
import { drawText } from '../text';
import { COLOR, SIZE } from '../theme';
import { laboratoryTime } from '@shared/types/lab-time';
import { STATE_WORDS } from '../words';
import { kindMeta } from '@shared/kinds/kinds';

/** The first lines: laboratory, kind of study, title, identity and state. */
export function titleBlock(layout: Layout, report: StudyReport): void {
  const { doc } = layout;
  layout.y += drawText(doc, report.laboratory.name, layout.left, layout.y, { size: SIZE.body, color: COLOR.muted }, { width: layout.width });
  layout.y += drawText(doc, kindMeta(report.study.kind).reportTitle, layout.left, layout.y, { size: SIZE.title, bold: true, color: COLOR.accent }, { width: layout.width });
  layout.y += drawText(doc, report.study.title, layout.left, layout.y, { size: SIZE.heading, bold: true }, { width: layout.width });
  const identity = [
    `Study ${report.study.id}`,
    STATE_WORDS[report.study.state],
    report.study.supersedesId !== null ? `supersedes study ${report.study.supersedesId}` : null,
    `generated ${laboratoryTime(report.generatedAt, report.laboratory.timeZone)}`,
  ].filter(Boolean).join(' · ');
  layout.y += drawText(doc, identity, layout.left, layout.y + 2, { size: SIZE.small, color: COLOR.muted }, { width: layout.width }) + 8;
  if (report.draft) {
    layout.callout('This is a preview of a study that is not signed. It is not a record of verification and must not be filed as one.', {
      fill: '#f8e5e2', edge: COLOR.draft, title: 'DRAFT — not signed',
    });
  }
}

/** What was studied: analyte, instruments with serials and lots, run dates, purpose. */
export function studyBlock(layout: Layout, report: StudyReport): void {
  const s = report.settings;
  const runs = s.runsFrom || s.runsTo ? `${orDash(s.runsFrom)} to ${orDash(s.runsTo)}` : 'Not recorded';
  const pairs: [string, string][] = [
    ['Analyte', report.analyte.unit ? `${report.analyte.name} (${report.analyte.unit})` : report.analyte.name],
    ['Kind of study', kindMeta(report.study.kind).reportKind],
    ['Runs', runs],
    ['Specimens', `${plural(report.rows.length, 'row')} entered${s.plannedSpecimens ? `; ${integer(s.plannedSpecimens)} planned` : ''}`],
    ['Purpose', orDash(report.study.purpose)],
    ['Statistics engine', orDash(report.engineVersion)],
  ];
  layout.heading('Study', layout.keyValuesHeight(pairs, 150, 3));
  layout.keyValues(pairs);
  const { comparative, candidate, instrument } = report.instruments;
  const rows: string[][] = [];
  const add = (role: string, i: InstrumentInfo | undefined, lot: string): void => {
    rows.push([role, orDash(i?.name), orDash(i?.model), orDash(i?.serial), orDash(lot)]);
  };
  if (kindMeta(report.study.kind).instruments === 'pair') {
    add('Comparative method (x)', comparative, s.comparativeLot);
    add('Candidate method (y)', candidate, s.candidateLot);
  } else {
    add('Instrument', instrument, s.reagentLot);
  }
  layout.ensure(16 * (rows.length + 1) + 4); // a table of one or two rows is never split from its header or from itself
  drawTable(layout, [
    { header: 'Role', weight: 1.3 }, { header: 'Instrument', weight: 1.3 }, { header: 'Make and model', weight: 1.4 },
    { header: 'Serial', weight: 0.9 }, { header: 'Reagent lot', weight: 0.9 },
  ], rows);
}
