import { renderStudyReport } from './render-report';
import { comparisonReport } from './testing/fixtures';
import { flat, pdfPages } from './testing/pdf-text';

describe('properties of the rendered PDF', () => {
  const signed = comparisonReport(40);
  const draft = { ...signed, draft: true, signature: null, study: { ...signed.study, state: 'draft' as const } };

  it('gives the same bytes for the same report, built twice', async () => {
    const [a, b] = [await renderStudyReport(signed), await renderStudyReport(comparisonReport(40))];
    expect(a.equals(b)).toBe(true);
    // CreationDate and ModDate are generatedAt (2026-12-02T13:14:30Z), not the clock.
    expect(a.toString('latin1').match(/\(D:\d{14}Z\)/g)).toEqual(['(D:20261202131430Z)', '(D:20261202131430Z)']);
  });

  it('changes when the content hash changes', async () => {
    const other = await renderStudyReport({ ...signed, contentHash: 'f'.repeat(64) });
    expect(other.equals(await renderStudyReport(signed))).toBe(false);
  });

  it('marks every page of a draft with DRAFT, in the footer and the watermark', async () => {
    const pages = pdfPages(await renderStudyReport(draft));
    expect(pages.length).toBeGreaterThan(3);
    pages.forEach((lines, k) => {
      expect(lines.filter((l) => l.includes('DRAFT — not signed')).length).toBeGreaterThanOrEqual(2);
      expect(flat(lines)).toContain(`Page ${k + 1} of ${pages.length}`);
    });
    expect(flat(pages)).toContain('Signature Not signed.');
  });

  it('embeds both Open Sans weights as TrueType subsets and uses no standard font', async () => {
    const bytes = (await renderStudyReport(signed)).toString('latin1');
    expect(bytes.match(/\/FontFile2 /g)?.length).toBe(2);
    expect(bytes).toMatch(/\/BaseFont \/[A-Z]{6}\+OpenSans-Regular/);
    expect(bytes).toMatch(/\/BaseFont \/[A-Z]{6}\+OpenSans-SemiBold/);
    expect(bytes).not.toContain('/Helvetica');
  });

  it('prints a declined study as not accepted', async () => {
    const declined = { ...signed, signature: { ...signed.signature!, meaning: 'not-accepted' as const } };
    const text = flat(pdfPages(await renderStudyReport(declined)));
    expect(text).toContain('Meaning Not accepted for patient testing');
    expect(text).not.toContain('Accepted for patient testing');
  });
});
