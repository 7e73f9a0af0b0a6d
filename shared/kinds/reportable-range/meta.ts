import * as z from 'zod';
import type { KindMeta } from '../kind';

import { RANGE_LEVELS } from '../../stats/reportable-range-types';
export { RANGE_LEVELS };

const num = (what: string) => z.number({ error: `${what} must be a number` }).finite(`${what} must be a finite number`);

/**
 * One level of a reportable-range study: a material with an assigned value, or a mixture of the low and the
 * high pool with the high pool's fraction (0 = the low pool alone, 1 = the high pool alone). Give one of the two.
 */
export const RangeLevel = z.object({
  name: z.string().trim().min(1, 'Give the level a name').max(60, 'Keep the level name to 60 characters'),
  assigned: num('The assigned value').nullable().default(null),
  fraction: num('The mixing fraction').min(0, 'The mixing fraction must be from 0 to 1').max(1, 'The mixing fraction must be from 0 to 1').nullable().default(null),
}).refine((l) => (l.assigned === null) !== (l.fraction === null), { message: 'Give the level either an assigned value or a mixing fraction, not both', path: ['assigned'] });
export type RangeLevel = z.infer<typeof RangeLevel>;

/** The settings only a reportable-range study has (lots, decimals, resamples and the seed every study carries). */
export const RangeSettings = z.object({
  // A new study may start without levels; submission needs at least 5 (server/kinds/reportable-range).
  levels: z.array(RangeLevel).max(RANGE_LEVELS.most, `At most ${RANGE_LEVELS.most} levels`)
    .refine((ls) => new Set(ls.map((l) => l.name.trim().toLowerCase())).size === ls.length, 'Give each level its own name')
    .default([]),
  /** The assigned values of the low and the high pool, when levels are given as mixing fractions (both or neither). */
  poolLow: num('The low pool\'s value').nullable().default(null),
  poolHigh: num('The high pool\'s value').nullable().default(null),
  replicates: z.number().int().min(1, 'Plan at least 1 replicate a level').max(10, 'At most 10 replicates a level').default(2),
  /** The allowable deviation from linearity at a level: absolute (in the unit) and/or % of the level; the larger applies. */
  allowableNonlinearity: num('The allowable nonlinearity').positive('The allowable nonlinearity must be above 0').nullable().default(null),
  allowableNonlinearityPercent: num('The allowable nonlinearity in %').positive('The allowable nonlinearity in % must be above 0').max(100, 'The allowable nonlinearity in % must be at most 100').nullable().default(null),
  nonlinearitySource: z.string().max(500).default(''),
  /** The measuring interval the manufacturer claims. */
  claimedLow: num('The claimed low end').nullable().default(null),
  claimedHigh: num('The claimed high end').nullable().default(null),
  alpha: z.number().min(0.001, 'α must be at least 0.001').max(0.2, 'α must be at most 0.2').default(0.05),
}).refine((s) => (s.poolLow === null) === (s.poolHigh === null), { message: 'Give both pool values or neither', path: ['poolHigh'] })
  .refine((s) => s.poolLow === null || s.poolHigh === null || s.poolHigh > s.poolLow, { message: 'The high pool\'s value must be above the low pool\'s', path: ['poolHigh'] })
  .refine((s) => s.claimedLow === null || s.claimedHigh === null || s.claimedHigh > s.claimedLow, { message: 'The claimed high end must be above the claimed low end', path: ['claimedHigh'] })
  .refine((s) => s.poolLow !== null || !s.levels.some((l) => l.fraction !== null) || s.levels.every((l) => l.fraction !== null), {
    message: 'Levels given as mixing fractions need both pool values, unless every level is a mixing fraction', path: ['poolLow'],
  });
export type RangeSettings = z.infer<typeof RangeSettings>;

const text = (max: number) => z.union([z.string().max(max), z.number()]).nullable().default(null);

/** One grid row: level, replicate, result. */
export const RangeRowInput = z.object({
  level: text(60),
  replicate: z.union([z.number(), z.string().max(10)]).nullable().default(null),
  value: z.union([z.number(), z.string().max(40), z.null()]),
  excluded: z.boolean().default(false),
  exclusionReason: z.string().max(500).nullable().default(null),
  note: z.string().max(1000).default(''),
});

/** The rules a new reportable-range study starts with (Setup shows them, the server stores them; both take them from here). */
export const RANGE_RULES = {
  outlierRule: 'Flag a level whose replicate variance is the largest by Cochran\'s test (flags only; exclusion needs a reason)',
  acceptanceRule: 'At each level the deviation of the best-fitting polynomial from the straight line lies within the allowable nonlinearity; the verified range is the longest run of such levels',
} as const;

/** Reportable range: linearity and recovery across the claimed measuring interval (CLSI EP06 practice). */
export const reportableRangeMeta = {
  kind: 'reportable-range',
  label: 'Reportable range',
  reportKind: 'Reportable range (linearity and recovery)',
  reportTitle: 'Reportable range verification: study report',
  resultKind: 'reportable-range',
  instruments: 'one',
  verdicts: [
    { key: 'range-verified', tone: 'pass', icon: 'done_all', word: 'Range verified', sentence: 'At every level tested the deviation from linearity lies within the allowable nonlinearity.' },
    { key: 'range-shortened', tone: 'open', icon: 'compress', word: 'Range shortened', sentence: 'The deviation lies within the goal over a run of levels only: the verified range is narrower than the levels tested.' },
    { key: 'range-not-verified', tone: 'fail', icon: 'report', word: 'Range not verified', sentence: 'No run of levels has deviations within the allowable nonlinearity.' },
  ],
  row: RangeRowInput,
  rowFields: [
    { field: 'level', type: 'text', words: 'level', required: true, importHeader: /^(level|sample|pool|dilution|mixture)$/i },
    { field: 'replicate', type: 'integer', words: 'replicate', importHeader: /^(replicate|rep|repeat|no|n)$/i },
    { field: 'value', type: 'result', words: 'result', column: 'value', required: true, importHeader: /^(value|result|concentration)$/i },
  ],
  settings: RangeSettings,
  recordOnly: ['nonlinearitySource'],
  planFields: ['levels', 'poolLow', 'poolHigh', 'replicates', 'allowableNonlinearity', 'allowableNonlinearityPercent', 'nonlinearitySource', 'claimedLow', 'claimedHigh', 'alpha'],
} as const satisfies KindMeta;
