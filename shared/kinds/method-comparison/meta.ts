import { ComparisonRowInput } from '../../schemas/specimen.schema';
import type { KindMeta } from '../kind';
import { MethodComparisonSettings } from './sample-plan';

/** Method comparison: the same specimens on the comparative and the candidate method. */
export const methodComparisonMeta = {
  kind: 'method-comparison',
  label: 'Method comparison',
  reportKind: 'Method comparison',
  reportTitle: 'Method comparison: verification report',
  resultKind: 'comparison',
  instruments: 'pair',
  verdicts: [
    { key: 'within', tone: 'pass', icon: 'check_circle', word: 'Within goal', sentence: 'At every decision level the whole CI of the bias lies within the allowable bias.' },
    { key: 'inconclusive', tone: 'open', icon: 'help', word: 'Inconclusive', sentence: 'At one or more decision levels the CI crosses the allowable bias; these data cannot settle it.' },
    { key: 'exceeds', tone: 'fail', icon: 'cancel', word: 'Exceeds goal', sentence: 'At one or more decision levels the whole CI of the bias lies beyond the allowable bias.' },
  ],
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
