import { randomBytes } from 'node:crypto';
import { StudySettings, type StudyKind, type StudySettingsPatch } from '../../shared/schemas';
import type { analytes } from '../db/schema';

const ACCEPTANCE: Record<Exclude<StudyKind, 'method-comparison'>, string> = {
  'interval-establish': 'Nonparametric limits with 90% CIs from at least 120 reference individuals per partition; partitions where Harris & Boyd recommend them',
  'interval-verify': 'Accept the stated interval when at most 10% of the local values (2 of 20) fall outside it',
};

/** A new study's settings: the analyte's unit, decimals, decision levels and goal, then what the caller gave. */
export function initialSettings(kind: StudyKind, analyte: typeof analytes.$inferSelect, given: StudySettingsPatch = {}): StudySettings {
  return StudySettings.parse({
    unit: analyte.unit,
    decimals: analyte.decimals,
    decisionLevels: analyte.decisionLevels,
    allowableBiasAbsolute: analyte.allowableBiasAbsolute,
    allowableBiasPercent: analyte.allowableBiasPercent,
    allowableBiasSource: analyte.allowableBiasSource,
    confidenceLevel: kind === 'method-comparison' ? 0.95 : 0.9,
    ...(kind === 'method-comparison' ? {} : { acceptanceRule: ACCEPTANCE[kind], outlierRule: 'Tukey fences and Dixon\'s D/R > 1/3 rule (flags only; exclusion needs a reason)' }),
    seed: randomBytes(5).toString('hex'),
    ...given,
  });
}

/** Settings a director approves as the plan; changing one after approval is an amendment with a reason. */
export const PLAN_FIELDS = [
  'decisionLevels', 'allowableBiasAbsolute', 'allowableBiasPercent', 'allowableBiasSource', 'plannedSpecimens',
  'outlierRule', 'acceptanceRule', 'percentiles', 'statedLower', 'statedUpper',
] as const;
