import { and, desc, eq, isNotNull, ne, sql } from 'drizzle-orm';
import { precisionMeta } from '@shared/kinds/precision/meta';
import type { Executor } from '../db/client';
import type { LabScope } from '../db/lab-scope';
import { analyses, instruments, signatures, specimens, studies } from '../db/schema';
import type { StudyRow } from '../studies/studies.repository';

/** The kind of another study of the laboratory, or undefined (none, or another laboratory's). */
export const labStudyKind = async (db: Executor, scope: LabScope, id: number): Promise<string | undefined> =>
  (await db.select({ kind: studies.kind }).from(studies).where(scope.where(studies, eq(studies.id, id))))[0]?.kind;

/** The included comparative values of a study, in row order. */
export const includedComparativeValues = async (db: Executor, studyId: number): Promise<number[]> =>
  (await db.select({ x: specimens.comparative }).from(specimens)
    .where(and(eq(specimens.studyId, studyId), eq(specimens.excluded, false), isNotNull(specimens.comparative))).orderBy(specimens.position)).map((r) => r.x!);

/** The latest plan run of a study, and the latest finished one made from the input with this hash. */
export async function planRuns(db: Executor, study: StudyRow, hash: string | null) {
  const [latest] = await db.select().from(analyses).where(and(eq(analyses.studyId, study.id), eq(analyses.purpose, 'plan'))).orderBy(desc(analyses.id)).limit(1);
  const [current] = hash === null ? [] : await db.select().from(analyses)
    .where(and(eq(analyses.studyId, study.id), eq(analyses.purpose, 'plan'), eq(analyses.state, 'done'), eq(analyses.inputHash, hash))).orderBy(desc(analyses.id)).limit(1);
  return { latest: latest ?? null, current: current ?? null };
}

/** The latest signed, not superseded precision study of the laboratory of this analyte on this instrument, with its signed results. */
export async function latestSignedPrecision(db: Executor, scope: LabScope, analyteId: number, instrumentId: number) {
  const [found] = await db.select({ id: studies.id, title: studies.title, signedAt: studies.signedAt, results: analyses.results, instrument: instruments.name })
    .from(studies)
    .innerJoin(signatures, and(eq(signatures.studyId, studies.id), ne(signatures.meaning, 'plan-approved')))
    .innerJoin(analyses, eq(analyses.id, signatures.analysisId))
    .innerJoin(instruments, eq(instruments.id, studies.instrumentId))
    .where(scope.where(studies, eq(studies.kind, precisionMeta.kind), eq(studies.state, 'signed'),
      eq(studies.analyteId, analyteId), eq(studies.instrumentId, instrumentId), sql`${studies.supersededById} IS NULL`))
    .orderBy(desc(studies.signedAt)).limit(1);
  return found;
}

/** Other studies of the laboratory of this kind and analyte (newest first, at most 50), each with its count of included comparative values. */
export function sameAnalyteStudies(db: Executor, scope: LabScope, study: StudyRow, kind: string) {
  // The outer column written out: in a select list drizzle names it unqualified ("id"), which the subquery would read as its own.
  const n = sql<number>`(SELECT count(*)::int FROM ${specimens} sp WHERE sp.study_id = "studies"."id" AND NOT sp.excluded AND sp.comparative IS NOT NULL)`;
  return db.select({ id: studies.id, title: studies.title, n }).from(studies)
    .where(scope.where(studies, eq(studies.kind, kind), eq(studies.analyteId, study.analyteId), ne(studies.id, study.id)))
    .orderBy(desc(studies.id)).limit(50);
}
