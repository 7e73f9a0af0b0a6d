import { and, asc, desc, eq, like, sql, SQL } from 'drizzle-orm';
import { describeEvent } from '@shared/types/audit-words';
import type { SignedInUser } from '../auth/session-user';
import type { Database } from '../db/client';
import { inLabDays } from '../db/lab-zone';
import { auditEvents, users } from '../db/schema';
import { findStudy } from '../studies/studies.repository';
import type { AuditQuery, HistoryEvent, HistoryPage, Person } from '@shared/schemas';

const view = (e: typeof auditEvents.$inferSelect): HistoryEvent => ({
  id: e.id, at: e.at.toISOString(), userId: e.userId, userName: e.userName, studyId: e.studyId, action: e.action, entity: e.entity, ...describeEvent(e),
});

export async function studyHistory(db: Database, me: SignedInUser, studyId: number): Promise<HistoryEvent[]> {
  await findStudy(db, me.laboratoryId, studyId);
  const rows = await db.select().from(auditEvents)
    .where(and(eq(auditEvents.laboratoryId, me.laboratoryId), eq(auditEvents.studyId, studyId))).orderBy(asc(auditEvents.id));
  return rows.map(view);
}

/** The laboratory-wide history, filtered by user, action, study and the laboratory's days, newest first. */
export async function labHistory(db: Database, me: SignedInUser, q: AuditQuery): Promise<HistoryPage> {
  const where: SQL[] = [eq(auditEvents.laboratoryId, me.laboratoryId)];
  if (q.userId) where.push(eq(auditEvents.userId, q.userId));
  if (q.studyId) where.push(eq(auditEvents.studyId, q.studyId));
  if (q.action) where.push(like(auditEvents.action, `${q.action.replace(/[\\%_]/g, '')}%`));
  const days = await inLabDays(db, me.laboratoryId, auditEvents.at, q);
  if (days) where.push(days);
  const rows = await db.select().from(auditEvents).where(and(...where)).orderBy(desc(auditEvents.id)).limit(q.pageSize).offset((q.page - 1) * q.pageSize);
  const [{ total }] = await db.select({ total: sql<number>`count(*)::int` }).from(auditEvents).where(and(...where));
  return { items: rows.map(view), total };
}

/** The laboratory's people by name, for the history and archive filters. */
export async function labPeople(db: Database, me: SignedInUser): Promise<Person[]> {
  return db.select({ id: users.id, name: users.name }).from(users).where(eq(users.laboratoryId, me.laboratoryId)).orderBy(asc(users.name));
}
