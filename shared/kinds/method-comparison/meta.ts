import { ComparisonRowInput } from '../../schemas/specimen.schema';
import type { KindMeta } from '../kind';
import type { ComparisonResult } from '../../stats/comparison-types';
import { COMPARISON_STUDY_VERDICTS } from '../../text/verdict-words';
import { MethodComparisonSettings } from './sample-plan';

/** Method comparison: the same specimens on the comparative and the candidate method. */
export const methodComparisonMeta = {
  kind: 'method-comparison',
  label: 'Method comparison',
  reportKind: 'Method comparison',
  reportTitle: 'Method comparison: verification report',
  // The engine's name of its result (stored in every result; the CLI's engine command): tied to the engine's type.
  resultKind: 'comparison' satisfies ComparisonResult['kind'],
  instruments: 'pair',
  // Within goal / Inconclusive / Exceeds goal: the words of the decision-level verdicts (shared/text/verdict-words.ts).
  verdicts: COMPARISON_STUDY_VERDICTS,
  row: ComparisonRowInput,
  settings: MethodComparisonSettings,
  // The plan before data: approved with the plan, read by no analysis.
  recordOnly: ['samplePlan'],
  planFields: ['samplePlan'],
  rowFields: [
    { field: 'label', type: 'text', words: 'specimen label', column: 'label' },
    { field: 'comparative', type: 'result', words: 'comparative result', column: 'comparative', required: true, importHeader: /(comparative|current|reference|old|^x$)/i },
    { field: 'candidate', type: 'result', words: 'candidate result', column: 'candidate', required: true, importHeader: /(candidate|new|test|^y$)/i },
  ],
} as const satisfies KindMeta;
