import * as z from 'zod';
import { CalendarDay } from './common.schema';
import { MayISign, Ref, StudyKind, StudyState } from './study.schema';

/**
 * A release: one change to a method (a new system, a new reagent lot, a relocated instrument, or a change the
 * director describes) for one analyte and instrument, the studies its change type requires, waivers with reasons,
 * and the director's one signature that releases the method for patient testing (or does not). Routes under
 * `/api/v1/releases`; the laboratory's templates under `/api/v1/release-templates`; due items under `/api/v1/due`.
 */

export const CHANGE_TYPES = ['new-system', 'reagent-lot', 'relocation', 'custom'] as const;
export const ChangeType = z.enum(CHANGE_TYPES, { error: `Choose a change type: ${CHANGE_TYPES.join(', ')}` });
export type ChangeType = z.infer<typeof ChangeType>;
export const CHANGE_TYPE_LABELS: Record<ChangeType, string> = {
  'new-system': 'New measuring system',
  'reagent-lot': 'New reagent lot',
  relocation: 'Relocated instrument',
  custom: 'Other change (the director picks the requirements)',
};

export const RELEASE_STATES = ['open', 'released', 'not-released', 'needs-review'] as const;
export const ReleaseState = z.enum(RELEASE_STATES);
export type ReleaseState = z.infer<typeof ReleaseState>;
export const RELEASE_STATE_LABELS: Record<ReleaseState, string> = {
  open: 'Open',
  released: 'Released for patient testing',
  'not-released': 'Not released',
  'needs-review': 'Needs review',
};

export const RELEASE_MEANINGS = ['released', 'not-released'] as const;
export const ReleaseMeaning = z.enum(RELEASE_MEANINGS, { error: 'Choose released or not released' });
export type ReleaseMeaning = z.infer<typeof ReleaseMeaning>;
export const RELEASE_MEANING_WORDS: Record<ReleaseMeaning, string> = {
  released: 'Released for patient testing',
  'not-released': 'Not released for patient testing',
};

const key = z.string().trim().regex(/^[a-z][a-z0-9-]{0,39}$/, 'Use lower-case letters, digits and hyphens (up to 40), starting with a letter');
const KEY_MAX = 40;

/**
 * A key for a new row, made from its label and unlike every key in `taken`: lower-case letters, digits and
 * hyphens, starting with a letter, at most 40 characters ("Method comparison" → "method-comparison").
 */
export function keyFrom(label: string, taken: ReadonlySet<string>, fallback = 'item'): string {
  let base = label.toLowerCase().normalize('NFKD').replace(/[\u0300-\u036f]/g, '').replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '');
  if (!/^[a-z]/.test(base)) base = base ? `${fallback}-${base}` : fallback;
  base = base.slice(0, KEY_MAX).replace(/-+$/, '');
  let key = base;
  for (let n = 2; taken.has(key); n++) {
    const suffix = `-${n}`;
    key = `${base.slice(0, KEY_MAX - suffix.length).replace(/-+$/, '')}${suffix}`;
  }
  return key;
}

const words = (what: string, max: number) => z.string().trim().min(1, `Give ${what}`).max(max, `Keep ${what} to ${max} characters`);

/** One study a change type requires: met by a signed study of any of `kinds`. `rule` names the rule it follows. */
export const Requirement = z.object({
  key,
  label: words('the requirement a name', 120),
  kinds: z.array(StudyKind).min(1, 'Name at least one kind of study that meets it').max(5),
  rule: z.string().trim().max(500, 'Keep the rule to 500 characters').default(''),
});
export type Requirement = z.infer<typeof Requirement>;

/** A re-verification a release sets due, `months` after its go-live date. */
export const DueRule = z.object({
  key,
  label: words('the re-verification a name', 120),
  months: z.number({ error: 'Months must be a number' }).int('Months must be a whole number').min(1, 'At least 1 month').max(60, 'At most 60 months'),
  rule: z.string().trim().max(500, 'Keep the rule to 500 characters').default(''),
  /** The kinds of study that re-verify it (a study started from the due item is one of these); empty: any kind. */
  kinds: z.array(StudyKind).max(5).default([]),
});
export type DueRule = z.infer<typeof DueRule>;

const unique = <T extends { key: string }>(list: T[], ctx: z.RefinementCtx, path: string) => {
  list.forEach((item, i) => {
    if (list.findIndex((o) => o.key === item.key) !== i) ctx.addIssue({ code: 'custom', path: [path, i, 'key'], message: `The key "${item.key}" is used twice` });
  });
};

/** The laboratory's template of a change type (the administrator keeps them). */
export const ReleaseTemplate = z.object({
  changeType: ChangeType,
  label: z.string(),
  requirements: z.array(Requirement),
  dueRules: z.array(DueRule),
  version: z.number(),
  updatedAt: z.string().nullable(),
});
export type ReleaseTemplate = z.infer<typeof ReleaseTemplate>;

