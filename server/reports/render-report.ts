import PDFDocument from 'pdfkit';
import { REGULAR } from './fonts';
import { Layout } from './layout';
import { markPages } from './page-marks';
import type { ComparisonFindings, EstablishFindings, StudyReport, VerifyFindings } from './report-model';
import { cautionCallout } from './sections/caution';
import { comparisonReport } from './sections/comparison-report';
import { establishReport } from './sections/establish-report';
import { titleBlock } from './sections/title';
import { verifyReport } from './sections/verify-report';
import { PAGE } from './theme';
import { REPORT_TITLES } from './words';

/**
 * The verification PDF of one study. Pure: no I/O beyond reading the embedded fonts, no clock (the
 * document's dates and ID come from generatedAt and the content), so equal reports give equal bytes.
 */
export function renderStudyReport(report: StudyReport): Promise<Buffer> {
  const doc = new PDFDocument({
    size: PAGE.size,
    // Layout breaks the pages itself (above the footer zone); no bottom margin, so pdfkit never adds one.
    margins: { top: PAGE.top, bottom: 0, left: PAGE.left, right: PAGE.right },
    bufferPages: true,
    font: REGULAR,
    lang: 'en',
    displayTitle: true,
    info: {
      Title: `${report.study.title} (study ${report.study.id})`,
      Author: report.laboratory.name,
      Subject: REPORT_TITLES[report.study.kind],
      Creator: 'Parallax',
      Producer: 'Parallax (pdfkit)',
      CreationDate: report.generatedAt,
      ModDate: report.generatedAt,
    },
  });
  const done = collect(doc);
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

function body(layout: Layout, report: StudyReport): void {
  const results = report.results;
  switch (report.study.kind) {
    case 'method-comparison':
      return comparisonReport(layout, report, results?.kind === 'comparison' ? (results as ComparisonFindings) : null);
    case 'interval-establish':
      return establishReport(layout, report, results?.kind === 'interval' ? (results as EstablishFindings) : null);
    case 'interval-verify':
      return verifyReport(layout, report, results?.kind === 'verify-interval' ? (results as VerifyFindings) : null);
  }
}

function collect(doc: PDFKit.PDFDocument): Promise<Buffer> {
  const chunks: Buffer[] = [];
  return new Promise((resolve, reject) => {
    doc.on('data', (chunk: Buffer) => chunks.push(chunk));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
}
