import type { SetupGuidance } from '../../setup/setup-guidance';

/** Method comparison: at least 40 patient specimens across the working range (Westgard; CLSI EP09 practice). */
export const COMPARISON_GUIDANCE: SetupGuidance = {
  analyteHint: 'Brings its unit, decision levels and allowable bias; you may change them for this study.',
  plannedLabel: 'Planned specimens',
  plannedHint: 'At least 40 patient specimens across the measuring range, covering the decision levels (CLSI EP09 practice).',
  analysis: 'regression',
  analysisNote: '',
};
