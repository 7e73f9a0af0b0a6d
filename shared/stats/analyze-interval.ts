import { progressSpan, type ProgressFn } from './bootstrap';
import { CAUTION } from './comparison-types';
import { dixonRange } from './dixon-range';
import { engineInfo } from './engine';
import { resolveIntervalOptions, type IntervalOptions, type ResolvedIntervalOptions } from './interval-options';
import { partitionField } from './interval-partition';
import type { IntervalResult, IntervalRow } from './interval-types';
import { intervalWarnings } from './interval-warnings';
import { jsonClean } from './json-clean';
import { referenceInterval, type IntervalCore, type LimitResult } from './reference-interval';
import { magnitudeProblem } from './magnitude';
import { narrowerThanStep, resolutionStep, type Resolution } from './resolution';
import type { PartitionResult } from './interval-types';
import { tukeyFences } from './tukey-fences';
import { scaledBoxCox } from './box-cox';

/**
 * Reference-interval establishment: limits by the chosen method with CIs (reference-interval.ts),
 * outlier screening by Tukey's fences (on the Box–Cox scale for the parametric method) and Dixon's
 * D/R > 1/3 rule (flags only), and Harris & Boyd partition testing per field (interval-partition.ts).
 * Row numbers: `outliers` 1-based (row 1 = rows[0]), `outlierIndexes` 0-based; excluded rows are left out.
 * @throws OptionError naming a bad option; RangeError naming a row whose value is not finite
 */
export function analyzeInterval(rows: IntervalRow[], options: IntervalOptions = {}, onProgress?: ProgressFn): IntervalResult {
  rows.forEach((r, i) => {
    if (!Number.isFinite(r.value)) throw new RangeError(`analyzeInterval requires finite values (row ${i + 1})`);
    const problem = magnitudeProblem(r.value);
    if (problem) throw new RangeError(`analyzeInterval: row ${i + 1}: ${problem}`);
  });
  const o = resolveIntervalOptions(options, rows.some((r) => r.group !== undefined && r.group !== ''));
  const included = rows.map((r, i) => ({ r, i })).filter(({ r }) => !r.excluded);
  const values = Float64Array.from(included, ({ r }) => r.value);
  const share = o.partitionFields.length > 0 ? 0.5 : 1;
  const core = referenceInterval(values, o, 'interval', progressSpan(onProgress, 0, share));
  const fit = core.boxCox;
  const screenValues = o.method === 'parametric' && fit ? values.map((v) => scaledBoxCox(v, fit)) : values;
  const tukey = values.length >= 4 ? tukeyFences(screenValues) : { lowerFence: NaN, upperFence: NaN, indexes: [] };
  const dixon = dixonRange(values);
  const toRow = (k: number): number => included[k].i + 1;
  const outlierIndexes = [...new Set([...tukey.indexes, ...dixon])].map((k) => included[k].i).sort((a, b) => a - b);
  const includedRows = included.map(({ r }) => r);
  const partitions = o.partitionFields.map((field, k) =>
    partitionField(includedRows, field, o, progressSpan(onProgress, share + (k * (1 - share)) / o.partitionFields.length, share + ((k + 1) * (1 - share)) / o.partitionFields.length)));
  const warnings = [...core.warnings, ...intervalWarnings(values.length, o, core.lower, core.upper)];
  if (outlierIndexes.length > 0) warnings.push(`Possible outliers flagged at rows ${outlierIndexes.map((i) => i + 1).join(', ')}; exclude only with a documented reason.`);
  for (const p of partitions) {
    if (p.noSpread.length > 0) warnings.push(`By ${p.field}: subgroup ${p.noSpread.join(', ')} has no spread (every value equal), so its SD ratio to the other subgroups is infinite; check the values before trusting a partition.`);
    if (p.recommended) warnings.push(`Harris & Boyd recommend separate intervals by ${p.field}.`);
  }
  onProgress?.(1);
  return jsonClean({
    kind: 'interval',
    n: values.length, nTotal: rows.length, excludedCount: rows.length - values.length,
    method: o.method, percentiles: o.percentiles,
    lower: core.lower, upper: core.upper, boxCoxLambda: core.boxCoxLambda,
    outliers: outlierIndexes.map((i) => i + 1), outlierIndexes,
    outlierScreen: { tukey: { lowerFence: tukey.lowerFence, upperFence: tukey.upperFence, rows: tukey.indexes.map(toRow) }, dixon: { rows: dixon.map(toRow) } },
    partition: partitions.find((p) => p.field === 'group') ?? partitions[0] ?? null,
    partitions,
    settings: o, resolution: intervalResolution(rows.map((r) => r.value), o, core, partitions), warnings, caution: CAUTION,
    engine: engineInfo(o.seed, o.resamples),
  });
}

/** The step of the values and the limits whose CI is narrower than it (resolution.ts). */
function intervalResolution(values: number[], o: ResolvedIntervalOptions, core: IntervalCore, partitions: PartitionResult[]): Resolution {
  const step = resolutionStep([values], o.decimals);
  const limited: string[] = [];
  const check = (name: string, limit: LimitResult | null): void => {
    if (limit && narrowerThanStep(limit.ci, step.increment)) limited.push(name);
  };
  check('lower', core.lower);
  check('upper', core.upper);
  partitions.forEach((p, i) => p.intervals?.forEach((g, k) => {
    check(`partitions.${i}.intervals.${k}.lower`, g.lower);
    check(`partitions.${i}.intervals.${k}.upper`, g.upper);
  }));
  return { ...step, limitedEstimates: limited };
}
