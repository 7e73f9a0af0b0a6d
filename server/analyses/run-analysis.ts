import { serverKind } from '../kinds';
import type { Progress } from '../kinds/kind';
import type { AnalysisInput } from '../specimens/input-hash';
import { missingResults, outOfRangeResults } from './analysis-rows';

export type { Progress } from '../kinds/kind';
export { missingResults, outOfRangeResults, withRepeatedLabels } from './analysis-rows';

/** Runs the statistics engine for one stored input (called in a worker thread): the kind's own analysis (server/kinds). */
export function runAnalysis(input: AnalysisInput, onProgress: Progress = () => {}): unknown {
  const missing = missingResults(input);
  if (missing.length) throw new Error(missing[0]);
  const outOfRange = outOfRangeResults(input);
  if (outOfRange.length) throw new Error(outOfRange[0]);
  return serverKind(input.kind).analyse(input, onProgress);
}
