import { eq, getTableColumns } from 'drizzle-orm';
import type { Executor } from '../db/client';
import type { LabScope } from '../db/lab-scope';
import { analyses, studies } from '../db/schema';

/** Every column of an analysis but its input (a copy of all rows, which no reader of an analysis shows). */
const { input: _input, ...withoutInput } = getTableColumns(analyses);

/** An analysis of a study of the scope's laboratory (without its input), with its study's input hash and settings; undefined for another laboratory's. */
export const findLabAnalysis = async (db: Executor, scope: LabScope, id: number) =>
  (await db.select({ a: withoutInput, studyHash: studies.inputHash, settings: studies.settings }).from(analyses).innerJoin(studies, eq(studies.id, analyses.studyId))
    .where(scope.where(studies, eq(analyses.id, id))))[0];

/** An analysis's state and progress, if its study is of the scope's laboratory. */
export const labAnalysisState = async (db: Executor, scope: LabScope, id: number) =>
  (await db.select({ id: analyses.id, studyId: analyses.studyId, state: analyses.state, progress: analyses.progress })
    .from(analyses).innerJoin(studies, eq(studies.id, analyses.studyId))
    .where(scope.where(studies, eq(analyses.id, id))))[0];
