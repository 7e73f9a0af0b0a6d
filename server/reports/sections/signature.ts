import type { Layout } from '../layout';
import type { StudyReport } from '../report-model';
import { drawText, measure } from '../text';
import { COLOR, SIZE } from '../theme';
import { laboratoryTime } from '@shared/types/lab-time';
import { MEANING_WORDS } from '../words';

const PAD = 8;
const LABEL_WIDTH = 110;

/** The lines of the signature box: who signed, the meaning in words, the time in the laboratory's zone, comment, binding. */
function signatureLines(report: StudyReport): [string, string][] {
  const sig = report.signature;
  if (!sig) {
    return [['Signature', report.draft
      ? 'Not signed. This is a preview: no one has accepted or declined this study for patient testing.'
      : 'Not signed. No one has accepted or declined this study for patient testing.']];
  }
  return [
    ['Signed by', sig.signerName],
    ['Meaning', MEANING_WORDS[sig.meaning]],
    ['Date and time', laboratoryTime(sig.signedAt, report.laboratory.timeZone)],
    ['Comment', sig.comment || 'None'],
    ['Bound to content', `SHA-256 ${report.contentHash}`],
    ['Verification code', report.verificationCode],
  ];
}

/**
 * The director's electronic signature on page 1: printed name, meaning in words, date and time with the zone,
 * comment, and what it is bound to; "Not signed" on a draft. The box is measured first and its heading kept
 * with it, so the heading never ends a page alone and the box is never cut.
 */
export function signatureBlock(layout: Layout, report: StudyReport): void {
  signatureBox(layout, signatureLines(report), Boolean(report.signature));
}

/**
 * A signature box under its heading: label and value lines, the first `strong` values in semibold, a solid teal
 * frame when signed and a dashed grey one when not (the study's sign-off, a release's decision).
 */
export function signatureBox(layout: Layout, lines: [string, string][], signed: boolean, heading = 'Sign-off', strong = 3): void {
  const valueWidth = layout.width - LABEL_WIDTH - 2 * PAD;
  const style = { size: SIZE.body };
  const heights = lines.map(([, v]) => measure(layout.doc, v, style, valueWidth) + 3);
  const total = heights.reduce((a, b) => a + b, 0) + 2 * PAD;
  layout.heading(heading, total + 8);
  layout.block(total + 8, (top) => {
    layout.doc.rect(layout.left, top, layout.width, total).lineWidth(signed ? 1.2 : 0.8).strokeColor(signed ? COLOR.accent : COLOR.muted);
    if (!signed) layout.doc.dash(3, { space: 2 });
    layout.doc.stroke().undash();
    let y = top + PAD;
    lines.forEach(([label, value], k) => {
      drawText(layout.doc, label, layout.left + PAD, y, { ...style, color: COLOR.muted }, { width: LABEL_WIDTH - 6 });
      drawText(layout.doc, value, layout.left + PAD + LABEL_WIDTH, y, { ...style, bold: k < strong }, { width: valueWidth });
      y += heights[k];
    });
  });
}
