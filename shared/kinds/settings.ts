import { StudySettings } from '../schemas/study.schema';
import { kindMeta } from './kinds';

/** A study's settings as its kind reads them: those every study carries (with defaults), and the kind's own. */
export type KindSettings = StudySettings & Record<string, unknown>;

/**
 * Parses stored or given settings for a kind: the common ones with their defaults, then the kind's own
 * (KindMeta.settings) with theirs. Throws zod's error for a bad value, as StudySettings.parse does.
 */
export function parseKindSettings(kind: string, raw: unknown): KindSettings {
  const common = StudySettings.parse(raw ?? {});
  const own = kindMeta(kind).settings;
  return own ? { ...common, ...own.parse(raw ?? {}) } : common;
}

/** The kind's own settings keys (none for kinds that only use the common ones). */
export function ownSettingKeys(kind: string): string[] {
  const own = kindMeta(kind).settings;
  return own ? Object.keys(own.shape) : [];
}
