import { and, desc, eq, sql, type SQL } from 'drizzle-orm';
import type { Executor } from '../db/client';
import { analytes, instruments, studies } from '../db/schema';
import type { LabScope } from '../db/lab-scope';
import { AppError } from '../http/app-error';

export type StudyRow = typeof studies.$inferSelect;

/** One study of the caller's laboratory; another laboratory's answers 404. */
export const findStudy = (db: Executor, scope: LabScope, id: number, lock = false): Promise<StudyRow> => scope.oneOr404(db, studies, id, 'Study', lock);

/** Bumps the version only when the caller saw the current one; otherwise 409. */
export async function bumpVersion(db: Executor, study: StudyRow, expected: number, values: Partial<typeof studies.$inferInsert> = {}): Promise<StudyRow> {
  if (study.version !== expected) {
    throw new AppError('conflict', 'Someone else changed this study since you loaded it; reload to see their change', [
      { path: 'version', message: `You have version ${expected}; the study is at version ${study.version}` },
    ]);
  }
  const [row] = await db
    .update(studies)
    .set({ ...values, version: study.version + 1, updatedAt: new Date() })
    .where(and(eq(studies.id, study.id), eq(studies.version, expected)))
    .returning();
  if (!row) {
    throw new AppError('conflict', 'Someone else changed this study at the same moment; reload to see their change', [
      { path: 'version', message: `You have version ${expected}; the study has moved on` },
    ]);
  }
  return row;
}

export const findLabAnalyte = async (db: Executor, scope: LabScope, id: number) =>
  (await db.select().from(analytes).where(scope.where(analytes, eq(analytes.id, id))))[0];

export const findLabInstrument = async (db: Executor, scope: LabScope, id: number) =>
  (await db.select().from(instruments).where(scope.where(instruments, eq(instruments.id, id))))[0];

/** A page of the laboratory's studies matching `filters`, in `order` (then newest id first), and how many match in all. */
export async function studyPage(db: Executor, scope: LabScope, filters: SQL[], order: SQL, limit: number, offset: number): Promise<{ rows: StudyRow[]; total: number }> {
  const where = scope.where(studies, ...filters);
  const rows = await db.select().from(studies).where(where).orderBy(order, desc(studies.id)).limit(limit).offset(offset);
  // Counted apart: a window count over the page's query would read every match instead of the index's first page.
  const [{ total }] = await db.select({ total: sql<number>`count(*)::int` }).from(studies).where(where);
  return { rows, total };
}

/**
 * The worklist's studies in one statement (each list newest first, with its own limit): this person's drafts,
 * their returned drafts, what `signable` (the sign-off rule as SQL) lets them sign, and the recently signed.
 */
export function worklistRows(db: Executor, scope: LabScope, userId: number, signable: SQL): Promise<StudyRow[]> {
  const mine = scope.owns(sql`laboratory_id`);
  const ids = sql`
    SELECT id FROM (SELECT id FROM ${studies} WHERE ${mine} AND created_by = ${userId} AND state = 'draft' AND returned_at IS NULL ORDER BY updated_at DESC LIMIT 20) drafts
    UNION ALL SELECT id FROM (SELECT id FROM ${studies} WHERE ${mine} AND created_by = ${userId} AND state = 'draft' AND returned_at IS NOT NULL ORDER BY updated_at DESC LIMIT 20) returned
    UNION ALL SELECT id FROM (SELECT id FROM ${studies} WHERE ${mine} AND ${signable} ORDER BY updated_at DESC LIMIT 20) awaiting
    UNION ALL SELECT id FROM (SELECT id FROM ${studies} WHERE ${mine} AND state = 'signed' ORDER BY updated_at DESC LIMIT 10) signed`;
  return db.select().from(studies).where(sql`${studies.id} IN (${ids})`).orderBy(desc(studies.updatedAt), desc(studies.id));
}
