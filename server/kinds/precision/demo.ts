import type { DemoStudy } from '../kind';
import { precisionRuns } from './runs';

export { precisionRuns } from './runs';

const DAYS = ['2026-11-16', '2026-11-17', '2026-11-18', '2026-11-19', '2026-11-20'];

/**
 * The demo laboratory's precision study on the new chemistry line (an invented scenario): two glucose
 * controls, 5 days × 5 replicates. The low control verifies both claims; the high control's within-laboratory
 * CV lies above the claim but under its upper verification limit ("consistent with the claim").
 */
export const PRECISION_DEMOS: DemoStudy[] = [{
  title: 'Glucose precision: Chemistry line 2, two controls',
  analyte: 'Glucose',
  instrument: 'Chemistry line 2',
  purpose: 'Verify the manufacturer\'s repeatability and within-laboratory claims on the new chemistry line before release (invented demo study).',
  settings: {
    seed: 'vh-glucose-precision-2026', decimals: 2, reagentLot: 'GLU-4502', controlLot: 'QC-GL-118', runsFrom: '2026-11-16', runsTo: '2026-11-20',
    days: 5, replicates: 5, alpha: 0.05,
    materials: [
      { name: 'Control 1 (low)', claimRepeatability: 0.08, claimWithinLab: 0.12, claimAs: 'sd', assignedValue: 5.40, assignedUncertainty: 0.05, assignedSource: 'Control manufacturer\'s target for this lot (invented)' },
      { name: 'Control 2 (high)', claimRepeatability: 1.0, claimWithinLab: 1.4, claimAs: 'cv' },
    ],
  },
  rows: [
    ...precisionRuns('vh-prec-low', 'Control 1 (low)', DAYS, 5, 5.42, 0.06, 0.03, 2),
    ...precisionRuns('vh-prec-high', 'Control 2 (high)', DAYS, 5, 16.8, 0.15, 0.2, 2),
  ],
  // Signed: the demo laboratory's glucose release (server/releases/demo.ts) counts it among its four studies.
  finish: 'signed',
  signComment: 'Repeatability and within-laboratory precision meet the claims on both controls; accepted for patient testing.',
}];
