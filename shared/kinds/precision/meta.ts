import * as z from 'zod';
import type { KindMeta } from '../kind';

const num = (what: string) => z.number({ error: `${what} must be a number` }).finite(`${what} must be a finite number`);

/** One material (level) of a precision study with the manufacturer's claims, and an assigned value where one is known. */
export const PrecisionMaterial = z.object({
  name: z.string().trim().min(1, 'Give the material a name').max(100, 'Keep the material name to 100 characters'),
  claimRepeatability: num('The repeatability claim').positive('The repeatability claim must be above 0'),
  claimWithinLab: num('The within-laboratory claim').positive('The within-laboratory claim must be above 0'),
  claimAs: z.enum(['sd', 'cv'], { error: 'Say whether the claims are SDs or CVs' }),
  assignedValue: num('The assigned value').nullable().default(null),
  assignedUncertainty: num('The standard uncertainty of the assigned value').min(0, 'The standard uncertainty cannot be negative').nullable().default(null),
  assignedSource: z.string().max(300).default(''),
}).refine((m) => m.claimWithinLab >= m.claimRepeatability, { message: 'The within-laboratory claim cannot be smaller than the repeatability claim', path: ['claimWithinLab'] })
  .refine((m) => m.assignedUncertainty === null || m.assignedValue !== null, { message: 'Give the assigned value with its uncertainty', path: ['assignedValue'] });
export type PrecisionMaterial = z.infer<typeof PrecisionMaterial>;

/** The settings only a precision study has (the others, such as the lots and the outlier rule, every study carries). */
export const PrecisionSettings = z.object({
  // A new study may start without materials; submission needs at least one (server/kinds/precision).
  materials: z.array(PrecisionMaterial).max(6, 'At most 6 materials')
    .refine((ms) => new Set(ms.map((m) => m.name.trim().toLowerCase())).size === ms.length, 'Give each material its own name')
    .default([]),
  days: z.number().int().min(2, 'Plan at least 2 days').max(60, 'At most 60 days').default(5),
  replicates: z.number().int().min(2, 'Plan at least 2 replicates a day').max(20, 'At most 20 replicates a day').default(5),
  alpha: z.number().min(0.001, 'α must be at least 0.001').max(0.2, 'α must be at most 0.2').default(0.05),
  controlLot: z.string().max(100).default(''),
});
export type PrecisionSettings = z.infer<typeof PrecisionSettings>;

const text = (max: number) => z.union([z.string().max(max), z.number()]).nullable().default(null);

/** One grid row: material, day (a date or a run number), replicate, result. */
export const PrecisionRowInput = z.object({
  material: text(100),
  day: text(40),
  replicate: z.union([z.number(), z.string().max(10)]).nullable().default(null),
  value: z.union([z.number(), z.string().max(40), z.null()]),
  excluded: z.boolean().default(false),
  exclusionReason: z.string().max(500).nullable().default(null),
  note: z.string().max(1000).default(''),
});

/** The rules a new precision study starts with (Setup shows them, the server stores them; both take them from here). */
export const PRECISION_RULES = {
  outlierRule: 'Flag a replicate more than 5.5 repeatability SDs (computed without it) from the mean of its day\'s other results (flags only; exclusion needs a reason)',
  acceptanceRule: 'Each SD within its claim, or within the upper verification limit of the claim (α adjusted for the number of materials)',
} as const;

/** Precision verification: days × replicates per material, against the manufacturer's claims. */
export const precisionMeta = {
  kind: 'precision',
  label: 'Precision verification',
  reportKind: 'Precision verification (days × replicates)',
  reportTitle: 'Precision verification: study report',
  resultKind: 'precision',
  instruments: 'one',
  verdicts: [
    { key: 'claims-verified', tone: 'pass', icon: 'task_alt', word: 'Claims verified', sentence: 'Every repeatability and within-laboratory SD lies within its claim or its upper verification limit.' },
    { key: 'claims-not-verified', tone: 'fail', icon: 'error', word: 'Claim not verified', sentence: 'At least one SD lies above the upper verification limit of its claim.' },
  ],
  row: PrecisionRowInput,
  rowFields: [
    { field: 'material', type: 'text', words: 'material', required: true, importHeader: /^(material|level|control|sample)$/i },
    { field: 'day', type: 'text', words: 'day', required: true, importHeader: /^(day|date|run|run date)$/i },
    { field: 'replicate', type: 'integer', words: 'replicate', importHeader: /^(replicate|rep|repeat|no|n)$/i },
    { field: 'value', type: 'result', words: 'result', column: 'value', required: true, importHeader: /^(value|result|concentration)$/i },
  ],
  settings: PrecisionSettings,
  recordOnly: ['controlLot'],
  planFields: ['materials', 'days', 'replicates', 'alpha'],
} as const satisfies KindMeta;
