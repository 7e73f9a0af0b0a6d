import { layoutFaults, pdfLayout } from '../reports/testing/pdf-layout';
import { flat, pdfPages } from '../reports/testing/pdf-text';
import { renderReleaseReport } from './release-pdf';
import type { ReleaseReport } from './release-report-model';
import { draftReleaseReport, longReleaseReport, notReleasedReport, RANGE_WAIVER_REASON, releaseReport } from './release-report-fixture';

// Written out here, not imported, so that a change of the printed wording fails a test.
const CAUTION =
  "Decision support only. These findings do not by themselves make a verification compliant: final acceptance follows local accreditation rules and the laboratory director's professional judgement. They hold only for the specimen types, measuring range, population and lots studied.";
const FOOTER = 'Vale Harbor Regional Laboratory · release 7: Glucose on Chemistry line 2';

/** A string of the document information dictionary (pdfkit writes each as its own object: `/Title 21 0 R`). */
function infoField(pdf: Buffer, name: string): string | undefined {
  const bytes = pdf.toString('latin1');
  const ref = new RegExp(`/${name} (\\d+) 0 R`).exec(bytes)?.[1];
  if (!ref) return undefined;
  return new RegExp(`\\n${ref} 0 obj\\n\\((.*)\\)\\nendobj`).exec(bytes)?.[1].replace(/\\([()\\])/g, '$1');
}

/** The first line of a row of the requirements' summary: the one that starts with its requirement and status. */
const summaryRow = (lines: string[], start: string): string | undefined => lines.find((l) => l.startsWith(`${start} `));

/** The text from one phrase to the next (or to the end). */
const between = (text: string, from: string, to?: string): string => {
  const start = text.indexOf(from);
  expect(start).toBeGreaterThanOrEqual(0);
  const end = to ? text.indexOf(to, start + from.length) : text.length;
  return text.slice(start, end < 0 ? text.length : end);
};

