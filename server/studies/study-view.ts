import { and, desc, eq, inArray, sql } from 'drizzle-orm';
import { StudySettings, type FindingsStatus, type Study, type StudyKind, type StudyState, type StudySummary } from '../../shared/schemas';
import type { Executor } from '../db/client';
import { analyses, analytes, instruments, specimens, studies, users } from '../db/schema';
import { studyInputHash } from '../specimens/input-hash';
import type { StudyRow } from './studies.repository';

/** Where the findings stand: the latest run, and whether it was made from the current rows and settings. */
export async function findingsOf(db: Executor, study: StudyRow): Promise<{ status: FindingsStatus; latestId: number | null; currentId: number | null }> {
  const runs = await db.select({ id: analyses.id, state: analyses.state, inputHash: analyses.inputHash })
    .from(analyses).where(eq(analyses.studyId, study.id)).orderBy(desc(analyses.id)).limit(20);
  if (!runs.length) return { status: 'none', latestId: null, currentId: null };
  const hash = await studyInputHash(db, study);
  const current = runs.find((r) => r.state === 'done' && r.inputHash === hash);
  const latest = runs[0];
  const status: FindingsStatus =
    latest.state === 'queued' || latest.state === 'running' ? latest.state
      : current ? 'current'
        : latest.state === 'failed' && latest.inputHash === hash ? 'failed'
          : 'out-of-date';
  return { status, latestId: latest.id, currentId: current?.id ?? null };
}

/** Study rows → summaries, with analyte, instruments, n and findings status, in a few queries. */
export async function summarise(db: Executor, rows: StudyRow[]): Promise<StudySummary[]> {
  if (!rows.length) return [];
  const ids = rows.map((r) => r.id);
  // One after another: inside a transaction all queries share one connection.
  const analyteRows = await db.select({ id: analytes.id, name: analytes.name }).from(analytes).where(inArray(analytes.id, rows.map((r) => r.analyteId)));
  const instrumentRows = await db.select({ id: instruments.id, name: instruments.name }).from(instruments).where(eq(instruments.laboratoryId, rows[0].laboratoryId));
  const userRows = await db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, rows.map((r) => r.createdBy)));
  const counts = await db.select({ studyId: specimens.studyId, n: sql<number>`count(*)::int` }).from(specimens)
    .where(and(inArray(specimens.studyId, ids), eq(specimens.excluded, false))).groupBy(specimens.studyId);
  const name = (list: { id: number; name: string }[], id: number | null) => list.find((x) => x.id === id)?.name ?? '';
  const out: StudySummary[] = [];
  for (const r of rows) {
    const inst = r.kind === 'method-comparison'
      ? `${name(instrumentRows, r.comparativeInstrumentId) || '?'} → ${name(instrumentRows, r.candidateInstrumentId) || '?'}`
      : name(instrumentRows, r.instrumentId);
    out.push({
      id: r.id, kind: r.kind as StudyKind, title: r.title,
      analyte: { id: r.analyteId, name: name(analyteRows, r.analyteId) },
      instruments: inst,
      n: counts.find((c) => c.studyId === r.id)?.n ?? 0,
      state: r.state as StudyState,
      superseded: r.supersededById !== null,
      findings: (await findingsOf(db, r)).status,
      updatedAt: r.updatedAt.toISOString(),
      createdBy: { id: r.createdBy, name: name(userRows, r.createdBy) },
    });
  }
  return out;
}

export async function studyView(db: Executor, row: StudyRow): Promise<Study> {
  const [summary] = await summarise(db, [row]);
  const [analyte] = await db.select().from(analytes).where(eq(analytes.id, row.analyteId));
  const inst = async (id: number | null) =>
    id === null ? null : (await db.select({ id: instruments.id, name: instruments.name }).from(instruments).where(eq(instruments.id, id)))[0] ?? null;
  const f = await findingsOf(db, row);
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

