import type { Layout } from '../layout';
import type { StudyReport } from '../report-model';
import { drawText, measure } from '../text';
import { COLOR, SIZE } from '../theme';
import { laboratoryTime } from '../../../shared/types/lab-time';
import { MEANING_WORDS } from '../words';
import { planApprovalWords } from './plan';

/** The director's electronic signature: printed name, meaning in words, date and time with the zone, comment. */
export function signatureBlock(layout: Layout, report: StudyReport): void {
  layout.heading('Sign-off', 130);
  layout.keyValues([['Plan approval', planApprovalWords(report)]]);
  const sig = report.signature;
  const lines: [string, string][] = sig
    ? [
      ['Signed by', sig.signerName],
      ['Meaning', MEANING_WORDS[sig.meaning]],
      ['Date and time', laboratoryTime(sig.signedAt, report.laboratory.timeZone)],
      ['Comment', sig.comment || 'None'],
      ['Bound to content', `SHA-256 ${report.contentHash}`],
      ['Verification code', report.verificationCode],
    ]
    : [['Signature', 'Not signed. No one has accepted or declined this study for patient testing.']];
  const pad = 8;
  const labelWidth = 110;
  const valueWidth = layout.width - labelWidth - 2 * pad;
  const style = { size: SIZE.body };
  const heights = lines.map(([, v]) => measure(layout.doc, v, style, valueWidth) + 3);
  const total = heights.reduce((a, b) => a + b, 0) + 2 * pad;
  layout.ensure(total);
  const edge = !sig ? COLOR.muted : sig.meaning === 'accepted' ? COLOR.good : COLOR.bad;
  layout.doc.rect(layout.left, layout.y, layout.width, total).lineWidth(1).strokeColor(edge).stroke();
  let y = layout.y + pad;
  lines.forEach(([label, value], k) => {
    drawText(layout.doc, label, layout.left + pad, y, { ...style, color: COLOR.muted }, { width: labelWidth - 6 });
    drawText(layout.doc, value, layout.left + pad + labelWidth, y, { ...style, bold: k < 3 }, { width: valueWidth });
    y += heights[k];
  });
  layout.y += total + 8;
}
