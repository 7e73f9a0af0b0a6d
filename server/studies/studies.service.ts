import { asc, desc, eq, ilike, or, sql, SQL } from 'drizzle-orm';
import { StudySettings, type CreateStudyBody, type Study, type StudyListQuery, type StudyPage, type UpdateStudyBody, type Worklist } from '@shared/schemas';
import { recordAudit } from '../audit/audit';
import { actorOf, SignedInUser } from '../auth/session-user';
import type { Database, Tx } from '../db/client';
import { inLabDays } from '../db/lab-zone';
import { scopeOf } from '../db/lab-scope';
import { specimens, studies } from '../db/schema';
import { invalid } from '../http/app-error';
import { bumpVersion, findLabAnalyte, findLabInstrument, findStudy, studyPage, worklistRows } from './studies.repository';
import { fieldWords } from '@shared/types/audit-words';
import { assertEditable } from './study-rules';
import { initialSettings, planFieldsOf } from './study-settings';
import { kindMeta } from '@shared/kinds/kinds';
import { ownSettingKeys, parseKindSettings, type KindSettings } from '@shared/kinds/settings';
import { AppError } from '../http/app-error';
import * as z from 'zod';
import { studyView, summarise } from './study-view';
import { storeInputHash } from '../specimens/input-hash';
import { signableBy } from '../signoff/who-may-sign';

/** Two reagent lots compared on one instrument (a lot change): both lots given, and different. */
const twoLots = (settings: unknown): boolean => {
  const s = (settings ?? {}) as { comparativeLot?: unknown; candidateLot?: unknown };
  return typeof s.comparativeLot === 'string' && typeof s.candidateLot === 'string' && s.comparativeLot.trim() !== '' && s.candidateLot.trim() !== '' && s.comparativeLot.trim() !== s.candidateLot.trim();
};

async function checkRefs(tx: Tx, me: SignedInUser, kind: string, ids: { analyteId?: number; comparativeInstrumentId?: number | null; candidateInstrumentId?: number | null; instrumentId?: number | null }, settings?: unknown) {
  if (ids.analyteId !== undefined && !(await findLabAnalyte(tx, scopeOf(me), ids.analyteId))) throw invalid('analyteId', 'Choose an analyte from the catalog');
  for (const field of ['comparativeInstrumentId', 'candidateInstrumentId', 'instrumentId'] as const) {
    const id = ids[field];
    if (id !== undefined && id !== null && !(await findLabInstrument(tx, scopeOf(me), id))) throw invalid(field, 'Choose an instrument from the catalog');
  }
  if (kindMeta(kind).instruments === 'pair' && ids.comparativeInstrumentId && ids.comparativeInstrumentId === ids.candidateInstrumentId && !twoLots(settings)) {
    throw invalid('candidateInstrumentId', 'The candidate instrument must differ from the comparative one, unless two reagent lots are compared on it (give both lots)');
  }
}

export async function createStudy(db: Database, me: SignedInUser, body: CreateStudyBody): Promise<Study> {
  return db.transaction((tx) => createStudyIn(tx, me, body));
}

/** Creates a study in the caller's transaction (a release starts one for a requirement in its own). */
export async function createStudyIn(tx: Tx, me: SignedInUser, body: CreateStudyBody): Promise<Study> {
  await checkRefs(tx, me, body.kind, body, body.settings);
  const pair = kindMeta(body.kind).instruments === 'pair';
  if (pair && (!body.comparativeInstrumentId || !body.candidateInstrumentId)) {
    throw invalid(body.comparativeInstrumentId ? 'candidateInstrumentId' : 'comparativeInstrumentId', `A ${kindMeta(body.kind).label.toLowerCase()} needs a comparative and a candidate instrument`);
  }
  if (!pair && !body.instrumentId) throw invalid('instrumentId', 'Choose the instrument');
  const analyte = (await findLabAnalyte(tx, scopeOf(me), body.analyteId))!;
  const [row] = await tx.insert(studies).values(scopeOf(me).values({
    kind: body.kind, title: body.title, purpose: body.purpose, analyteId: body.analyteId,
    comparativeInstrumentId: body.comparativeInstrumentId ?? null, candidateInstrumentId: body.candidateInstrumentId ?? null,
    instrumentId: body.instrumentId ?? null, settings: checkedSettings(() => initialSettings(body.kind, analyte, body.settings)), createdBy: me.id,
  })).returning();
  await recordAudit(tx, actorOf(me), { action: 'study.created', entity: 'study', entityId: row.id, studyId: row.id, after: { ...body, settings: row.settings } });
  await storeInputHash(tx, row.id);
  return studyView(tx, (await findStudy(tx, scopeOf(me), row.id))!, me);
}

export async function updateStudy(db: Database, me: SignedInUser, id: number, body: UpdateStudyBody): Promise<Study> {
  return db.transaction(async (tx) => {
    const study = await findStudy(tx, scopeOf(me), id, true);
    assertEditable(study);
    await checkRefs(tx, me, study.kind, body, { ...(study.settings as object), ...(body.settings ?? {}) });
    const { version, settings: given, reason, ...fields } = body;
    const settings = given && knownSettings(study.kind, given);
    const merged = settings ? checkedSettings(() => parseKindSettings(study.kind, { ...(study.settings as object), ...settings })) : undefined;
    const moved = planChanges(study, merged);
    if (moved.length && !reason?.trim()) {
      throw invalid('reason', `The plan was approved; give a reason for changing the ${moved.map((m) => fieldWords(m.field)).join(', the ')}`);
    }
    let updated = await bumpVersion(tx, study, version, { ...fields, ...(merged ? { settings: merged } : {}) });
    if (merged) {
      await storeInputHash(tx, id);
      updated = await findStudy(tx, scopeOf(me), id);
    }
    const changed = (Object.keys(fields) as (keyof typeof fields)[]).filter((k) => fields[k] !== undefined);
    await recordAudit(tx, actorOf(me), {
      action: 'study.updated', entity: 'study', entityId: id, studyId: id, reason: reason ?? null,
      before: pick(study, changed, settings && Object.keys(settings)),
      after: pick(updated, changed, settings && Object.keys(settings)),
    });
    if (moved.length) {
      const rowsEntered = (await tx.select({ id: specimens.id }).from(specimens).where(eq(specimens.studyId, id)).limit(1)).length > 0;
      await recordAudit(tx, actorOf(me), {
        action: 'study.plan-amended', entity: 'study', entityId: id, studyId: id, reason: reason!.trim(),
        before: Object.fromEntries(moved.map((m) => [m.field, m.from])), after: { ...Object.fromEntries(moved.map((m) => [m.field, m.to])), afterData: rowsEntered },
      });
    }
    return studyView(tx, updated, me);
  });
}

