import * as z from 'zod';
import { KIND_METAS } from '../kinds/kinds';

type VerdictKey = (typeof KIND_METAS)[number]['verdicts'][number]['key'];
import { CalendarDay } from './common.schema';
import { StudyKind, StudyState } from './study.schema';

const day = CalendarDay;

export const HistoryEvent = z.object({
  id: z.number(), at: z.string(), userId: z.number().nullable(), userName: z.string().nullable(), studyId: z.number().nullable(),
  action: z.string(), entity: z.string(), headline: z.string(), details: z.array(z.string()),
});
export type HistoryEvent = z.infer<typeof HistoryEvent>;
export const HistoryPage = z.object({ items: z.array(HistoryEvent), total: z.number() });
export type HistoryPage = z.infer<typeof HistoryPage>;

export const AuditQuery = z.object({
  userId: z.coerce.number().int().positive().optional(),
  studyId: z.coerce.number().int().positive().optional(),
  action: z.string().max(60).optional(),
  from: day.optional(),
  to: day.optional(),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(500).default(50),
});
export type AuditQuery = z.infer<typeof AuditQuery>;

/** Every kind's overall verdicts (shared/kinds/<kind>/meta.ts), as the archive filters them. */
export const VERDICTS = KIND_METAS.flatMap((m) => m.verdicts.map((v) => v.key)) as unknown as readonly [VerdictKey, ...VerdictKey[]];
export const OverallVerdict = z.enum(VERDICTS);
export type OverallVerdict = z.infer<typeof OverallVerdict>;

export const ArchiveQuery = z.object({
  kind: StudyKind.optional(),
  analyteId: z.coerce.number().int().positive().optional(),
  instrumentId: z.coerce.number().int().positive().optional(),
  state: StudyState.optional(),
  verdict: OverallVerdict.optional(),
  signerId: z.coerce.number().int().positive().optional(),
  signedFrom: day.optional(),
  signedTo: day.optional(),
  createdFrom: day.optional(),
  createdTo: day.optional(),
  q: z.string().max(200).optional(),
  sort: z.enum(['title', 'signedAt', 'createdAt', 'state', 'kind']).default('createdAt'),
  order: z.enum(['asc', 'desc']).default('desc'),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(500).default(25),
});
export type ArchiveQuery = z.infer<typeof ArchiveQuery>;

export const ArchiveItem = z.object({
  id: z.number(), kind: StudyKind, title: z.string(), analyte: z.string(), instruments: z.string(), state: StudyState,
  verdict: OverallVerdict.nullable(), signerId: z.number().nullable(), signerName: z.string().nullable(), meaning: z.string().nullable(), signedAt: z.string().nullable(),
  createdAt: z.string(), superseded: z.boolean(), supersedesId: z.number().nullable(), n: z.number(),
});
export type ArchiveItem = z.infer<typeof ArchiveItem>;
export const ArchivePage = z.object({ items: z.array(ArchiveItem), total: z.number() });
export type ArchivePage = z.infer<typeof ArchivePage>;

export const CheckResult = z.object({ name: z.string(), passed: z.boolean(), detail: z.string() });
export type CheckResult = z.infer<typeof CheckResult>;
export const IntegrityReport = z.object({ studyId: z.number(), passed: z.boolean(), checks: z.array(CheckResult), checkedAt: z.string() });
export type IntegrityReport = z.infer<typeof IntegrityReport>;
/** `POST /api/v1/audit/chain-check`: the laboratory's history chain and the chain of events with no laboratory. */
export const ChainCheckReport = z.object({ passed: z.boolean(), checks: z.array(CheckResult), checkedAt: z.string() });
export type ChainCheckReport = z.infer<typeof ChainCheckReport>;

export const FieldDifference = z.object({ path: z.string(), stored: z.unknown(), recomputed: z.unknown() });
export const ReproduceReport = z.object({
  studyId: z.number(), analysisId: z.number(), identical: z.boolean(), storedEngine: z.string(), currentEngine: z.string(),
  sameEngine: z.boolean(), fieldsCompared: z.number(), differences: z.array(FieldDifference), summary: z.string(),
});
export type ReproduceReport = z.infer<typeof ReproduceReport>;

/** GET /api/v1/people: the laboratory's users by name, for filters (no e-mail, roles or state). */
export const Person = z.object({ id: z.number(), name: z.string() });
export type Person = z.infer<typeof Person>;
