import { PrecisionSettings, type PrecisionMaterial } from '@shared/kinds/precision/meta';

/** A precision study's own settings (shared/kinds/precision/meta.ts), stored beside the common ones. */
export type PrecisionOwn = PrecisionSettings;

const DEFAULTS = PrecisionSettings.parse({});

/**
 * Reads a precision study's own settings from its settings object (the API answers them beside the common ones; the
 * shared StudySettings type does not list them), with the kind's defaults for any that are missing.
 */
export function precisionOwn(settings: object): PrecisionOwn {
  const raw = settings as Partial<Record<keyof PrecisionOwn, unknown>>;
  const numberOr = (value: unknown, fallback: number): number => (typeof value === 'number' && Number.isFinite(value) ? value : fallback);
  return {
    materials: Array.isArray(raw.materials) ? (raw.materials as PrecisionMaterial[]) : [],
    days: numberOr(raw.days, DEFAULTS.days),
    replicates: numberOr(raw.replicates, DEFAULTS.replicates),
    alpha: numberOr(raw.alpha, DEFAULTS.alpha),
    controlLot: typeof raw.controlLot === 'string' ? raw.controlLot : DEFAULTS.controlLot,
  };
}