describe('the release PDF of a released method', () => {
  const report = releaseReport();
  let pdf: Buffer;
  let pages: string[][];
  let text: string;

  beforeAll(async () => {
    pdf = await renderReleaseReport(report);
    pages = pdfPages(pdf);
    text = flat(pages);
  });

  it('gives the same bytes for equal reports, and other bytes when the content hash changes', async () => {
    expect((await renderReleaseReport(releaseReport())).equals(pdf)).toBe(true);
    expect((await renderReleaseReport({ ...releaseReport(), contentHash: 'f'.repeat(64) })).equals(pdf)).toBe(false);
  });

  it('describes itself as a method release of the laboratory, dated when it was generated', () => {
    expect(infoField(pdf, 'Title')).toBe('Glucose on Chemistry line 2 (release 7)');
    expect(infoField(pdf, 'Author')).toBe('Vale Harbor Regional Laboratory');
    expect(infoField(pdf, 'Subject')).toBe('Method release');
    expect(infoField(pdf, 'Creator')).toBe('Parallax');
    // CreationDate and ModDate are generatedAt (2026-12-07T14:30:20Z), not the clock.
    expect(pdf.toString('latin1').match(/\(D:\d{14}Z\)/g)).toEqual(['(D:20261207143020Z)', '(D:20261207143020Z)']);
  });

  it('leads page 1 with the release, then the decision, the go-live date and who signed when, in the laboratory’s time', () => {
    const page1 = flat(pages[0]);
    const order = [
      'Vale Harbor Regional Laboratory Method release Glucose on Chemistry line 2 Release 7 · Released for patient testing · generated 2026-12-07 10:30 America/Halifax (UTC−04:00)',
      'Change New measuring system',
      'Analyte Glucose (mmol/L)',
      'Instrument Chemistry line 2 (Harborline C-350, serial HL3-10988)',
      'Compared against Core chemistry 1 (Harborline C-700, serial HL7-00231)',
      'Reagent lot GLU-2611C',
      'Created Tomas Reyes, 2026-10-28 11:02 America/Halifax (UTC−03:00)',
      'CONCLUSION Released for patient testing Go-live date 2027-01-11. Requirements: 3 met, 1 waived (4 in all).',
      'Director’s decision Signed by Dr. Imani Okafor Decision Released for patient testing Date and time 2026-12-07 10:30 America/Halifax (UTC−04:00) Go-live date 2027-01-11',
      'Comment Go live after the January calibration; the ward teams are told in the December bulletin.',
      `Bound to content SHA-256 ${report.contentHash} Verification code PX-R7VH-2G5N`,
      'Requirements Requirement Status Study Verdict Verification code',
    ];
    const at = order.map((phrase) => page1.indexOf(phrase));
    expect(at).not.toContain(-1);
    expect([...at].sort((a, b) => a - b)).toEqual(at);
  });

  it('leaves out the comparative instrument and the reagent lot when the release has none', async () => {
    const bare = releaseReport();
    bare.release = { ...bare.release, comparativeInstrument: null, reagentLot: '' };
    const page1 = flat(pdfPages(await renderReleaseReport(bare))[0]);
    expect(page1).toContain('Instrument Chemistry line 2');
    expect(page1).not.toContain('Compared against');
    expect(page1).not.toContain('Reagent lot');
  });

  it('sums up every requirement on page 1: status, study, verdict word and verification code', () => {
    expect(summaryRow(pages[0], 'Method comparison Met')).toMatch(/^Method comparison Met Study 42: Glucose, plasma: .*Within goal PX-7K3M-Q9TD$/);
    expect(summaryRow(pages[0], 'Precision Met')).toMatch(/^Precision Met Study 44: Glucose: precision of .*Claims verified PX-4WQ8-M2RC$/);
    expect(summaryRow(pages[0], 'Reportable range Waived')).toBe('Reportable range Waived None (waived) — —');
    expect(summaryRow(pages[0], 'Reference interval Met')).toMatch(/^Reference interval Met Study 47: Glucose, fasting plasma: .*Interval fits PX-9D2H-T6LB$/);
  });

  it('gives each requirement a block with its rule, kinds, study, verdict, n, key figures, signature, code and full content hash', () => {
    const one = between(text, '1. Method comparison: met', '2. Precision: met');
    expect(one).toContain('Rule At least 40 patient specimens over at least 5 days across the measuring interval (laboratory policy QP-12).');
    expect(one).toContain('Kinds that meet it Method comparison Status Met');
    expect(one).toContain('Study Study 42: Glucose, plasma: Chemistry line 2 against the core-laboratory analyser Kind Method comparison');
    expect(one).toContain('Verdict Within goal: At every decision level the whole CI of the bias lies within the allowable bias.');
    expect(one).toContain('Results 39 included results');
    expect(one).toContain('Key figures Bias at 3.0 mmol/L: 0.07 mmol/L (95% CI 0.02 to 0.12); allowable ±0.30 mmol/L Bias at 10.0 mmol/L');
    expect(one).toContain('Passing–Bablok: y = 1.028x + 0.02 (slope 95% CI 1.019 to 1.037)');
    expect(one).toContain('Signed by Dr. Imani Okafor, 2026-12-02 09:14 America/Halifax (UTC−04:00) Meaning Accepted for patient testing');
    const four = between(text, '4. Reference interval: met', 'Waivers');
    expect(four).toContain('Kinds that meet it Reference interval: verify; Reference interval: establish');
    for (const q of report.requirements.filter((r) => r.study)) {
      expect(text).toContain(`Verification code ${q.study!.verificationCode} Content hash (SHA-256) ${q.study!.contentHash}`);
      // The whole hash stands on one line: never cut off, never split.
      expect(pages.flat()).toContain(`Content hash (SHA-256) ${q.study!.contentHash}`);
    }
  });

  it('prints the waiver with its reason, who and when in the requirement’s block and again under Waivers', () => {
    const block = between(text, '3. Reportable range: waived', '4. Reference interval');
    expect(block).toContain(`Status Waived Waived by Dr. Imani Okafor, 2026-12-01 14:20 America/Halifax (UTC−04:00) Reason ${RANGE_WAIVER_REASON}`);
    expect(block).not.toContain('Verification code');
    const waivers = between(text, 'Waivers Requirement Reason Waived by When', 'Re-verification due');
    expect(waivers).toContain('Reportable range The measuring interval of 0.6 to 45.0 mmol/L was Dr. Imani Okafor 2026-12-01 14:20');
    expect(waivers).toContain('(installation record VH-IN-2026-114, reviewed');
    // Broken at spaces, never at the zone's slash.
    expect(waivers).toContain('America/Halifax');
  });

  it('lists the re-verification the release sets due, with its rule and date', () => {
    const due = between(text, 'Re-verification due', 'Caution');
    expect(due).toContain('Re-verification Rule Due date Method comparison against the Every 6 months after go-live 2027-07-11 core analyser');
    expect(due).toContain('Reportable range Every 12 months after go-live 2028-01-11');
  });

  it('prints the caution in full right after the summary of verdicts and again at the end', () => {
    const first = text.indexOf(`Caution ${CAUTION}`);
    expect(first).toBeGreaterThan(text.indexOf('Reference interval Met Study 47'));
    expect(first).toBeLessThan(text.indexOf('Requirements in detail'));
    expect(flat(pages[pages.length - 1])).toContain(`Caution ${CAUTION}`);
    expect(text.lastIndexOf(CAUTION)).toBeGreaterThan(text.indexOf('Re-verification due'));
  });

  it('puts the release, the content hash, the verification code and "Page x of N" in the footer of every page', () => {
    expect(pages.length).toBeGreaterThanOrEqual(2);
    pages.forEach((lines, k) => {
      expect(lines).toContain(`Signed record · ${FOOTER} Page ${k + 1} of ${pages.length}`);
      expect(lines).toContain(`Content hash SHA-256 ${report.contentHash} Verification code PX-R7VH-2G5N`);
    });
  });

  it('keeps every line inside the page, never ends a page with a heading and leaves no early page mostly empty', () => {
    expect(layoutFaults(pdfLayout(pdf))).toEqual([]);
  });
});

