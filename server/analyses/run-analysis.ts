import { analyzeComparison } from '../../shared/stats/analyze-comparison';
import { analyzeInterval } from '../../shared/stats/analyze-interval';
import { CAUTION } from '../../shared/stats/comparison-types';
import { engineInfo } from '../../shared/stats/engine';
import { magnitudeProblem } from '../../shared/stats/magnitude';
import { verifyInterval } from '../../shared/stats/verify-interval';
import { StudySettings } from '../../shared/schemas';
import { repeatedLabels, repeatedLabelsSentence } from '../../shared/types/repeated-labels';
import type { AnalysisInput } from '../specimens/input-hash';

export type Progress = (fraction: number) => void;

type Row = AnalysisInput['rows'][number];
const has = (v: number | null): v is number => v !== null && Number.isFinite(v);

/** Rows that cannot enter an analysis: an included row with an empty result. */
export function missingResults(input: AnalysisInput): string[] {
  const fields = input.kind === 'method-comparison' ? (['comparative', 'candidate'] as const) : (['value'] as const);
  const out: string[] = [];
  for (const r of input.rows) {
    if (r.excluded) continue;
    for (const f of fields) if (!has(r[f])) out.push(`row ${r.position}: the ${f === 'value' ? 'value' : `${f} result`} is empty; fill it or exclude the row with a reason`);
  }
  return out;
}

/** Results (excluded ones too: the sensitivity run uses them) the engine cannot compute with (magnitude.ts), named by grid row and field. */
export function outOfRangeResults(input: AnalysisInput): string[] {
  const fields = input.kind === 'method-comparison' ? (['comparative', 'candidate'] as const) : (['value'] as const);
  const out: string[] = [];
  for (const r of input.rows) {
    for (const f of fields) {
      const v = r[f];
      const problem = has(v) ? magnitudeProblem(v) : null;
      if (problem) out.push(`row ${r.position}: the ${f === 'value' ? 'value' : `${f} result`} ${problem}`);
    }
  }
  return out;
}

/**
 * The result with a first warning naming the labels two or more analysed (included) rows carry, when any do
 * (repeated-labels.ts): "Labels S01, S07 appear more than once among the analysed rows (4 rows): …".
 */
export function withRepeatedLabels<T extends { warnings: string[] }>(result: T, used: Row[]): T {
  const repeats = repeatedLabelsSentence(repeatedLabels(used), ' among the analysed rows');
  if (!repeats) return result;
  const warning = `${repeats}: a specimen entered twice counts twice in every estimate; check the labels, or exclude the extra rows with a reason.`;
  return { ...result, warnings: [warning, ...result.warnings] };
}

/** Maps 1-based analysed-row numbers back to the grid's row positions. */
const toPositions = (numbers: number[], used: Row[]) => numbers.map((k) => used[k - 1]?.position).filter((p): p is number => p !== undefined);

function comparison(input: AnalysisInput, onProgress: Progress) {
  const s = StudySettings.parse(input.settings);
  const used = input.rows.filter((r) => has(r.comparative) && has(r.candidate));
  const result = analyzeComparison(
    used.map((r) => ({ x: r.comparative!, y: r.candidate!, label: r.label || undefined, excluded: r.excluded, exclusionReason: r.exclusionReason ?? undefined })),
    {
      resamples: s.resamples, regressionResamples: s.regressionResamples, seed: s.seed, level: s.confidenceLevel, interval: s.interval,
      loaMultiplier: s.loaMultiplier, difference: s.differenceType, regression: s.regression, demingRatio: s.demingRatio,
      decisionLevels: s.decisionLevels, allowableBias: s.allowableBiasAbsolute ?? undefined, allowableBiasPercent: s.allowableBiasPercent ?? undefined,
      esdAlpha: s.esdAlpha, esdMax: s.esdMax ?? undefined, decimals: s.decimals,
    },
    onProgress,
  );
  return { ...withRepeatedLabels(result, used), outlierPositions: toPositions(result.outliers, used) };
}

function establish(input: AnalysisInput, onProgress: Progress) {
  const s = StudySettings.parse(input.settings);
  const used = input.rows.filter((r) => has(r.value));
  const result = analyzeInterval(
    used.map((r) => ({ value: r.value!, label: r.label || undefined, sex: r.sex ?? undefined, ageBand: r.ageBand ?? undefined, excluded: r.excluded, exclusionReason: r.exclusionReason ?? undefined })),
    { resamples: s.resamples, seed: s.seed, level: s.confidenceLevel, method: s.intervalMethod, percentiles: s.percentiles, partitionFields: s.partitionFields, decimals: s.decimals },
    onProgress,
  );
  return { ...withRepeatedLabels(result, used), outlierPositions: toPositions(result.outliers, used) };
}

function verify(input: AnalysisInput) {
  const s = StudySettings.parse(input.settings);
  if (s.statedLower === null || s.statedUpper === null) throw new Error('Give the stated lower and upper limits in Setup before running the analysis');
  const used = input.rows.filter((r) => !r.excluded && has(r.value));
  const result = verifyInterval(used.map((r) => r.value!), { lower: s.statedLower, upper: s.statedUpper }, s.decimals);
  const outsidePositions = used.filter((r) => r.value! < s.statedLower! || r.value! > s.statedUpper!).map((r) => r.position);
  return { ...withRepeatedLabels(result, used), excludedCount: input.rows.length - used.length, outsidePositions, stated: { lower: s.statedLower, upper: s.statedUpper, source: s.statedSource }, caution: CAUTION, engine: engineInfo(s.seed, s.resamples) };
}

/** Runs the statistics engine for one stored input (called in a worker thread). */
export function runAnalysis(input: AnalysisInput, onProgress: Progress = () => {}): unknown {
  const missing = missingResults(input);
  if (missing.length) throw new Error(missing[0]);
  const outOfRange = outOfRangeResults(input);
  if (outOfRange.length) throw new Error(outOfRange[0]);
  switch (input.kind) {
    case 'method-comparison':
      return comparison(input, onProgress);
    case 'interval-establish':
      return establish(input, onProgress);
    case 'interval-verify':
      return verify(input);
    default:
      throw new Error(`Studies of kind ${input.kind} cannot be analysed by this engine version`);
  }
}
