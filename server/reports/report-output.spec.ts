import { execFileSync } from 'node:child_process';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { renderStudyReport } from './render-report';
import type { StudyReport } from './report-model';
import { comparisonReport, establishReport, verifyReport } from './testing/fixtures';

/**
 * Writes sample reports and PNGs of their first two pages (poppler's pdftoppm, 60 dpi) to
 * .test-output/report/ (git-ignored), for people to look at.
 */
const OUT = join(__dirname, '..', '..', '.test-output', 'report');
const signed = comparisonReport(40);
const samples: [string, StudyReport][] = [
  ['comparison-signed', signed],
  ['comparison-draft', { ...signed, draft: true, signature: null, study: { ...signed.study, state: 'draft' } }],
  ['comparison-120-rows', comparisonReport(120)],
  ['interval-establish', establishReport(130)],
  ['interval-verify', verifyReport(20)],
];

describe('sample reports for review', () => {
  beforeAll(() => mkdirSync(OUT, { recursive: true }));

  it.each(samples)('writes %s.pdf and PNGs of its first two pages', async (name, report) => {
    const pdf = join(OUT, `${name}.pdf`);
    writeFileSync(pdf, await renderStudyReport(report));
    execFileSync('pdftoppm', ['-png', '-r', '60', '-f', '1', '-l', '2', pdf, join(OUT, name)]);
    for (const page of ['1', '2']) {
      const png = readFileSync(join(OUT, `${name}-${page}.png`));
      expect(png.subarray(1, 4).toString('latin1')).toBe('PNG');
    }
  });
});