describe('the release PDF of a method not released', () => {
  const report = notReleasedReport();
  let pages: string[][];
  let text: string;

  beforeAll(async () => {
    pages = pdfPages(await renderReleaseReport(report));
    text = flat(pages);
  });

  it('says the method is not released, with no go-live date, and shows the study that was not accepted', () => {
    expect(text).toContain('CONCLUSION Not released for patient testing Requirements: 2 met, 1 not accepted, 1 waived (4 in all).');
    expect(text).toContain('Decision Not released for patient testing');
    expect(text).toContain('Go-live date None: the method is not released');
    expect(text).not.toContain('Released for patient testing');
    expect(summaryRow(pages[0], 'Precision Not accepted')).toMatch(/^Precision Not accepted Study 44: .*Claim not( verified)? PX-6B1N-W3XE$/);
    const block = between(text, '2. Precision: not accepted', '3. Reportable range');
    expect(block).toContain('Verdict Claim not verified: At least one SD lies above the upper verification limit of its claim.');
    expect(block).toContain('Meaning Not accepted for patient testing');
    expect(block).toContain(`Content hash (SHA-256) ${report.requirements[1].study!.contentHash}`);
  });

  it('sets no re-verification due when none is given, and lays out cleanly', async () => {
    expect(text).not.toContain('Re-verification due');
    expect(layoutFaults(pdfLayout(await renderReleaseReport(report)))).toEqual([]);
  });
});

