import PDFDocument from 'pdfkit';
import { REGULAR } from './fonts';
import { Layout } from './layout';
import { markPages } from './page-marks';
import type { StudyReport } from './report-model';
import { cautionCallout } from './sections/caution';
import { titleBlock } from './sections/title';
import { PAGE } from './theme';
import { kindMeta } from '@shared/kinds/kinds';
import { serverKind } from '../kinds';

/**
 * The verification PDF of one study. Pure: no I/O beyond reading the embedded fonts, no clock (the
 * document's dates and ID come from generatedAt and the content), so equal reports give equal bytes.
 */
export function renderStudyReport(report: StudyReport): Promise<Buffer> {
  const { doc, done } = openReport({
    title: `${report.study.title} (study ${report.study.id})`,
    author: report.laboratory.name,
    subject: kindMeta(report.study.kind).reportTitle,
    generatedAt: report.generatedAt,
  });
  const layout = new Layout(doc);
  titleBlock(layout, report);
  // Each kind's body leads page 1 with its conclusion, the sign-off and the plan, then the details.
  body(layout, report);
  layout.gap(6);
  cautionCallout(layout);
  markPages(doc, {
    contentHash: report.contentHash, verificationCode: report.verificationCode, draft: report.draft,
    study: `${report.laboratory.name} · study ${report.study.id}: ${report.study.title}`,
  });
  doc.end();
  return done;
}

/** The kind's own body (server/kinds/<kind>), given results only when they are of its kind. */
function body(layout: Layout, report: StudyReport): void {
  const kind = serverKind(report.study.kind);
  const results = report.results as { kind?: string } | null;
  kind.report(layout, report, results?.kind === kind.meta.resultKind ? results : null);
}

/** What a report's document says of itself; its dates are the report's generatedAt, never the clock. */
export interface ReportInfo {
  title: string;
  author: string;
  subject: string;
  generatedAt: Date;
}

/**
 * A report's document as every Parallax PDF sets it up: A4, Open Sans, pages buffered for markPages, no bottom
 * margin (Layout breaks the pages itself, above the footer zone, so pdfkit never adds one), and the document info
 * dated generatedAt, so equal reports give equal bytes. `done` resolves to the bytes once `doc.end()` is called.
 */
export function openReport(info: ReportInfo): { doc: PDFKit.PDFDocument; done: Promise<Buffer> } {
  const doc = new PDFDocument({
    size: PAGE.size,
    margins: { top: PAGE.top, bottom: 0, left: PAGE.left, right: PAGE.right },
    bufferPages: true,
    font: REGULAR,
    lang: 'en',
    displayTitle: true,
    info: {
      Title: info.title,
      Author: info.author,
      Subject: info.subject,
      Creator: 'Parallax',
      Producer: 'Parallax (pdfkit)',
      CreationDate: info.generatedAt,
      ModDate: info.generatedAt,
    },
  });
  return { doc, done: collect(doc) };
}

function collect(doc: PDFKit.PDFDocument): Promise<Buffer> {
  const chunks: Buffer[] = [];
  return new Promise((resolve, reject) => {
    doc.on('data', (chunk: Buffer) => chunks.push(chunk));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
}