export const UpdateTemplateBody = z.object({
  version: z.number().int().min(0),
  requirements: z.array(Requirement).max(12, 'At most 12 requirements'),
  dueRules: z.array(DueRule).max(12, 'At most 12 re-verification rules'),
}).superRefine((b, ctx) => { unique(b.requirements, ctx, 'requirements'); unique(b.dueRules, ctx, 'dueRules'); });
export type UpdateTemplateBody = z.infer<typeof UpdateTemplateBody>;

const id = z.number({ error: 'Choose one' }).int().positive();

export const CreateReleaseBody = z.object({
  changeType: ChangeType,
  title: words('the release a title', 200),
  analyteId: id,
  instrumentId: id,
  /** The instrument compared against (a new system's current one, a lot change's own instrument); optional. */
  comparativeInstrumentId: id.nullable().optional(),
  reagentLot: z.string().trim().max(100).default(''),
  note: z.string().trim().max(2000).default(''),
  /** A custom change's requirements; only a director picks them (other change types take the template's). */
  requirements: z.array(Requirement.omit({ key: true }).extend({ key: key.optional() })).max(12).optional(),
  /** The due item this release answers (it is marked as started by this release). */
  dueItemId: id.optional(),
});
export type CreateReleaseBody = z.infer<typeof CreateReleaseBody>;

export const UpdateReleaseBody = z.object({
  version: z.number().int().positive(),
  title: words('the release a title', 200).optional(),
  reagentLot: z.string().trim().max(100).optional(),
  note: z.string().trim().max(2000).optional(),
  requirements: z.array(Requirement.omit({ key: true }).extend({ key: key.optional() })).max(12).optional(),
});
export type UpdateReleaseBody = z.infer<typeof UpdateReleaseBody>;

/** `POST /releases/:id/studies`: link an existing study to a requirement, or start a new draft study for it. */
export const LinkStudyBody = z.union([
  z.object({ requirement: key, studyId: id }),
  z.object({ requirement: key, start: z.object({ kind: StudyKind, title: words('the study a title', 200).optional() }) }),
]);
export type LinkStudyBody = z.infer<typeof LinkStudyBody>;

export const WaiverBody = z.object({
  requirement: key,
  reason: words('the reason for the waiver', 1000),
});
export type WaiverBody = z.infer<typeof WaiverBody>;

export const ReleaseSignBody = z.object({
  meaning: ReleaseMeaning,
  goLiveDate: CalendarDay.nullable().default(null),
  comment: z.string().trim().max(2000).default(''),
  password: z.string().min(1, 'Enter your password to sign'),
});
export type ReleaseSignBody = z.infer<typeof ReleaseSignBody>;

/** Where a requirement stands. */
export const REQUIREMENT_STATUSES = ['missing', 'in-progress', 'met', 'not-met', 'waived'] as const;
export const RequirementStatus = z.enum(REQUIREMENT_STATUSES);
export type RequirementStatus = z.infer<typeof RequirementStatus>;
export const REQUIREMENT_STATUS_LABELS: Record<RequirementStatus, string> = {
  missing: 'Missing',
  'in-progress': 'In progress',
  met: 'Met',
  'not-met': 'Not accepted',
  waived: 'Waived',
};

/** The study that meets (or is to meet) a requirement, as the board shows it. */
export const ComponentStudy = z.object({
  id: z.number(),
  kind: StudyKind,
  title: z.string(),
  state: StudyState,
  superseded: z.boolean(),
  verdict: z.string().nullable(),
  verdictWord: z.string().nullable(),
  verdictSentence: z.string().nullable(),
  n: z.number(),
  signerName: z.string().nullable(),
  signedAt: z.string().nullable(),
  meaning: z.string().nullable(),
  verificationCode: z.string().nullable(),
  contentHash: z.string().nullable(),
});
export type ComponentStudy = z.infer<typeof ComponentStudy>;

export const Waiver = z.object({ requirement: z.string(), reason: z.string(), by: Ref, at: z.string() });
export type Waiver = z.infer<typeof Waiver>;

export const BoardRequirement = Requirement.extend({
  status: RequirementStatus,
  /** The study now meeting it (the newest linked one that is not superseded), or null. */
  study: ComponentStudy.nullable(),
  /** Every study linked to it, newest first (an amended study and its amendment both stay linked). */
  linked: z.array(ComponentStudy),
  waiver: Waiver.nullable(),
});
export type BoardRequirement = z.infer<typeof BoardRequirement>;

export const ReleaseSignature = z.object({
  id: z.number(),
  meaning: ReleaseMeaning,
  meaningWords: z.string(),
  signerName: z.string(),
  signedAt: z.string(),
  goLiveDate: z.string().nullable(),
  comment: z.string(),
  contentHash: z.string(),
  verificationCode: z.string(),
  pdfSha256: z.string().nullable(),
});
export type ReleaseSignature = z.infer<typeof ReleaseSignature>;

export const DUE_STATES = ['open', 'started', 'done'] as const;
export const DueState = z.enum(DUE_STATES);
export type DueState = z.infer<typeof DueState>;

