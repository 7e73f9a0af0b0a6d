import * as z from 'zod';
import { CalendarDay } from './common.schema';
import { DECIMAL_MARKS } from './result-text';
import { KIND_METAS, type StudyKindName } from '../kinds/kinds';

/** The kinds' names, from their registry (shared/kinds/kinds.ts). */
export const STUDY_KINDS = KIND_METAS.map((m) => m.kind) as unknown as readonly [StudyKindName, ...StudyKindName[]];
export const StudyKind = z.enum(STUDY_KINDS, { error: `Choose a kind of study: ${KIND_METAS.map((m) => m.kind).join(', ')}` });
export type StudyKind = z.infer<typeof StudyKind>;
export const STUDY_KIND_LABELS = Object.fromEntries(KIND_METAS.map((m) => [m.kind, m.label])) as Record<StudyKind, string>;

export const STUDY_STATES = ['draft', 'awaiting-signoff', 'signed'] as const;
export const StudyState = z.enum(STUDY_STATES);
export type StudyState = z.infer<typeof StudyState>;
export const STUDY_STATE_LABELS: Record<StudyState, string> = { draft: 'Draft', 'awaiting-signoff': 'Awaiting sign-off', signed: 'Signed' };

/** The longest description of a reference population the setup form and the API accept. */
export const POPULATION_MAX = 2000;

const num = (what: string) => z.number({ error: `${what} must be a number` }).finite(`${what} must be a finite number`);
const day = CalendarDay;

/**
 * Every study setting, with its default. A study stores the whole object; which fields matter
 * depends on the kind. The analyte's unit, decimals, decision levels and allowable bias are copied
 * in at creation and may be edited per study.
 */
export const StudySettings = z.object({
  // analysis engine
  resamples: z.number().int().min(1000, 'At least 1,000 resamples').max(200000, 'At most 200,000 resamples').default(10000),
  regressionResamples: z.number().int().min(1000, 'At least 1,000 resamples').max(200000, 'At most 200,000 resamples').default(2000),
  seed: z.string().trim().min(1, 'Give a seed').max(64).default('parallax'),
  confidenceLevel: z.number().min(0.5, 'Confidence level must be at least 0.5').max(0.999, 'Confidence level must be below 1').default(0.95),
  interval: z.enum(['percentile', 'bca']).default('percentile'),
  // entering and importing results: which mark is the decimal ('auto' refuses unclear values such as "1,234")
  decimalMark: z.enum(DECIMAL_MARKS, { error: 'Choose how a decimal mark is read: detect, point or comma' }).default('auto'),
  // method comparison
  differenceType: z.enum(['absolute', 'percent-mean', 'percent-x']).default('absolute'),
  regression: z.enum(['passing-bablok', 'deming', 'weighted-deming', 'ols']).default('passing-bablok'),
  demingRatio: num('Deming error ratio').positive('Deming error ratio must be above 0').default(1),
  loaMultiplier: num('Limits-of-agreement multiplier').positive().max(5).default(1.96),
  esdAlpha: z.number().min(0.001).max(0.2).default(0.05),
  esdMax: z.number().int().min(1).max(100).nullable().default(null),
  unit: z.string().max(30).default(''),
  decimals: z.number().int().min(0).max(6).default(1),
  decisionLevels: z.array(num('A decision level')).max(10).default([]),
  allowableBiasAbsolute: num('Allowable bias').positive().nullable().default(null),
  allowableBiasPercent: num('Allowable bias %').positive().max(100).nullable().default(null),
  allowableBiasSource: z.string().max(500).default(''),
  comparativeLot: z.string().max(100).default(''),
  candidateLot: z.string().max(100).default(''),
  runsFrom: day.nullable().default(null),
  runsTo: day.nullable().default(null),
  plannedSpecimens: z.number().int().min(1).max(10000).nullable().default(null),
  outlierRule: z.string().max(300).default('Generalized ESD on the differences (flags only; exclusion needs a reason)'),
  acceptanceRule: z.string().max(500).default('At each decision level the whole CI of the predicted bias lies within the allowable bias'),
  // reference intervals
  // who the reference individuals are: record-only words (specimens/input-hash.ts), printed as the report's "Reference population"
  populationDescription: z.string().max(POPULATION_MAX, `Keep the description of the reference population to ${POPULATION_MAX.toLocaleString('en-US')} characters`).default(''),
  percentiles: z.array(z.number().gt(0).lt(100)).min(1).max(2).default([2.5, 97.5]),
  intervalMethod: z.enum(['nonparametric', 'robust', 'parametric']).default('nonparametric'),
  partitionFields: z.array(z.enum(['sex', 'ageBand'])).default([]),
  statedLower: num('Stated lower limit').nullable().default(null),
  statedUpper: num('Stated upper limit').nullable().default(null),
  statedSource: z.string().max(500).default(''),
  reagentLot: z.string().max(100).default(''),
});
export type StudySettings = z.infer<typeof StudySettings>;
/** Only the fields given: zod's .partial() would still fill in every default and overwrite stored values. */
const shape = StudySettings.shape;
type Shape = typeof shape;
export const StudySettingsPatch = z.object(
  Object.fromEntries(Object.entries(shape).map(([k, v]) => [k, (v.def.type === 'default' ? ((v as z.ZodDefault).unwrap() as z.ZodType) : (v as z.ZodType)).optional()])) as {
    [K in keyof Shape]: z.ZodOptional<Shape[K] extends z.ZodDefault<infer T> ? T : Shape[K]>;
  },
);
export type StudySettingsPatch = z.infer<typeof StudySettingsPatch>;

