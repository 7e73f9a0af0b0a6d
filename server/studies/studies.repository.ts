import { and, eq } from 'drizzle-orm';
import type { Executor } from '../db/client';
import { analytes, instruments, studies } from '../db/schema';
import { AppError, notFound } from '../http/app-error';

export type StudyRow = typeof studies.$inferSelect;

/** One study of the caller's laboratory; another laboratory's answers 404. */
export async function findStudy(db: Executor, laboratoryId: number, id: number, lock = false): Promise<StudyRow> {
  const q = db.select().from(studies).where(and(eq(studies.id, id), eq(studies.laboratoryId, laboratoryId)));
  const [row] = lock ? await q.for('update') : await q;
  if (!row) throw notFound('Study');
  return row;
}

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

export const findLabAnalyte = async (db: Executor, laboratoryId: number, id: number) =>
  (await db.select().from(analytes).where(and(eq(analytes.id, id), eq(analytes.laboratoryId, laboratoryId))))[0];

export const findLabInstrument = async (db: Executor, laboratoryId: number, id: number) =>
  (await db.select().from(instruments).where(and(eq(instruments.id, id), eq(instruments.laboratoryId, laboratoryId))))[0];
