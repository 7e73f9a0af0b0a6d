import { renderStudyReport } from './render-report';
import { comparisonReport } from './testing/fixtures';
import { pdfPages } from './testing/pdf-text';

describe('a long table of specimens', () => {
  it('flows 120 rows over several pages in order, repeating the header row on each', async () => {
    const report = comparisonReport(120);
    const pages = pdfPages(await renderStudyReport(report));
    const header = 'Row Specimen Comparative Candidate Difference Status Note';
    const withHeader = pages.filter((lines) => lines.includes(header));
    expect(withHeader.length).toBeGreaterThanOrEqual(3);
    const lines = pages.flat();
    const table = lines.slice(lines.indexOf('Specimen results'));
    const labels = table.map((l) => /^\d+ (VH-\d{4}) /.exec(l)?.[1]).filter(Boolean);
    expect(labels).toEqual(report.rows.map((r) => r.label));
    for (const lines of withHeader) {
      const at = lines.indexOf(header);
      expect(lines[at + 1]).toMatch(/^\d+ VH-\d{4} /);
    }
  });
});
