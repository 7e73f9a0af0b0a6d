import { eq, sql } from 'drizzle-orm';
import { StudySettings, type FindingsStatus, type Study, type StudyKind, type StudyState, type StudySummary } from '../../shared/schemas';
import type { Executor } from '../db/client';
import { analyses, analytes, instruments, users } from '../db/schema';
import { knownInput } from '../specimens/input-hash';
import type { StudyRow } from './studies.repository';

type Findings = { status: FindingsStatus; latestId: number | null; currentId: number | null };
type Known = Map<number, { hash: string; included: number }>;

const intArray = (v: number[]) => `{${v.join(',')}}`;

/** Each study's input hash and included count: stored on the study (computed and stored where not yet known). */
async function knownInputs(db: Executor, rows: StudyRow[]): Promise<Known> {
  const out: Known = new Map();
  for (const r of rows) out.set(r.id, r.inputHash && r.includedCount !== null ? { hash: r.inputHash, included: r.includedCount } : await knownInput(db, r));
  return out;
}

/**
 * Where the findings of each study stand: its latest run, and whether a finished run was made from the
 * current rows and settings (the stored input hash; no row is loaded). One query for any number of studies.
 */
async function findingsFor(db: Executor, ids: number[], known: Known): Promise<Map<number, Findings>> {
  const out = new Map<number, Findings>();
  if (!ids.length) return out;
  const { rows } = await db.execute<{ studyId: number; latestId: number | null; latestState: string | null; latestHash: string | null; currentId: number | null }>(sql`
    SELECT s.id AS "studyId", l.id AS "latestId", l.state AS "latestState", l.input_hash AS "latestHash",
           (SELECT c.id FROM ${analyses} c WHERE c.study_id = s.id AND c.state = 'done' AND c.input_hash = s.hash ORDER BY c.id DESC LIMIT 1) AS "currentId"
      FROM unnest(${intArray(ids)}::int[], ${`{${ids.map((id) => known.get(id)!.hash).join(',')}}`}::text[]) AS s(id, hash)
      LEFT JOIN LATERAL (SELECT a.id, a.state, a.input_hash FROM ${analyses} a WHERE a.study_id = s.id ORDER BY a.id DESC LIMIT 1) l ON true`);
  for (const r of rows) {
    if (r.latestId === null) { out.set(r.studyId, { status: 'none', latestId: null, currentId: null }); continue; }
    const status: FindingsStatus =
      r.latestState === 'queued' || r.latestState === 'running' ? r.latestState
        : r.currentId !== null ? 'current'
          : r.latestState === 'failed' && r.latestHash === known.get(r.studyId)!.hash ? 'failed'
            : 'out-of-date';
    out.set(r.studyId, { status, latestId: r.latestId, currentId: r.currentId });
  }
  return out;
}

export async function findingsOfMany(db: Executor, rows: StudyRow[]): Promise<Map<number, Findings>> {
  return findingsFor(db, rows.map((r) => r.id), await knownInputs(db, rows));
}

export async function findingsOf(db: Executor, study: StudyRow): Promise<Findings> {
  return (await findingsOfMany(db, [study])).get(study.id)!;
}

/** The names a summary shows (analytes, the laboratory's instruments, creators), in one query. */
async function namesFor(db: Executor, rows: StudyRow[]) {
  const { rows: names } = await db.execute<{ kind: 'analyte' | 'instrument' | 'user'; id: number; name: string }>(sql`
    SELECT 'analyte' AS kind, id, name FROM ${analytes} WHERE id = ANY(${intArray(rows.map((r) => r.analyteId))}::int[])
    UNION ALL SELECT 'instrument', id, name FROM ${instruments} WHERE laboratory_id = ${rows[0].laboratoryId}
    UNION ALL SELECT 'user', id, name FROM ${users} WHERE id = ANY(${intArray(rows.map((r) => r.createdBy))}::int[])`);
  const of = (kind: string) => new Map(names.filter((n) => n.kind === kind).map((n) => [n.id, n.name]));
  return { analytes: of('analyte'), instruments: of('instrument'), users: of('user') };
}

interface Summarised { summaries: StudySummary[]; findings: Map<number, Findings>; instruments: Map<number, string> }

async function summariseAll(db: Executor, rows: StudyRow[]): Promise<Summarised> {
  if (!rows.length) return { summaries: [], findings: new Map(), instruments: new Map() };
  // One after another: inside a transaction all queries share one connection.
  const known = await knownInputs(db, rows);
  const names = await namesFor(db, rows);
  const findings = await findingsFor(db, rows.map((r) => r.id), known);
  const name = (map: Map<number, string>, id: number | null) => (id === null ? '' : map.get(id) ?? '');
  const summaries = rows.map((r): StudySummary => ({
    id: r.id, kind: r.kind as StudyKind, title: r.title,
    analyte: { id: r.analyteId, name: name(names.analytes, r.analyteId) },
    instruments: r.kind === 'method-comparison'
      ? `${name(names.instruments, r.comparativeInstrumentId) || '?'} → ${name(names.instruments, r.candidateInstrumentId) || '?'}`
      : name(names.instruments, r.instrumentId),
    n: known.get(r.id)!.included,
    state: r.state as StudyState,
    superseded: r.supersededById !== null,
    findings: findings.get(r.id)!.status,
    updatedAt: r.updatedAt.toISOString(),
    createdBy: { id: r.createdBy, name: name(names.users, r.createdBy) },
  }));
  return { summaries, findings, instruments: names.instruments };
}

/** Study rows → summaries, with analyte, instruments, n and findings status, in three queries whatever their number. */
export async function summarise(db: Executor, rows: StudyRow[]): Promise<StudySummary[]> {
  return (await summariseAll(db, rows)).summaries;
}

export async function studyView(db: Executor, row: StudyRow): Promise<Study> {
  const { summaries: [summary], findings, instruments: lab } = await summariseAll(db, [row]);
  const f = findings.get(row.id)!;
  const [analyte] = await db.select({ unit: analytes.unit, canBeNegative: analytes.canBeNegative }).from(analytes).where(eq(analytes.id, row.analyteId));
  const inst = (id: number | null) => (id === null || !lab.has(id) ? null : { id, name: lab.get(id)! });
  return {
    ...summary,
    purpose: row.purpose,
    analyteUnit: analyte.unit,
    canBeNegative: analyte.canBeNegative,
    comparativeInstrument: inst(row.comparativeInstrumentId),
    candidateInstrument: inst(row.candidateInstrumentId),
    instrument: inst(row.instrumentId),
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
