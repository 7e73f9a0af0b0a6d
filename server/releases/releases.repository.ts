import { eq, ne } from 'drizzle-orm';
import type { Executor } from '../db/client';
import type { LabScope } from '../db/lab-scope';
import { dueItems, releases, releaseTemplates } from '../db/schema';

export type ReleaseRow = typeof releases.$inferSelect;
export type DueItemRow = typeof dueItems.$inferSelect;
export type TemplateRow = typeof releaseTemplates.$inferSelect;

/** One release of the caller's laboratory; another laboratory's answers 404. */
export const findRelease = (db: Executor, scope: LabScope, id: number, lock = false): Promise<ReleaseRow> => scope.oneOr404(db, releases, id, 'Release', lock);

/** One due item of the caller's laboratory, locked for update; another laboratory's answers 404. */
export const findDueItem = (db: Executor, scope: LabScope, id: number): Promise<DueItemRow> => scope.oneOr404(db, dueItems, id, 'Due item', true);

/** A due item of the laboratory named in a request body, locked for update, or undefined (the caller words the error for its field). */
export const labDueItemForUpdate = async (db: Executor, scope: LabScope, id: number): Promise<DueItemRow | undefined> =>
  (await db.select().from(dueItems).where(scope.where(dueItems, eq(dueItems.id, id))).for('update'))[0];

/** Marks done the laboratory's pending due items answered by this study; answers them. */
export const dueItemsDoneByStudy = (db: Executor, scope: LabScope, studyId: number): Promise<DueItemRow[]> =>
  db.update(dueItems).set({ state: 'done', updatedAt: new Date() })
    .where(scope.where(dueItems, eq(dueItems.startedStudyId, studyId), ne(dueItems.state, 'done'))).returning();

/** The laboratory's saved templates (a change type without one uses the default). */
export const labTemplateRows = (db: Executor, scope: LabScope): Promise<TemplateRow[]> =>
  db.select().from(releaseTemplates).where(scope.where(releaseTemplates));

/** The laboratory's saved template of one change type, or undefined; locked for update when asked. */
export async function labTemplateRow(db: Executor, scope: LabScope, changeType: string, lock = false): Promise<TemplateRow | undefined> {
  const q = db.select().from(releaseTemplates).where(scope.where(releaseTemplates, eq(releaseTemplates.changeType, changeType)));
  return (lock ? await q.for('update') : await q)[0];
}
