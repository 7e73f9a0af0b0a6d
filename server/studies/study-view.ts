import { and, desc, eq, inArray, sql } from 'drizzle-orm';
import { StudySettings, type FindingsStatus, type Study, type StudyKind, type StudyState, type StudySummary } from '../../shared/schemas';
import type { Executor } from '../db/client';
import { analyses, analytes, instruments, specimens, studies, users } from '../db/schema';
import { knownInputHash } from '../specimens/input-hash';
import type { StudyRow } from './studies.repository';

type Findings = { status: FindingsStatus; latestId: number | null; currentId: number | null };

/**
 * Where the findings of each study stand: its latest run, and whether a finished run was made from the
 * current rows and settings (the stored input hash; no row is loaded). Two queries for any number of studies.
 */
export async function findingsOfMany(db: Executor, rows: StudyRow[]): Promise<Map<number, Findings>> {
  const out = new Map<number, Findings>();
  if (!rows.length) return out;
  const hashes = new Map<number, string>();
  for (const r of rows) hashes.set(r.id, await knownInputHash(db, r));
  const ids = rows.map((r) => r.id);
  const latest = await db.selectDistinctOn([analyses.studyId], { studyId: analyses.studyId, id: analyses.id, state: analyses.state, inputHash: analyses.inputHash })
    .from(analyses).where(inArray(analyses.studyId, ids)).orderBy(analyses.studyId, desc(analyses.id));
  const current = await db.selectDistinctOn([analyses.studyId], { studyId: analyses.studyId, id: analyses.id, inputHash: analyses.inputHash })
    .from(analyses)
    .where(and(inArray(analyses.studyId, ids), eq(analyses.state, 'done'), inArray(analyses.inputHash, [...new Set(hashes.values())])))
    .orderBy(analyses.studyId, analyses.inputHash, desc(analyses.id));
  for (const r of rows) {
    const hash = hashes.get(r.id)!;
    const last = latest.find((a) => a.studyId === r.id);
    if (!last) { out.set(r.id, { status: 'none', latestId: null, currentId: null }); continue; }
    const now = current.find((a) => a.studyId === r.id && a.inputHash === hash);
    const status: FindingsStatus =
      last.state === 'queued' || last.state === 'running' ? last.state
        : now ? 'current'
          : last.state === 'failed' && last.inputHash === hash ? 'failed'
            : 'out-of-date';
    out.set(r.id, { status, latestId: last.id, currentId: now?.id ?? null });
  }
  return out;
}

export async function findingsOf(db: Executor, study: StudyRow): Promise<Findings> {
  return (await findingsOfMany(db, [study])).get(study.id)!;
}

/** Study rows → summaries, with analyte, instruments, n and findings status, in a few queries. */
export async function summarise(db: Executor, rows: StudyRow[], findings?: Map<number, Findings>): Promise<StudySummary[]> {
  if (!rows.length) return [];
  const ids = rows.map((r) => r.id);
  // One after another: inside a transaction all queries share one connection.
  const analyteRows = await db.select({ id: analytes.id, name: analytes.name }).from(analytes).where(inArray(analytes.id, rows.map((r) => r.analyteId)));
  const instrumentRows = await db.select({ id: instruments.id, name: instruments.name }).from(instruments).where(eq(instruments.laboratoryId, rows[0].laboratoryId));
  const userRows = await db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, rows.map((r) => r.createdBy)));
  const f = findings ?? (await findingsOfMany(db, rows));
  const fresh = await db.select({ id: studies.id, n: studies.includedCount }).from(studies).where(inArray(studies.id, ids));
  const unknown = fresh.filter((c) => c.n === null).map((c) => c.id);
  if (unknown.length) {
    // A count not yet stored (a concurrent change cleared it): counted from the rows.
    const counted = await db.select({ id: specimens.studyId, n: sql<number>`count(*)::int` }).from(specimens)
      .where(and(inArray(specimens.studyId, unknown), eq(specimens.excluded, false))).groupBy(specimens.studyId);
    for (const c of fresh) if (c.n === null) c.n = counted.find((k) => k.id === c.id)?.n ?? 0;
  }
  const name = (list: { id: number; name: string }[], id: number | null) => list.find((x) => x.id === id)?.name ?? '';
  return rows.map((r) => {
    const inst = r.kind === 'method-comparison'
      ? `${name(instrumentRows, r.comparativeInstrumentId) || '?'} → ${name(instrumentRows, r.candidateInstrumentId) || '?'}`
      : name(instrumentRows, r.instrumentId);
    return {
      id: r.id, kind: r.kind as StudyKind, title: r.title,
      analyte: { id: r.analyteId, name: name(analyteRows, r.analyteId) },
      instruments: inst,
      n: fresh.find((c) => c.id === r.id)?.n ?? 0,
      state: r.state as StudyState,
      superseded: r.supersededById !== null,
      findings: f.get(r.id)!.status,
      updatedAt: r.updatedAt.toISOString(),
      createdBy: { id: r.createdBy, name: name(userRows, r.createdBy) },
    };
  });
}

export async function studyView(db: Executor, row: StudyRow): Promise<Study> {
  const findings = await findingsOfMany(db, [row]);
  const f = findings.get(row.id)!;
  const [summary] = await summarise(db, [row], findings);
  const [analyte] = await db.select().from(analytes).where(eq(analytes.id, row.analyteId));
  const inst = async (id: number | null) =>
    id === null ? null : (await db.select({ id: instruments.id, name: instruments.name }).from(instruments).where(eq(instruments.id, id)))[0] ?? null;
  return {
    ...summary,
    purpose: row.purpose,
    analyteUnit: analyte.unit,
    canBeNegative: analyte.canBeNegative,
    comparativeInstrument: await inst(row.comparativeInstrumentId),
    candidateInstrument: await inst(row.candidateInstrumentId),
    instrument: await inst(row.instrumentId),
    settings: StudySettings.parse(row.settings),
    version: row.version,
    supersedesId: row.supersedesId,
    supersededById: row.supersededById,
    latestAnalysisId: f.latestId,
    currentAnalysisId: f.currentId,
    createdAt: row.createdAt.toISOString(),
    returnComment: row.returnComment,
  };
}

