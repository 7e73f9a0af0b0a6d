import { IntervalRowInput } from '../../schemas/specimen.schema';
import { INTERVAL_ROW_FIELDS } from '../interval-establish/meta';
import type { KindMeta } from '../kind';
import type { VerifyIntervalResult } from '../../stats/verify-interval';

/** Verifying a stated reference interval with 20 local individuals (transference). */
export const intervalVerifyMeta = {
  kind: 'interval-verify',
  label: 'Reference interval: verify',
  reportKind: 'Reference interval: verification (transference)',
  reportTitle: 'Reference interval verification: study report',
  // The engine's name of its result (stored in every result; the CLI's engine command): tied to the engine's type.
  resultKind: 'verify-interval' satisfies VerifyIntervalResult['kind'],
  instruments: 'one',
  verdicts: [
    { key: 'accepted', tone: 'pass', icon: 'verified', word: 'Interval fits', sentence: 'Few enough local results fell outside the stated reference interval.' },
    { key: 'failed', tone: 'fail', icon: 'block', word: 'Interval does not fit', sentence: 'Too many local results fell outside the stated reference interval.' },
  ],
  row: IntervalRowInput,
  rowFields: INTERVAL_ROW_FIELDS,
} as const satisfies KindMeta;
