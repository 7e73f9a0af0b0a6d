import type { EngineInfo } from './engine';
import type { HarrisBoyd } from './harris-boyd';
import type { PartitionField, ResolvedIntervalOptions } from './interval-options';
import type { LimitResult } from './reference-interval';
import type { Resolution } from './resolution';

/** One reference value with its optional partition fields. */
export interface IntervalRow {
  value: number;
  label?: string;
  group?: string;
  sex?: string;
  ageBand?: string;
  excluded?: boolean;
  exclusionReason?: string;
}

export interface PartitionGroup {
  group: string;
  n: number;
  mean: number;
  sd: number | null;
  /** Point estimates of the limits by the chosen method (null when not estimable). */
  lower: number | null;
  upper: number | null;
}

export interface PartitionResult {
  field: PartitionField;
  /** The pair of subgroups with the largest z/z* (the headline of a field with more than two groups). */
  z: number | null;
  zCritical: number | null;
  sdRatio: number | null;
  recommended: boolean;
  pairs: HarrisBoyd[];
  groups: PartitionGroup[];
  /** Subgroups whose values are all equal (SD 0); they are tested, with an infinite SD ratio. */
  noSpread: string[];
  /** Full limits with CIs per subgroup, given when partitioning is recommended. */
  intervals: { group: string; n: number; lower: LimitResult | null; upper: LimitResult | null; warnings: string[] }[] | null;
}

export interface IntervalResult {
  kind: 'interval';
  n: number;
  nTotal: number;
  excludedCount: number;
  method: ResolvedIntervalOptions['method'];
  percentiles: number[];
  lower: LimitResult | null;
  upper: LimitResult | null;
  boxCoxLambda: number | null;
  outliers: number[];
  outlierIndexes: number[];
  outlierScreen: { tukey: { lowerFence: number; upperFence: number; rows: number[] }; dixon: { rows: number[] } };
  partition: PartitionResult | null;
  partitions: PartitionResult[];
  settings: ResolvedIntervalOptions;
  /** The reporting step and the limits whose CI is narrower than it (resolution.ts). */
  resolution: Resolution;
  warnings: string[];
  caution: string;
  engine: EngineInfo;
}