const id = z.number().int().positive();
export const CreateStudyBody = z.object({
  kind: StudyKind,
  title: z.string().trim().min(1, 'Give the study a title').max(200),
  purpose: z.string().max(2000).default(''),
  analyteId: id,
  comparativeInstrumentId: id.optional(),
  candidateInstrumentId: id.optional(),
  instrumentId: id.optional(),
  /** The common settings, and the kind's own (shared/kinds/<kind>/meta.ts), which the server checks for the kind. */
  settings: StudySettingsPatch.loose().optional(),
});
export type CreateStudyBody = z.infer<typeof CreateStudyBody>;

export const UpdateStudyBody = z.object({
  version: z.number().int().positive(),
  title: z.string().trim().min(1, 'Give the study a title').max(200).optional(),
  purpose: z.string().max(2000).optional(),
  analyteId: id.optional(),
  comparativeInstrumentId: id.nullable().optional(),
  candidateInstrumentId: id.nullable().optional(),
  instrumentId: id.nullable().optional(),
  settings: StudySettingsPatch.loose().optional(),
  /** Required when the plan was approved and a plan field changes. */
  reason: z.string().max(500).optional(),
});
export type UpdateStudyBody = z.infer<typeof UpdateStudyBody>;

export const Ref = z.object({ id: z.number(), name: z.string() });
export type Ref = z.infer<typeof Ref>;

export const FindingsStatus = z.enum(['none', 'queued', 'running', 'current', 'out-of-date', 'failed']);
export type FindingsStatus = z.infer<typeof FindingsStatus>;

export const StudySummary = z.object({
  id: z.number(),
  kind: StudyKind,
  title: z.string(),
  analyte: Ref,
  instruments: z.string(),
  n: z.number(),
  state: StudyState,
  superseded: z.boolean(),
  findings: FindingsStatus,
  updatedAt: z.string(),
  createdBy: Ref,
});
export type StudySummary = z.infer<typeof StudySummary>;

/**
 * Whether the signed-in person may sign this study now, and who may sign it and why, in words. Computed on the
 * server (`server/signoff/who-may-sign.ts`); the client shows it and never re-derives the rule.
 */
export const MayISign = z.object({ allowed: z.boolean(), why: z.string() });
export type MayISign = z.infer<typeof MayISign>;

