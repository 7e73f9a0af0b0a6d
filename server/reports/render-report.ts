import PDFDocument from 'pdfkit';
import { REGULAR } from './fonts';
import { Layout } from './layout';
import { markPages } from './page-marks';
import type { StudyReport } from './report-model';
import { cautionCallout } from './sections/caution';
import { titleBlock } from './sections/title';
import { PAGE } from './theme';
import { kindMeta } from '../../shared/kinds/kinds';
import { serverKind } from '../kinds';

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
      Subject: kindMeta(report.study.kind).reportTitle,
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

/** The kind's own body (server/kinds/<kind>), given results only when they are of its kind. */
function body(layout: Layout, report: StudyReport): void {
  const kind = serverKind(report.study.kind);
  const results = report.results as { kind?: string } | null;
  kind.report(layout, report, results?.kind === kind.meta.resultKind ? results : null);
}

function collect(doc: PDFKit.PDFDocument): Promise<Buffer> {
  const chunks: Buffer[] = [];
  return new Promise((resolve, reject) => {
    doc.on('data', (chunk: Buffer) => chunks.push(chunk));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
}
