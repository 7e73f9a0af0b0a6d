import { IntervalRowInput } from '../../schemas/specimen.schema';
import type { KindMeta, RowField } from '../kind';
import type { IntervalResult } from '../../stats/interval-types';

/** The row fields of both reference-interval kinds: one value per reference individual, with sex and age band. */
export const INTERVAL_ROW_FIELDS = [
  { field: 'label', type: 'text', words: 'individual label', column: 'label' },
  { field: 'value', type: 'result', words: 'value', column: 'value', required: true, importHeader: /^(value|result|concentration)$/i },
  { field: 'sex', type: 'sex', words: 'sex', column: 'sex', emptyIsNull: true, importHeader: /^(sex|gender)$/i },
  { field: 'ageBand', type: 'text', words: 'age band', column: 'ageBand', emptyIsNull: true, importHeader: /^(age.?band|age.?group|age.?range|age)$/i },
] as const satisfies readonly RowField[];

/** Establishing a reference interval from 120 or more reference individuals per partition. */
export const intervalEstablishMeta = {
  kind: 'interval-establish',
  label: 'Reference interval: establish',
  reportKind: 'Reference interval: establishment',
  reportTitle: 'Reference interval establishment: study report',
  // The engine's name of its result (stored in every result; the CLI's engine command): tied to the engine's type.
  resultKind: 'interval' satisfies IntervalResult['kind'],
  instruments: 'one',
  verdicts: [
    { key: 'established', tone: 'record', icon: 'straighten', word: 'Interval established', sentence: 'A reference interval was established from the local results.' },
  ],
  row: IntervalRowInput,
  rowFields: INTERVAL_ROW_FIELDS,
} as const satisfies KindMeta;
