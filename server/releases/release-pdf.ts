import { laboratoryTime } from '@shared/types/lab-time';
import { plural } from '@shared/types/plural';
import { NOT_AVAILABLE, orDash } from '../reports/format';
import { Layout } from '../reports/layout';
import { markPages } from '../reports/page-marks';
import { openReport } from '../reports/render-report';
import type { InstrumentInfo } from '../reports/report-model';
import { cautionCallout } from '../reports/sections/caution';
import { signatureBox } from '../reports/sections/signature';
import { drawTable, type Column } from '../reports/table';
import { drawText, measure, wrapAtSpaces, type TextStyle } from '../reports/text';
import { COLOR, SIZE } from '../reports/theme';
import type { ReleaseReport, ReleaseReportRequirement, ReleaseReportStudy } from './release-report-model';

/*
 * The release PDF: the dossier of one change to a method. Page 1 names the change and leads with the director's
 * decision (released or not, the go-live date, who signed and when), then a table of the requirements; one block
 * per requirement follows (the study that meets it with its verdict, signature, code and hash, or the waiver and
 * its reason), then the waivers, the re-verification it sets due and the caution. It shares the study PDF's frame:
 * the document set-up (openReport), the page flow (Layout), the signature box, the caution and the footer on every
 * page (markPages). Pure: no I/O beyond the embedded fonts and no clock, so equal reports give equal bytes.
 */

/** The type size of the decision's headline on page 1 (between the title's and a heading's, so it reads as neither). */
const HEADLINE = 14;
/** The size of the sentence under the headline (Layout.conclusion's). */
const LEAD = 10.5;
/** The label column of a requirement's block: narrow enough that a 64-digit content hash fits its value column on one line. */
const BLOCK_LABEL = 120;
/** The label column of the release's own lines under the title (Layout.keyValues's default). */
const TITLE_LABEL = 150;

/** The release PDF of one release, signed or a DRAFT preview (decision null, watermarked on every page). */
export function renderReleaseReport(report: ReleaseReport): Promise<Buffer> {
  const { release, laboratory } = report;
  const { doc, done } = openReport({
    title: `${release.title} (release ${release.id})`,
    author: laboratory.name,
    subject: 'Method release',
    generatedAt: report.generatedAt,
  });
  const layout = new Layout(doc);
  titleBlock(layout, report);
  decisionLead(layout, report);
  decisionBox(layout, report);
  summaryTable(layout, report);
  cautionCallout(layout);
  requirementBlocks(layout, report);
  waiverSection(layout, report);
  dueSection(layout, report);
  layout.gap(6);
  cautionCallout(layout);
  markPages(doc, {
    contentHash: report.contentHash, verificationCode: report.verificationCode, draft: report.draft,
    study: `${laboratory.name} · release ${release.id}: ${release.title}`,
  });
  doc.end();
  return done;
}

const at = (report: ReleaseReport, moment: Date): string => laboratoryTime(moment, report.laboratory.timeZone);

/**
 * Label and value lines (Layout.keyValues) with each value broken at spaces first, so "America/Halifax" or
 * "mmol/L" never splits at its slash; a little narrower than the column, as pdfkit counts a line's trailing space.
 */
function keyValues(layout: Layout, pairs: [string, string][], labelWidth: number): void {
  const width = layout.width - labelWidth - 4;
  layout.keyValues(pairs.map(([label, value]) => [label, wrapAtSpaces(layout.doc, value, SIZE.body, width)]), labelWidth);
}

/** "Chemistry line 2 (Harborline C-700, serial HL7-00412)": the parts that are given. */
function instrumentWords(i: InstrumentInfo): string {
  const parts = [i.model.trim(), i.serial.trim() ? `serial ${i.serial.trim()}` : ''].filter(Boolean);
  return parts.length ? `${orDash(i.name)} (${parts.join(', ')})` : orDash(i.name);
}

/** "Released for patient testing" on a signed release, else the preview in a few words. */
function stateWords(report: ReleaseReport): string {
  if (report.decision) return report.decision.meaningWords;
  return report.draft ? 'Draft preview, not signed' : 'Not signed';
}

