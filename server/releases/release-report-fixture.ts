import { createHash } from 'node:crypto';
import type { ReleaseReport, ReleaseReportRequirement, ReleaseReportStudy } from './release-report-model';

/*
 * Invented releases for the release PDF's tests: Vale Harbor's glucose method moves to a new measuring system,
 * "Chemistry line 2", checked against the core-laboratory analyser. Four requirements: a method comparison, a
 * precision verification and a reference-interval verification met by signed studies, and the reportable range
 * waived with a reason. Every name, number, code and hash here is made up; the hashes are SHA-256 of short labels.
 */

const hash = (label: string): string => createHash('sha256').update(label).digest('hex');

const TIME_ZONE = 'America/Halifax';
const DIRECTOR = 'Dr. Imani Okafor';

const comparisonStudy: ReleaseReportStudy = {
  id: 42,
  title: 'Glucose, plasma: Chemistry line 2 against the core-laboratory analyser',
  kindLabel: 'Method comparison',
  verdictWord: 'Within goal',
  verdictSentence: 'At every decision level the whole CI of the bias lies within the allowable bias.',
  n: 39,
  keyFigures: [
    'Bias at 3.0 mmol/L: 0.07 mmol/L (95% CI 0.02 to 0.12); allowable ±0.30 mmol/L',
    'Bias at 10.0 mmol/L: 0.21 mmol/L (95% CI 0.15 to 0.27); allowable ±0.30 mmol/L',
    'Passing–Bablok: y = 1.028x + 0.02 (slope 95% CI 1.019 to 1.037)',
  ],
  signerName: DIRECTOR,
  signedAt: new Date('2026-12-02T13:14:00Z'),
  meaningWords: 'Accepted for patient testing',
  verificationCode: 'PX-7K3M-Q9TD',
  contentHash: hash('vale harbor study 42'),
};

const precisionStudy: ReleaseReportStudy = {
  id: 44,
  title: 'Glucose: precision of Chemistry line 2, two control levels over five days',
  kindLabel: 'Precision verification',
  verdictWord: 'Claims verified',
  verdictSentence: 'Every repeatability and within-laboratory SD lies within its claim or its upper verification limit.',
  n: 50,
  keyFigures: [
    'Level 1 (5.2 mmol/L): repeatability SD 0.06 mmol/L, within-laboratory SD 0.08 mmol/L (claim 0.10)',
    'Level 2 (16.8 mmol/L): repeatability SD 0.15 mmol/L, within-laboratory SD 0.21 mmol/L (claim 0.25)',
  ],
  signerName: DIRECTOR,
  signedAt: new Date('2026-12-03T15:40:00Z'),
  meaningWords: 'Accepted for patient testing',
  verificationCode: 'PX-4WQ8-M2RC',
  contentHash: hash('vale harbor study 44'),
};

const intervalStudy: ReleaseReportStudy = {
  id: 47,
  title: 'Glucose, fasting plasma: verify the manufacturer’s interval on Chemistry line 2',
  kindLabel: 'Reference interval: verify',
  verdictWord: 'Interval fits',
  verdictSentence: 'Few enough local results fell outside the stated reference interval.',
  n: 20,
  keyFigures: ['Stated interval 3.9 to 5.6 mmol/L (manufacturer’s insert, rev. 2025-06)', '1 of 20 results outside (at most 2 allowed)'],
  signerName: DIRECTOR,
  signedAt: new Date('2026-12-04T12:05:00Z'),
  meaningWords: 'Accepted for patient testing',
  verificationCode: 'PX-9D2H-T6LB',
  contentHash: hash('vale harbor study 47'),
};

export const RANGE_WAIVER_REASON =
  'The measuring interval of 0.6 to 45.0 mmol/L was verified at installation with the supplier’s linearity kit (installation record VH-IN-2026-114, reviewed by the director); the laboratory does not repeat it for a system of the same model.';

export const requirements = (): ReleaseReportRequirement[] => [
  {
    label: 'Method comparison', rule: 'At least 40 patient specimens over at least 5 days across the measuring interval (laboratory policy QP-12).',
    kinds: ['Method comparison'], status: 'met', statusLabel: 'Met', study: comparisonStudy, waiver: null,
  },
  {
    label: 'Precision', rule: 'Two control levels, 5 days × 5 replicates.',
    kinds: ['Precision verification'], status: 'met', statusLabel: 'Met', study: precisionStudy, waiver: null,
  },
  {
    label: 'Reportable range', rule: 'Five or more levels spanning the claimed measuring interval.',
    kinds: ['Reportable range'], status: 'waived', statusLabel: 'Waived', study: null,
    waiver: { reason: RANGE_WAIVER_REASON, by: DIRECTOR, at: new Date('2026-12-01T18:20:00Z') },
  },
  {
    label: 'Reference interval', rule: 'Verify the stated interval with 20 local reference individuals, or establish one locally.',
    kinds: ['Reference interval: verify', 'Reference interval: establish'], status: 'met', statusLabel: 'Met', study: intervalStudy, waiver: null,
  },
];