/** A re-verification a release set due. `status` is as of the laboratory's today. */
export const DueItem = z.object({
  id: z.number(),
  releaseId: z.number(),
  releaseTitle: z.string(),
  analyte: Ref,
  instrument: Ref,
  ruleKey: z.string(),
  label: z.string(),
  rule: z.string(),
  /** The kinds of study that re-verify it (from the release's rule); empty: any kind. */
  kinds: z.array(StudyKind),
  dueDate: z.string(),
  state: DueState,
  status: z.enum(['overdue', 'due-soon', 'later', 'started', 'done']),
  /** Whole days from the laboratory's today to the due date (negative: overdue), and in words ("overdue by 12 days"). */
  daysLeft: z.number(),
  dueWords: z.string(),
  /** What was started from it (a release or a study), when something was. */
  startedRelease: Ref.nullable(),
  startedStudy: Ref.nullable(),
  version: z.number(),
});
export type DueItem = z.infer<typeof DueItem>;

export const DueQuery = z.object({
  status: z.enum(['all', 'pending', 'overdue']).default('pending'),
  releaseId: z.coerce.number().int().positive().optional(),
});
export type DueQuery = z.infer<typeof DueQuery>;

export const UpdateDueBody = z.object({
  version: z.number().int().positive(),
  dueDate: CalendarDay,
  reason: words('the reason for the new date', 500),
});
export type UpdateDueBody = z.infer<typeof UpdateDueBody>;

/** `POST /due/:id/start`: start a study from a due item (linked to it); a release is started with `dueItemId` on create. */
export const StartFromDueBody = z.object({ kind: StudyKind, title: words('the study a title', 200).optional() });
export type StartFromDueBody = z.infer<typeof StartFromDueBody>;

export const ReleaseSummary = z.object({
  id: z.number(),
  changeType: ChangeType,
  title: z.string(),
  analyte: Ref,
  instrument: Ref,
  reagentLot: z.string(),
  state: ReleaseState,
  met: z.number(),
  required: z.number(),
  signerName: z.string().nullable(),
  signedAt: z.string().nullable(),
  goLiveDate: z.string().nullable(),
  verificationCode: z.string().nullable(),
  createdBy: Ref,
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type ReleaseSummary = z.infer<typeof ReleaseSummary>;

export const Release = ReleaseSummary.extend({
  comparativeInstrument: Ref.nullable(),
  note: z.string(),
  version: z.number(),
  requirements: z.array(BoardRequirement),
  waivers: z.array(Waiver),
  /** Every requirement is met by a signed study or waived: the release may be signed. */
  ready: z.boolean(),
  /** What keeps it from being signed, in words (empty when ready). */
  blockers: z.array(z.string()),
  signatures: z.array(ReleaseSignature),
  due: z.array(DueItem),
  /** Why it needs review (the amended component), when it does. */
  reviewReasons: z.array(z.string()),
  fromDueItem: z.object({ id: z.number(), label: z.string() }).nullable(),
  mayISign: MayISign,
  caution: z.string(),
});
export type Release = z.infer<typeof Release>;

export const ReleaseQuery = z.object({
  q: z.string().max(200).optional(),
  changeType: ChangeType.optional(),
  state: ReleaseState.optional(),
  analyteId: z.coerce.number().int().positive().optional(),
  instrumentId: z.coerce.number().int().positive().optional(),
  signerId: z.coerce.number().int().positive().optional(),
  signedFrom: CalendarDay.optional(),
  signedTo: CalendarDay.optional(),
  createdFrom: CalendarDay.optional(),
  createdTo: CalendarDay.optional(),
  sort: z.enum(['title', 'signedAt', 'createdAt', 'state', 'changeType']).default('createdAt'),
  order: z.enum(['asc', 'desc']).default('desc'),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(25),
});
export type ReleaseQuery = z.infer<typeof ReleaseQuery>;
export const ReleasePage = z.object({ items: z.array(ReleaseSummary), total: z.number() });
export type ReleasePage = z.infer<typeof ReleasePage>;

/** The release's integrity re-check: its own content hash and PDF, and every component study's re-check. */
export const ReleaseIntegrityReport = z.object({
  releaseId: z.number(),
  passed: z.boolean(),
  checks: z.array(z.object({ name: z.string(), passed: z.boolean(), detail: z.string() })),
  components: z.array(z.object({ requirement: z.string(), studyId: z.number(), passed: z.boolean(), checks: z.array(z.object({ name: z.string(), passed: z.boolean(), detail: z.string() })) })),
  checkedAt: z.string(),
});
export type ReleaseIntegrityReport = z.infer<typeof ReleaseIntegrityReport>;

/** The caution every release page, e-mail and PDF carries. */
export const RELEASE_CAUTION = 'Parallax is decision support. Releasing a method for patient testing is the laboratory director\'s judgement, '
  + 'and acceptance follows local accreditation rules (CLIA/CAP, ISO 15189 or national rules); the findings hold only for the specimen types, '
  + 'range, population and lots studied.';
