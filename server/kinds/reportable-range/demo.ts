import type { DemoStudy } from '../kind';
import { RANGE_DEMO_ROWS, RANGE_DEMO_SETTINGS } from '@shared/kinds/reportable-range/demo-data';

/**
 * The demo laboratory's reportable-range study on the new chemistry line (an invented scenario): nine mixtures
 * of a low and a high glucose pool, two replicates each. The response bends down above about 22 mmol/L, so the
 * top level's deviation from linearity exceeds the allowable 0.5 mmol/L and the verified range ends one level short
 * of the claimed high end.
 */
export const RANGE_DEMOS: DemoStudy[] = [{
  title: 'Glucose reportable range: Chemistry line 2, nine mixtures',
  analyte: 'Glucose',
  instrument: 'Chemistry line 2',
  purpose: 'Verify linearity and recovery across the manufacturer\'s claimed measuring interval on the new chemistry line before release (invented demo study).',
  settings: RANGE_DEMO_SETTINGS,
  rows: RANGE_DEMO_ROWS,
  // Signed: the demo laboratory's glucose release (server/releases/demo.ts) counts it among its four studies.
  finish: 'signed',
  signComment: 'Reportable range accepted as verified, 0.3 to 28.3 mmol/L; results above 28.3 mmol/L are diluted, as the range is one level short of the claim.',
}];