export const Study = StudySummary.extend({
  purpose: z.string(),
  analyteUnit: z.string(),
  comparativeInstrument: Ref.nullable(),
  candidateInstrument: Ref.nullable(),
  instrument: Ref.nullable(),
  /** The common settings and the kind's own (shared/kinds/settings.ts). */
  settings: StudySettings.loose(),
  version: z.number(),
  supersedesId: z.number().nullable(),
  supersededById: z.number().nullable(),
  latestAnalysisId: z.number().nullable(),
  currentAnalysisId: z.number().nullable(),
  canBeNegative: z.boolean(),
  createdAt: z.string(),
  returnComment: z.string().nullable(),
  /** The note the technologist sent with the submission now awaiting sign-off (or signed with it); null without one. */
  submissionNote: z.object({ text: z.string(), by: Ref, at: z.string().nullable() }).nullable(),
  /** For the person who asked. */
  mayISign: MayISign,
  /** The release this study belongs to (at most one), and the requirement it meets there; null when none. */
  release: z.object({ id: z.number(), title: z.string(), requirement: z.string() }).nullable(),
});
export type Study = z.infer<typeof Study>;

export const StudyListQuery = z.object({
  kind: StudyKind.optional(),
  analyteId: z.coerce.number().int().positive().optional(),
  instrumentId: z.coerce.number().int().positive().optional(),
  state: StudyState.optional(),
  from: day.optional(),
  to: day.optional(),
  q: z.string().max(200).optional(),
  sort: z.enum(['title', 'updatedAt', 'state', 'kind', 'n']).default('updatedAt'),
  order: z.enum(['asc', 'desc']).default('desc'),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(25),
});
export type StudyListQuery = z.infer<typeof StudyListQuery>;
export const StudyPage = z.object({ items: z.array(StudySummary), total: z.number() });
export type StudyPage = z.infer<typeof StudyPage>;

export const Worklist = z.object({
  drafts: z.array(StudySummary),
  returned: z.array(StudySummary),
  awaitingSignature: z.array(StudySummary),
  recentlySigned: z.array(StudySummary),
});
export type Worklist = z.infer<typeof Worklist>;

export const SignBody = z.object({
  meaning: z.enum(['accepted', 'not-accepted'], { error: 'Choose accepted or not accepted' }),
  comment: z.string().max(2000).default(''),
  password: z.string().min(1, 'Enter your password to sign'),
});
export type SignBody = z.infer<typeof SignBody>;
/** `POST /studies/:id/submit`: an optional note for the director, shown on the review page and in the e-mail. */
export const SUBMISSION_NOTE_MAX = 1000;
export const SubmitBody = z.object({
  note: z.string().trim().max(SUBMISSION_NOTE_MAX, `Keep the note for the director to ${SUBMISSION_NOTE_MAX.toLocaleString('en-US')} characters or fewer`).default(''),
});
export type SubmitBody = z.infer<typeof SubmitBody>;
export const ReturnBody = z.object({ comment: z.string().trim().min(1, 'Say why the study goes back').max(2000) });
export type ReturnBody = z.infer<typeof ReturnBody>;
export const AmendBody = z.object({ reason: z.string().trim().min(1, 'Say why the signed study is amended').max(2000) });
export type AmendBody = z.infer<typeof AmendBody>;
export const PlanApprovalBody = z.object({ comment: z.string().max(2000).default(''), password: z.string().min(1, 'Enter your password to approve') });
export type PlanApprovalBody = z.infer<typeof PlanApprovalBody>;

export const Signature = z.object({
  id: z.number(),
  meaning: z.enum(['plan-approved', 'accepted', 'not-accepted']),
  meaningWords: z.string(),
  signerName: z.string(),
  comment: z.string(),
  signedAt: z.string(),
  contentHash: z.string(),
  verificationCode: z.string(),
  pdfSha256: z.string().nullable(),
  analysisId: z.number().nullable(),
});
export type Signature = z.infer<typeof Signature>;

export const LaboratorySettings = z.object({
  timeZone: z.string().min(1).max(64),
  planApprovalRequired: z.boolean(),
  allowSelfSign: z.boolean(),
});
export type LaboratorySettings = z.infer<typeof LaboratorySettings>;
