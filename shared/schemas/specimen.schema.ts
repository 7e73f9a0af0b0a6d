import * as z from 'zod';

/** A result as typed or pasted: a number, a text with decimal point or comma, or empty. */
export const ResultInput = z.union([z.number(), z.string().max(40), z.null()]);

export const ComparisonRowInput = z.object({
  label: z.string().max(100).default(''),
  comparative: ResultInput,
  candidate: ResultInput,
  excluded: z.boolean().default(false),
  exclusionReason: z.string().max(500).nullable().default(null),
  note: z.string().max(1000).default(''),
});
export type ComparisonRowInput = z.input<typeof ComparisonRowInput>;

export const IntervalRowInput = z.object({
  label: z.string().max(100).default(''),
  value: ResultInput,
  sex: z.string().max(20).nullable().default(null),
  ageBand: z.string().max(40).nullable().default(null),
  excluded: z.boolean().default(false),
  exclusionReason: z.string().max(500).nullable().default(null),
  note: z.string().max(1000).default(''),
});
export type IntervalRowInput = z.input<typeof IntervalRowInput>;

export const MAX_ROWS = 10000;
export const PutSpecimensBody = z.object({
  version: z.number().int().positive(),
  rows: z.array(z.record(z.string(), z.unknown())).max(MAX_ROWS, `At most ${MAX_ROWS} rows`),
});
export type PutSpecimensBody = z.infer<typeof PutSpecimensBody>;

/**
 * A stored row, as GET answers it (numbers parsed; the text keeps the reported precision). A kind's own fields
 * without a column (shared/kinds/kind.ts), such as a precision row's material, day and replicate, come beside these.
 */
export const SpecimenRow = z.looseObject({
  position: z.number(),
  label: z.string(),
  comparative: z.number().nullable(),
  candidate: z.number().nullable(),
  value: z.number().nullable(),
  comparativeText: z.string().nullable(),
  candidateText: z.string().nullable(),
  valueText: z.string().nullable(),
  sex: z.string().nullable(),
  ageBand: z.string().nullable(),
  excluded: z.boolean(),
  exclusionReason: z.string().nullable(),
  note: z.string(),
  uploadId: z.number().nullable(),
});
export type SpecimenRow = z.infer<typeof SpecimenRow>;
/**
 * The rows with their version. `warnings`: what the server sees wrong that does not stop saving, e.g. labels that
 * two or more included rows carry ("Labels S01, S07 appear more than once (4 rows); …"); the server always sends it.
 */
export const SpecimenRows = z.object({ version: z.number(), rows: z.array(SpecimenRow), warnings: z.array(z.string()).optional() });
export type SpecimenRows = z.infer<typeof SpecimenRows>;

export const COMPARISON_FIELDS = ['label', 'comparative', 'candidate', 'excluded', 'exclusionReason', 'note'] as const;
export const INTERVAL_FIELDS = ['label', 'value', 'sex', 'ageBand', 'excluded', 'exclusionReason', 'note'] as const;

/**
 * What importing one file column as the specimen label would repeat: rows repeating labels the study already has
 * ("45 rows repeat labels already in the study (…)"), labels repeated within the file ("Labels B1, B2 appear more
 * than once in the file (4 rows)"), and whether the file repeats more than half of the study's distinct labels.
 */
export const LabelCheck = z.object({ warnings: z.array(z.string()), repeatsMostOfStudy: z.boolean() });
export type LabelCheck = z.infer<typeof LabelCheck>;

export const UploadPreview = z.object({
  uploadId: z.number(),
  fileName: z.string(),
  sha256: z.string(),
  columns: z.array(z.string()),
  preview: z.array(z.array(z.string())),
  rowCount: z.number(),
  suggestedMapping: z.record(z.string(), z.string()),
  /** The suggested mapping's warnings: repeated labels (labelChecks of its label column), then the fields left unmapped. */
  warnings: z.array(z.string()),
  /** Per column, what importing it as the specimen label would repeat; a column that repeats nothing is left out. */
  labelChecks: z.record(z.string(), LabelCheck),
  /** "append" when the study has rows, unless the suggested label column repeats most of them; then "replace". */
  suggestedMode: z.enum(['replace', 'append']),
});
export type UploadPreview = z.infer<typeof UploadPreview>;

export const ImportBody = z.object({
  version: z.number().int().positive(),
  mapping: z.record(z.string(), z.string().min(1)),
  mode: z.enum(['replace', 'append']),
});
export type ImportBody = z.infer<typeof ImportBody>;