/** The first lines: laboratory, "Method release", the release's title, its identity, then the change it makes. */
function titleBlock(layout: Layout, report: ReleaseReport): void {
  const { doc } = layout;
  const r = report.release;
  layout.y += drawText(doc, report.laboratory.name, layout.left, layout.y, { size: SIZE.body, color: COLOR.muted }, { width: layout.width });
  layout.y += drawText(doc, 'Method release', layout.left, layout.y, { size: SIZE.title, bold: true, color: COLOR.accent }, { width: layout.width });
  layout.y += drawText(doc, r.title, layout.left, layout.y, { size: SIZE.heading, bold: true }, { width: layout.width });
  const identity = `Release ${r.id} · ${stateWords(report)} · generated ${at(report, report.generatedAt)}`;
  layout.y += drawText(doc, identity, layout.left, layout.y + 2, { size: SIZE.small, color: COLOR.muted }, { width: layout.width }) + 8;
  const pairs: [string, string][] = [
    ['Change', r.changeTypeLabel],
    ['Analyte', r.analyte.unit ? `${r.analyte.name} (${r.analyte.unit})` : r.analyte.name],
    ['Instrument', instrumentWords(r.instrument)],
    ...(r.comparativeInstrument ? [['Compared against', instrumentWords(r.comparativeInstrument)] as [string, string]] : []),
    ...(r.reagentLot.trim() ? [['Reagent lot', r.reagentLot.trim()] as [string, string]] : []),
    ...(r.note.trim() ? [['Note', r.note.trim()] as [string, string]] : []),
    ['Created', `${r.createdBy}, ${at(report, r.createdAt)}`],
  ];
  keyValues(layout, pairs, TITLE_LABEL);
}

/** "3 met, 1 waived": the requirements counted by status, in the order they first appear. */
function statusCounts(requirements: ReleaseReportRequirement[]): string {
  if (!requirements.length) return 'none named';
  const counts = new Map<string, number>();
  for (const q of requirements) counts.set(q.statusLabel, (counts.get(q.statusLabel) ?? 0) + 1);
  return [...counts].map(([label, count]) => `${count} ${label.toLowerCase()}`).join(', ');
}

/** The headline's colour: the tone of the decision, or the draft's red on a preview. */
function decisionColor(report: ReleaseReport): string {
  if (!report.decision) return COLOR.draft;
  return report.decision.meaning === 'released' ? COLOR.good : COLOR.bad;
}

/**
 * The conclusion that leads page 1, beside a rule in the decision's colour: the director's decision in large type
 * (or, on a draft, that nobody has signed), then the go-live date and the requirements in one sentence.
 */
function decisionLead(layout: Layout, report: ReleaseReport): void {
  const d = report.decision;
  const headline = d ? d.meaningWords : 'Not yet signed: this is a preview of the release dossier';
  const goLive = d?.meaning === 'released' ? (d.goLiveDate ? `Go-live date ${d.goLiveDate}.` : 'No go-live date given.') : '';
  const sentence = [
    d ? goLive : 'No one has released this method for patient testing or declined to.',
    `Requirements: ${statusCounts(report.requirements)} (${report.requirements.length} in all).`,
  ].filter(Boolean).join(' ');
  const width = layout.width - 14;
  const label: TextStyle = { size: SIZE.small, bold: true, color: COLOR.accent };
  const head: TextStyle = { size: HEADLINE, bold: true, color: decisionColor(report) };
  const lead: TextStyle = { size: LEAD };
  // Broken at spaces only, as Layout.conclusion does, with a little room so pdfkit never breaks a line again.
  const wrapped = wrapAtSpaces(layout.doc, sentence, LEAD, width);
  const heights = [measure(layout.doc, 'CONCLUSION', label, width), measure(layout.doc, headline, head, width), measure(layout.doc, wrapped, lead, width + 6)];
  const height = heights[0] + 2 + heights[1] + 2 + heights[2] + 8;
  layout.gap(4);
  layout.block(height + 8, (top) => {
    layout.doc.rect(layout.left, top, 3, height).fill(decisionColor(report));
    let y = top + 3;
    y += drawText(layout.doc, 'CONCLUSION', layout.left + 14, y, label, { width }) + 2;
    y += drawText(layout.doc, headline, layout.left + 14, y, head, { width }) + 2;
    drawText(layout.doc, wrapped, layout.left + 14, y, lead, { width: width + 6 });
  });
}

/** The director's signature: who, the decision in words, when (lab time, zone named), the go-live date, comment, binding. */
function decisionLines(report: ReleaseReport): [string, string][] {
  const d = report.decision;
  if (!d) {
    return [['Signature', report.draft
      ? 'Not signed. This is a preview: no one has released this method for patient testing or declined to.'
      : 'Not signed. No one has released this method for patient testing or declined to.']];
  }
  const goLive = d.goLiveDate ?? (d.meaning === 'released' ? 'Not given' : 'None: the method is not released');
  return [
    ['Signed by', d.signerName],
    ['Decision', d.meaningWords],
    ['Date and time', at(report, d.signedAt)],
    ['Go-live date', goLive],
    ['Comment', d.comment.trim() || 'None'],
    ['Bound to content', `SHA-256 ${report.contentHash}`],
    ['Verification code', report.verificationCode],
  ];
}

function decisionBox(layout: Layout, report: ReleaseReport): void {
  signatureBox(layout, decisionLines(report), Boolean(report.decision), 'Director’s decision', 4);
}

/** A status's colour in the tables (its words always stand in the cell too). */
const STATUS_COLORS: Record<string, string> = { met: COLOR.good, 'not-met': COLOR.bad, waived: COLOR.warm, missing: COLOR.bad, 'in-progress': COLOR.muted };