/** Vale Harbor's glucose on Chemistry line 2, released for patient testing from 2027-01-11. */
export function releaseReport(): ReleaseReport {
  return {
    laboratory: { name: 'Vale Harbor Regional Laboratory', timeZone: TIME_ZONE },
    release: {
      id: 7,
      title: 'Glucose on Chemistry line 2',
      changeTypeLabel: 'New measuring system',
      analyte: { name: 'Glucose', unit: 'mmol/L' },
      instrument: { name: 'Chemistry line 2', model: 'Harborline C-350', serial: 'HL3-10988' },
      comparativeInstrument: { name: 'Core chemistry 1', model: 'Harborline C-700', serial: 'HL7-00231' },
      reagentLot: 'GLU-2611C',
      note: 'Replaces the glucose method of the satellite laboratory; the core analyser stays as back-up.',
      createdBy: 'Tomas Reyes',
      createdAt: new Date('2026-10-28T14:02:00Z'),
    },
    decision: {
      meaning: 'released',
      meaningWords: 'Released for patient testing',
      signerName: DIRECTOR,
      signedAt: new Date('2026-12-07T14:30:00Z'),
      goLiveDate: '2027-01-11',
      comment: 'Go live after the January calibration; the ward teams are told in the December bulletin.',
    },
    requirements: requirements(),
    due: [
      { label: 'Method comparison against the core analyser', rule: 'Every 6 months after go-live', dueDate: '2027-07-11' },
      { label: 'Reportable range', rule: 'Every 12 months after go-live', dueDate: '2028-01-11' },
    ],
    contentHash: hash('vale harbor release 7'),
    verificationCode: 'PX-R7VH-2G5N',
    draft: false,
    generatedAt: new Date('2026-12-07T14:30:20Z'),
  };
}

/** The same release where the precision study was not accepted, so the director does not release the method. */
export function notReleasedReport(): ReleaseReport {
  const report = releaseReport();
  const precision: ReleaseReportRequirement = {
    ...report.requirements[1], status: 'not-met', statusLabel: 'Not accepted',
    study: {
      ...precisionStudy, verdictWord: 'Claim not verified', verdictSentence: 'At least one SD lies above the upper verification limit of its claim.',
      keyFigures: ['Level 2 (16.8 mmol/L): within-laboratory SD 0.36 mmol/L, above the upper verification limit 0.31 mmol/L (claim 0.25)'],
      meaningWords: 'Not accepted for patient testing', verificationCode: 'PX-6B1N-W3XE', contentHash: hash('vale harbor study 44 declined'),
    },
  };
  return {
    ...report,
    requirements: report.requirements.map((q, k) => (k === 1 ? precision : q)),
    decision: {
      meaning: 'not-released', meaningWords: 'Not released for patient testing', signerName: DIRECTOR,
      signedAt: new Date('2026-12-07T14:30:00Z'), goLiveDate: null,
      comment: 'Within-laboratory precision at the high level is above the claim; the supplier is to service the sampler before a new precision study.',
    },
    due: [],
    contentHash: hash('vale harbor release 7 not released'),
    verificationCode: 'PX-R7VH-8K4P',
  };
}

/** A preview before signing: no decision, and the reference interval's study not started yet. */
export function draftReleaseReport(): ReleaseReport {
  const report = releaseReport();
  return {
    ...report,
    requirements: report.requirements.map((q) => (q.label === 'Reference interval' ? { ...q, status: 'missing', statusLabel: 'Missing', study: null } : q)),
    decision: null,
    due: [],
    draft: true,
  };
}

/** A release of `count` requirements (the template allows 12), each met by a study with several lines of key figures. */
export function longReleaseReport(count = 12): ReleaseReport {
  const report = releaseReport();
  const base = requirements();
  return {
    ...report,
    requirements: Array.from({ length: count }, (_, k) => {
      const q = base[k % base.length];
      const study = q.study && {
        ...q.study, id: 100 + k, verificationCode: `PX-L${String(k).padStart(3, '0')}-Q${k % 10}TD`, contentHash: hash(`vale harbor long study ${k}`),
        keyFigures: [...q.study.keyFigures, ...q.study.keyFigures],
      };
      return { ...q, label: `${q.label} ${Math.floor(k / base.length) + 1}`, study };
    }),
  };
}
