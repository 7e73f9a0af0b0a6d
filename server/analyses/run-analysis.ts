import { serverKind } from '../kinds';
import type { Progress } from '../kinds/kind';
import type { AnalysisInput } from '../specimens/input-hash';
import { missingResults, outOfRangeResults } from './analysis-rows';
import { planComparison } from '@shared/stats/plan-comparison';
import { isPlanInput, type PlanInput } from '../plans/plan-input';

export type { Progress } from '../kinds/kind';
export { missingResults, outOfRangeResults, withRepeatedLabels } from './analysis-rows';

/**
 * Runs the statistics engine for one stored input (called in a worker thread): the kind's own analysis
 * (server/kinds), or the simulation of a plan (server/plans).
 */
export function runAnalysis(input: AnalysisInput | PlanInput, onProgress: Progress = () => {}): unknown {
  if (isPlanInput(input)) return planComparison(input.plan, onProgress);
  const missing = missingResults(input);
  if (missing.length) throw new Error(missing[0]);
  const outOfRange = outOfRangeResults(input);
  if (outOfRange.length) throw new Error(outOfRange[0]);
  return serverKind(input.kind).analyse(input, onProgress);
}
