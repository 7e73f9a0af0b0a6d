import { kindMeta } from '@shared/kinds/kinds';
import { parseKindSettings } from '@shared/kinds/settings';
import { eq, sql } from 'drizzle-orm';
import { StudySettings, type FindingsStatus, type Study, type StudyKind, type StudyState, type StudySummary } from '@shared/schemas';
import type { Executor } from '../db/client';
import { analyses, analytes, instruments, releaseStudies, releases, users } from '../db/schema';
import type { SignedInUser } from '../auth/session-user';
import { mayISign } from '../signoff/who-may-sign';
import { submissionNoteOf } from '../signoff/submission-note';
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

type FindingsRow = { studyId: number; latestId: number | null; latestState: string | null; latestHash: string | null; currentId: number | null };

/**
 * Where the findings of each study stand: its latest run, and whether a finished run was made from the
 * current rows and settings (the stored input hash; no row is loaded).
 */
const findingsSql = (ids: number[], known: Known) => sql`
  SELECT s.id AS "studyId", l.id AS "latestId", l.state AS "latestState", l.input_hash AS "latestHash",
         (SELECT c.id FROM ${analyses} c WHERE c.study_id = s.id AND c.purpose = 'findings' AND c.state = 'done' AND c.input_hash = s.hash ORDER BY c.id DESC LIMIT 1) AS "currentId"
    FROM unnest(${intArray(ids)}::int[], ${`{${ids.map((id) => known.get(id)!.hash).join(',')}}`}::text[]) AS s(id, hash)
    LEFT JOIN LATERAL (SELECT a.id, a.state, a.input_hash FROM ${analyses} a WHERE a.study_id = s.id AND a.purpose = 'findings' ORDER BY a.id DESC LIMIT 1) l ON true`;

function findingsFrom(rows: FindingsRow[], known: Known): Map<number, Findings> {
  const out = new Map<number, Findings>();
  for (const r of rows) {
    if (r.latestId === null) { out.set(r.studyId, { status: 'none', latestId: null, currentId: null }); continue; }
    const status: FindingsStatus =
      r.latestState === 'queued' || r.latestState === 'running' ? (r.latestState as FindingsStatus)
        : r.currentId !== null ? 'current'
          : r.latestState === 'failed' && r.latestHash === known.get(r.studyId)!.hash ? 'failed'
            : 'out-of-date';
    out.set(r.studyId, { status, latestId: r.latestId, currentId: r.currentId });
  }
  return out;
}

export async function findingsOfMany(db: Executor, rows: StudyRow[]): Promise<Map<number, Findings>> {
  if (!rows.length) return new Map();
  const known = await knownInputs(db, rows);
  const { rows: found } = await db.execute<FindingsRow>(findingsSql(rows.map((r) => r.id), known));
  return findingsFrom(found, known);
}

export async function findingsOf(db: Executor, study: StudyRow): Promise<Findings> {
  return (await findingsOfMany(db, [study])).get(study.id)!;
}

type Named = { id: number; name: string };
type AnalyteNamed = Named & { unit: string; canBeNegative: boolean };

interface Summarised { summaries: StudySummary[]; findings: Map<number, Findings>; instruments: Map<number, string>; analytes: Map<number, AnalyteNamed> }

/**
 * Summaries with the names they show (analytes with their unit, the laboratory's instruments, creators) and
 * where their findings stand, in one statement whatever the number of studies: each part a JSON aggregate.
 */
