import { progressSpan, type ProgressFn } from './bootstrap';
import { harrisBoyd, SD_RATIO_LIMIT, type HarrisBoyd } from './harris-boyd';
import type { PartitionField, ResolvedIntervalOptions } from './interval-options';
import type { IntervalRow, PartitionGroup, PartitionResult } from './interval-types';
import { pointLimits, referenceInterval } from './reference-interval';
import { mean, sampleSd } from './summation';

/**
 * Partition testing of one field (sex, age band, group) by Harris & Boyd (harris-boyd.ts), every pair of
 * subgroups; the field is recommended for partitioning when any pair is. Rows without a value for the
 * field are left out of its test. Per-subgroup limits (with CIs) are computed when partitioning is recommended.
 */
export function partitionField(
  rows: IntervalRow[], field: PartitionField, o: ResolvedIntervalOptions, onProgress?: ProgressFn,
): PartitionResult {
  const byGroup = new Map<string, number[]>();
  for (const row of rows) {
    const key = row[field];
    if (key === undefined || key === null || key === '') continue;
    byGroup.set(String(key), [...(byGroup.get(String(key)) ?? []), row.value]);
  }
  const names = [...byGroup.keys()].sort();
  const summaries = names.map((group) => {
    const v = byGroup.get(group)!;
    return { group, n: v.length, mean: mean(v), sd: v.length > 1 ? sampleSd(v) : null };
  });
  const pairs: HarrisBoyd[] = [];
  for (let i = 0; i < summaries.length; i++) {
    for (let j = i + 1; j < summaries.length; j++) {
      const a = summaries[i];
      const b = summaries[j];
      if (a.sd !== null && b.sd !== null) pairs.push(harrisBoyd({ ...a, sd: a.sd }, { ...b, sd: b.sd }));
    }
  }
  const strength = (p: HarrisBoyd): number => Math.max(p.z / p.zCritical, p.sdRatio / SD_RATIO_LIMIT);
  const head = pairs.reduce<HarrisBoyd | null>((best, p) => (!best || strength(p) > strength(best) ? p : best), null);
  const recommended = pairs.some((p) => p.recommended);
  const groups: PartitionGroup[] = summaries.map((s) => ({ ...s, ...pointLimits(Float64Array.from(byGroup.get(s.group)!), o) }));
  const subgroup = recommended
    ? names.map((group, k) => ({ group, ...referenceInterval(Float64Array.from(byGroup.get(group)!), o,
      `interval:${field}=${group}`, progressSpan(onProgress, k / names.length, (k + 1) / names.length)) }))
    : [];
  return {
    field, z: head?.z ?? null, zCritical: head?.zCritical ?? null, sdRatio: head?.sdRatio ?? null, recommended, pairs, groups,
    noSpread: summaries.filter((g) => g.sd === 0).map((g) => g.group),
    intervals: recommended ? subgroup.map((s) => ({ group: s.group, n: s.n, lower: s.lower, upper: s.upper, warnings: s.warnings })) : null,
  };
}