describe('the release PDF before signing', () => {
  const report = draftReleaseReport();
  let pages: string[][];
  let text: string;

  beforeAll(async () => {
    pages = pdfPages(await renderReleaseReport(report));
    text = flat(pages);
  });

  it('says plainly on page 1 that it is a preview and nobody has signed', () => {
    const page1 = flat(pages[0]);
    expect(page1).toContain('Release 7 · Draft preview, not signed');
    expect(page1).toContain('CONCLUSION Not yet signed: this is a preview of the release dossier No one has released this method for patient testing or declined to.');
    expect(page1).toContain('Director’s decision Signature Not signed. This is a preview');
    expect(text).not.toContain('Released for patient testing');
    expect(text).not.toContain('Go-live date');
  });

  it('marks every page DRAFT, in the footer and the watermark', () => {
    pages.forEach((lines, k) => {
      expect(lines).toContain(`DRAFT — not signed · ${FOOTER} Page ${k + 1} of ${pages.length}`);
      expect(lines.filter((l) => l === 'DRAFT — not signed')).toHaveLength(1);
    });
  });

  it('says when no study meets a requirement, or when its study is still in progress', async () => {
    expect(text).toContain('Reference interval Missing None — —');
    expect(between(text, '4. Reference interval: missing')).toContain('Status Missing Study No study meets this requirement');
    const inProgress: ReleaseReport = {
      ...report,
      requirements: report.requirements.map((q, k) => (k === 3 ? { ...q, status: 'in-progress', statusLabel: 'In progress' } : q)),
    };
    const other = flat(pdfPages(await renderReleaseReport(inProgress)));
    expect(other).toContain('Status In progress Study No study meets this requirement yet: its study is in progress and not signed');
  });

  it('says so when no requirement is waived', async () => {
    const none: ReleaseReport = { ...report, requirements: report.requirements.filter((q) => !q.waiver) };
    const other = flat(pdfPages(await renderReleaseReport(none)));
    expect(other).toContain('Waivers No requirement is waived.');
  });
});

describe('a release of many requirements', () => {
  it('breaks over pages in order, repeating the summary’s header row, with no line outside the page or a heading left alone', async () => {
    const report = longReleaseReport(12);
    const pdf = await renderReleaseReport(report);
    const pages = pdfPages(pdf);
    expect(pages.length).toBeGreaterThan(4);
    expect(pages.filter((lines) => lines.includes('Requirement Status Study Verdict Verification code')).length).toBe(2);
    const text = flat(pages);
    const blocks = report.requirements.map((q, k) => text.indexOf(`${k + 1}. ${q.label}: `));
    expect(blocks).not.toContain(-1);
    expect([...blocks].sort((a, b) => a - b)).toEqual(blocks);
    const linked = report.requirements.filter((r) => r.study);
    expect(linked).toHaveLength(9); // 9 of the 12 have a study (the fixture repeats its requirements, 3 of which have none)
    for (const q of linked) expect(pages.flat()).toContain(`Content hash (SHA-256) ${q.study!.contentHash}`);
    expect(layoutFaults(pdfLayout(pdf))).toEqual([]);
    expect(layoutFaults(pdfLayout(await renderReleaseReport({ ...report, draft: true, decision: null })))).toEqual([]);
  });
});

describe('the layout check the release PDF relies on (layoutFaults)', () => {
  // An A4 page (595.28 × 841.89 pt) with body text from the top margin (54) to above the footer zone (841.89 − 78).
  const line = (text: string, top: number, size = 9, left = 56, right = 300) => ({ text, top, size, left, right });
  const footer = line(`Signed record · ${FOOTER} Page 1 of 2`, 790, 7);
  const page = (...lines: ReturnType<typeof line>[]) => ({ height: 841.89, width: 595.28, lines: [...lines, footer] });
  const full = line('the last line of a full page', 700);

  it('finds nothing wrong with full pages of body text', () => {
    expect(layoutFaults([page(line('top', 54), full), page(line('short last page', 54))])).toEqual([]);
  });

  it('finds a line in the footer zone, above the top margin or past either margin', () => {
    expect(layoutFaults([page(line('too low', 760), full)])).toEqual(['page 1: below the footer zone: too low']);
    expect(layoutFaults([page(line('too high', 40), full)])).toEqual(['page 1: above the top margin: too high']);
    expect(layoutFaults([page(full, line('too wide', 710, 9, 56, 545))])).toEqual(['page 1: past the margins (56 to 545): too wide']);
    expect(layoutFaults([page(full, line('too far left', 710, 9, 40))])).toEqual(['page 1: past the margins (40 to 300): too far left']);
  });

  it('finds a page that ends with a heading or a subheading, and an early page less than half full', () => {
    expect(layoutFaults([page(full, line('Waivers', 720, 12.5))])).toEqual(['page 1: ends with a heading: Waivers']);
    expect(layoutFaults([page(full, line('3. Reportable range: waived', 720, 10))])).toEqual(['page 1: ends with a heading: 3. Reportable range: waived']);
    expect(layoutFaults([page(line('alone', 300)), page(full)])).toEqual(['page 1: less than half full']);
  });
});