async function summariseAll(db: Executor, rows: StudyRow[]): Promise<Summarised> {
  if (!rows.length) return { summaries: [], findings: new Map(), instruments: new Map(), analytes: new Map() };
  const known = await knownInputs(db, rows);
  const { rows: [parts] } = await db.execute<{ analytes: AnalyteNamed[]; instruments: Named[]; users: Named[]; findings: FindingsRow[] }>(sql`
    SELECT
      (SELECT coalesce(json_agg(json_build_object('id', id, 'name', name, 'unit', unit, 'canBeNegative', can_be_negative)), '[]')
         FROM ${analytes} WHERE id = ANY(${intArray(rows.map((r) => r.analyteId))}::int[])) AS analytes,
      (SELECT coalesce(json_agg(json_build_object('id', id, 'name', name)), '[]') FROM ${instruments} WHERE laboratory_id = ${rows[0].laboratoryId}) AS instruments,
      (SELECT coalesce(json_agg(json_build_object('id', id, 'name', name)), '[]') FROM ${users} WHERE id = ANY(${intArray(rows.map((r) => r.createdBy))}::int[])) AS users,
      (SELECT coalesce(json_agg(f), '[]') FROM (${findingsSql(rows.map((r) => r.id), known)}) f) AS findings`);
  const byId = <T extends Named>(list: T[]) => new Map(list.map((n) => [n.id, n]));
  const analyteMap = byId(parts.analytes);
  const instrumentNames = new Map(parts.instruments.map((n) => [n.id, n.name]));
  const userNames = new Map(parts.users.map((n) => [n.id, n.name]));
  const findings = findingsFrom(parts.findings, known);
  const name = (map: Map<number, string>, id: number | null) => (id === null ? '' : map.get(id) ?? '');
  const summaries = rows.map((r): StudySummary => ({
    id: r.id, kind: r.kind as StudyKind, title: r.title,
    analyte: { id: r.analyteId, name: analyteMap.get(r.analyteId)?.name ?? '' },
    instruments: kindMeta(r.kind).instruments === 'pair'
      ? `${name(instrumentNames, r.comparativeInstrumentId) || '?'} → ${name(instrumentNames, r.candidateInstrumentId) || '?'}`
      : name(instrumentNames, r.instrumentId),
    n: known.get(r.id)!.included,
    state: r.state as StudyState,
    superseded: r.supersededById !== null,
    findings: findings.get(r.id)!.status,
    updatedAt: r.updatedAt.toISOString(),
    createdBy: { id: r.createdBy, name: name(userNames, r.createdBy) },
  }));
  return { summaries, findings, instruments: instrumentNames, analytes: analyteMap };
}

/** Study rows → summaries, with analyte, instruments, n and findings status, in one statement whatever their number. */
export async function summarise(db: Executor, rows: StudyRow[]): Promise<StudySummary[]> {
  return (await summariseAll(db, rows)).summaries;
}

/** One study as the API answers it, for the person who asked (`mayISign` is theirs). */
export async function studyView(db: Executor, row: StudyRow, me: SignedInUser): Promise<Study> {
  const { allowed, why } = await mayISign(db, me, row);
  const { summaries: [summary], findings, instruments: lab, analytes: named } = await summariseAll(db, [row]);
  const f = findings.get(row.id)!;
  const analyte = named.get(row.analyteId)!;
  const inst = (id: number | null) => (id === null || !lab.has(id) ? null : { id, name: lab.get(id)! });
  return {
    ...summary,
    purpose: row.purpose,
    analyteUnit: analyte.unit,
    canBeNegative: analyte.canBeNegative,
    comparativeInstrument: inst(row.comparativeInstrumentId),
    candidateInstrument: inst(row.candidateInstrumentId),
    instrument: inst(row.instrumentId),
    settings: parseKindSettings(row.kind, row.settings),
    version: row.version,
    supersedesId: row.supersedesId,
    supersededById: row.supersededById,
    latestAnalysisId: f.latestId,
    currentAnalysisId: f.currentId,
    createdAt: row.createdAt.toISOString(),
    returnComment: row.returnComment,
    submissionNote: await submissionNoteOf(db, row),
    mayISign: { allowed, why },
    release: await releaseOf(db, row.id),
  };
}

/** The release a study belongs to, and the requirement it meets there (by its label). */
async function releaseOf(db: Executor, studyId: number): Promise<Study['release']> {
  const [link] = await db.select({ id: releases.id, title: releases.title, key: releaseStudies.requirementKey, requirements: releases.requirements })
    .from(releaseStudies).innerJoin(releases, eq(releases.id, releaseStudies.releaseId)).where(eq(releaseStudies.studyId, studyId));
  if (!link) return null;
  const requirement = (link.requirements as { key: string; label: string }[]).find((r) => r.key === link.key)?.label ?? link.key;
  return { id: link.id, title: link.title, requirement };
}
