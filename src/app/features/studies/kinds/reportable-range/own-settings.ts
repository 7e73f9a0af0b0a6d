import { RangeSettings, type RangeLevel } from '@shared/kinds/reportable-range/meta';

/** A reportable-range study's own settings (shared/kinds/reportable-range/meta.ts), stored beside the common ones. */
export type RangeOwn = RangeSettings;

const DEFAULTS = RangeSettings.parse({});

const numberOr = <T extends number | null>(value: unknown, fallback: T): number | T => (typeof value === 'number' && Number.isFinite(value) ? value : fallback);
const levelOf = (raw: unknown): RangeLevel => {
  const l = (raw ?? {}) as Partial<Record<keyof RangeLevel, unknown>>;
  return { name: typeof l.name === 'string' ? l.name : '', assigned: numberOr(l.assigned, null), fraction: numberOr(l.fraction, null) };
};

/**
 * Reads a reportable-range study's own settings from its settings object (the API answers them beside the common ones;
 * the shared StudySettings type does not list them), with the kind's defaults for any that are missing.
 */
export function rangeOwn(settings: object): RangeOwn {
  const raw = settings as Partial<Record<keyof RangeOwn, unknown>>;
  return {
    levels: Array.isArray(raw.levels) ? raw.levels.map(levelOf) : [],
    poolLow: numberOr(raw.poolLow, DEFAULTS.poolLow),
    poolHigh: numberOr(raw.poolHigh, DEFAULTS.poolHigh),
    replicates: numberOr(raw.replicates, DEFAULTS.replicates),
    allowableNonlinearity: numberOr(raw.allowableNonlinearity, DEFAULTS.allowableNonlinearity),
    allowableNonlinearityPercent: numberOr(raw.allowableNonlinearityPercent, DEFAULTS.allowableNonlinearityPercent),
    nonlinearitySource: typeof raw.nonlinearitySource === 'string' ? raw.nonlinearitySource : DEFAULTS.nonlinearitySource,
    claimedLow: numberOr(raw.claimedLow, DEFAULTS.claimedLow),
    claimedHigh: numberOr(raw.claimedHigh, DEFAULTS.claimedHigh),
    alpha: numberOr(raw.alpha, DEFAULTS.alpha),
  };
}

/** A level's value from the pools, for the Setup form's hint and the plan: the engine's own rule (null unless all three are given). */
export { mixtureValue as pooledValue } from '@shared/stats/reportable-range-options';