const studyName = (s: ReleaseReportStudy): string => `Study ${s.id}: ${s.title}`;

/** One row per requirement: what it is, where it stands, the study that meets it, its verdict and its code. */
function summaryTable(layout: Layout, report: ReleaseReport): void {
  const columns: Column[] = [
    { header: 'Requirement', weight: 1.4 }, { header: 'Status', weight: 0.95 }, { header: 'Study', weight: 2.1 },
    { header: 'Verdict', weight: 1.05 }, { header: 'Verification code', weight: 1.2 },
  ];
  const rows = report.requirements.map((q) => [
    q.label,
    q.statusLabel,
    q.study ? studyName(q.study) : q.waiver ? 'None (waived)' : 'None',
    q.study ? q.study.verdictWord ?? 'No verdict' : NOT_AVAILABLE,
    q.study?.verificationCode ?? NOT_AVAILABLE,
  ]);
  layout.heading('Requirements', 60);
  if (!rows.length) {
    layout.paragraph('This release names no requirements.');
    return;
  }
  drawTable(layout, columns, rows, { breakAtSpaces: true, color: (r, c) => (c === 1 ? STATUS_COLORS[report.requirements[r].status] : undefined) });
}

/** The label and value lines of one requirement's block. */
function requirementPairs(report: ReleaseReport, q: ReleaseReportRequirement): [string, string][] {
  const pairs: [string, string][] = [
    ['Rule', q.rule.trim() || 'No rule noted'],
    ['Kinds that meet it', orDash(q.kinds.join('; '))],
    ['Status', q.statusLabel],
  ];
  const s = q.study;
  if (s) {
    pairs.push(
      ['Study', studyName(s)],
      ['Kind', s.kindLabel],
      ['Verdict', s.verdictWord ? `${s.verdictWord}${s.verdictSentence ? `: ${s.verdictSentence}` : ''}` : 'No verdict: the findings reach none'],
      ['Results', plural(s.n, 'included result')],
      ['Key figures', s.keyFigures.length ? s.keyFigures.join('\n') : 'None recorded'],
      ['Signed by', `${s.signerName}, ${at(report, s.signedAt)}`],
      ['Meaning', s.meaningWords],
      ['Verification code', s.verificationCode],
      ['Content hash (SHA-256)', s.contentHash],
    );
  }
  if (q.waiver) {
    pairs.push(['Waived by', `${q.waiver.by}, ${at(report, q.waiver.at)}`], ['Reason', q.waiver.reason]);
  }
  if (!s && !q.waiver) {
    pairs.push(['Study', q.status === 'in-progress'
      ? 'No study meets this requirement yet: its study is in progress and not signed'
      : 'No study meets this requirement']);
  }
  return pairs;
}

/**
 * One block per requirement under its subheading. Below the middle of a page, a block that fits on a page is kept
 * whole (a new page starts rather than leave its signature or hash on the next); higher up, or when it is longer
 * than a page, it starts where it is with at least its first lines, so no page is left mostly empty.
 */
function requirementBlocks(layout: Layout, report: ReleaseReport): void {
  report.requirements.forEach((q, k) => {
    const pairs = requirementPairs(report, q);
    const whole = layout.keyValuesHeight(pairs, BLOCK_LABEL);
    const lowOnPage = layout.y > layout.doc.page.height * 0.55;
    const keep = lowOnPage && whole + 24 <= layout.pageRoom ? whole : layout.keyValuesHeight(pairs, BLOCK_LABEL, 4);
    if (k === 0) layout.heading('Requirements in detail', keep + 24);
    layout.subheading(`${k + 1}. ${q.label}: ${q.statusLabel.toLowerCase()}`, keep);
    keyValues(layout, pairs, BLOCK_LABEL);
  });
}

/** The waived requirements again, each with its reason, who waived it and when. */
function waiverSection(layout: Layout, report: ReleaseReport): void {
  const waived = report.requirements.filter((q) => q.waiver);
  layout.heading('Waivers', 50);
  if (!waived.length) {
    layout.paragraph('No requirement is waived.');
    return;
  }
  drawTable(layout, [
    { header: 'Requirement', weight: 1.2 }, { header: 'Reason', weight: 2.8 }, { header: 'Waived by', weight: 1.1 }, { header: 'When', weight: 1.5 },
  ], waived.map((q) => [q.label, q.waiver!.reason, q.waiver!.by, at(report, q.waiver!.at)]), { breakAtSpaces: true });
}

/** The re-verification this release sets due, when it sets any. */
function dueSection(layout: Layout, report: ReleaseReport): void {
  if (!report.due.length) return;
  layout.heading('Re-verification due', 50);
  drawTable(layout, [
    { header: 'Re-verification', weight: 1.6 }, { header: 'Rule', weight: 3 }, { header: 'Due date', weight: 1 },
  ], report.due.map((d) => [d.label, d.rule.trim() || 'No rule noted', d.dueDate]), { breakAtSpaces: true });
}