/** Only the settings the kind knows (the common ones and its own); others are dropped, as zod drops unknown keys. */
function knownSettings(kind: string, given: Record<string, unknown>): Record<string, unknown> {
  const known = new Set([...Object.keys(StudySettings.shape), ...ownSettingKeys(kind)]);
  return Object.fromEntries(Object.entries(given).filter(([k]) => known.has(k)));
}

/**
 * Settings parsed for the study's kind; a kind's own setting that fails its schema (shared/kinds/<kind>/meta.ts)
 * answers 400 naming it ("settings.materials.0.claimRepeatability: The repeatability claim must be above 0").
 */
function checkedSettings(parse: () => KindSettings): KindSettings {
  try {
    return parse();
  } catch (error) {
    if (!(error instanceof z.ZodError)) throw error;
    const issues = error.issues.map((e) => ({ path: ['settings', ...e.path].join('.'), message: `${['settings', ...e.path].join('.')}: ${e.message}` }));
    throw new AppError('invalid_request', issues[0].message, issues);
  }
}

/** Plan fields whose value changes after the director approved the plan. */
function planChanges(study: typeof studies.$inferSelect, merged: KindSettings | undefined) {
  if (!study.planApprovedAt || !merged) return [];
  const before = study.settings as Record<string, unknown>;
  return planFieldsOf(study.kind).filter((f) => JSON.stringify(before[f] ?? null) !== JSON.stringify((merged as Record<string, unknown>)[f] ?? null))
    .map((f) => ({ field: f, from: before[f] ?? null, to: (merged as Record<string, unknown>)[f] ?? null }));
}

const pick = (row: typeof studies.$inferSelect, fields: string[], settingKeys?: string[]) => ({
  ...Object.fromEntries(fields.map((f) => [f, (row as Record<string, unknown>)[f]])),
  ...(settingKeys ? { settings: Object.fromEntries(settingKeys.map((k) => [k, (row.settings as Record<string, unknown>)[k]])) } : {}),
});

export async function getStudy(db: Database, me: SignedInUser, id: number): Promise<Study> {
  return studyView(db, await findStudy(db, scopeOf(me), id), me);
}

const SORT = { title: studies.title, updatedAt: studies.updatedAt, state: studies.state, kind: studies.kind } as const;

export async function listStudies(db: Database, me: SignedInUser, q: StudyListQuery): Promise<StudyPage> {
  const scope = scopeOf(me);
  const where: SQL[] = [];
  if (q.kind) where.push(eq(studies.kind, q.kind));
  if (q.state) where.push(eq(studies.state, q.state));
  if (q.analyteId) where.push(eq(studies.analyteId, q.analyteId));
  if (q.instrumentId) where.push(or(eq(studies.comparativeInstrumentId, q.instrumentId), eq(studies.candidateInstrumentId, q.instrumentId), eq(studies.instrumentId, q.instrumentId))!);
  const days = await inLabDays(db, scope, studies.updatedAt, q);
  if (days) where.push(days);
  if (q.q) where.push(or(ilike(studies.title, `%${escapeLike(q.q)}%`), ilike(studies.purpose, `%${escapeLike(q.q)}%`))!);
  const n = sql<number>`coalesce(${studies.includedCount}, (SELECT count(*) FROM ${specimens} s WHERE s.study_id = ${studies.id} AND NOT s.excluded))`;
  const sortColumn = q.sort === 'n' ? n : SORT[q.sort];
  const { rows, total } = await studyPage(db, scope, where, q.order === 'asc' ? asc(sortColumn) : desc(sortColumn), q.pageSize, (q.page - 1) * q.pageSize);
  return { items: await summarise(db, rows), total };
}

const escapeLike = (s: string) => s.replace(/[\\%_]/g, (c) => `\\${c}`);

export async function worklist(db: Database, me: SignedInUser): Promise<Worklist> {
  // The four lists' studies in one statement (each list newest first, with its own limit), then summarised
  // in one pass; a study is in at most one list, told apart by its state, author and return. "Awaiting my
  // signature" holds only what this person may sign (the sign-off rule, `signableBy`).
  const rows = await worklistRows(db, scopeOf(me), me.id, signableBy(me));
  const all = await summarise(db, rows);
  const part = (keep: (r: (typeof rows)[number]) => boolean) => rows.filter(keep).map((r) => all.find((x) => x.id === r.id)!);
  const mine = (r: (typeof rows)[number]) => r.createdBy === me.id && r.state === 'draft';
  return {
    drafts: part((r) => mine(r) && r.returnedAt === null),
    returned: part((r) => mine(r) && r.returnedAt !== null),
    awaitingSignature: part((r) => r.state === 'awaiting-signoff'),
    recentlySigned: part((r) => r.state === 'signed'),
  };
}

