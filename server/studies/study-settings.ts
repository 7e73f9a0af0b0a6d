import { randomBytes } from 'node:crypto';
import { kindMeta } from '@shared/kinds/kinds';
import { parseKindSettings, type KindSettings } from '@shared/kinds/settings';
import type { StudyKind, StudySettingsPatch } from '@shared/schemas';
import type { analytes } from '../db/schema';
import { serverKind } from '../kinds';

/**
 * A new study's settings: the analyte's unit, decimals, decision levels and goal, the kind's own starting
 * values (server/kinds/<kind> initialSettings), then what the caller gave; the kind's own settings are checked
 * with its schema (shared/kinds/<kind>/meta.ts).
 */
export function initialSettings(kind: StudyKind, analyte: typeof analytes.$inferSelect, given: StudySettingsPatch & Record<string, unknown> = {}): KindSettings {
  return parseKindSettings(kind, {
    unit: analyte.unit,
    decimals: analyte.decimals,
    decisionLevels: analyte.decisionLevels,
    allowableBiasAbsolute: analyte.allowableBiasAbsolute,
    allowableBiasPercent: analyte.allowableBiasPercent,
    allowableBiasSource: analyte.allowableBiasSource,
    ...serverKind(kind).initialSettings(analyte),
    seed: randomBytes(5).toString('hex'),
    ...given,
  });
}

/** Settings a director approves as the plan; changing one after approval is an amendment with a reason. */
export const PLAN_FIELDS = [
  'decisionLevels', 'allowableBiasAbsolute', 'allowableBiasPercent', 'allowableBiasSource', 'plannedSpecimens',
  'outlierRule', 'acceptanceRule', 'percentiles', 'statedLower', 'statedUpper',
] as const;

/** The plan fields of a kind: those of every study and the kind's own (KindMeta.planFields). */
export const planFieldsOf = (kind: string): string[] => [...PLAN_FIELDS, ...(kindMeta(kind).planFields ?? [])];
