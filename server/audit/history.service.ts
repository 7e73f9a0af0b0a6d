import { eq, like, SQL } from 'drizzle-orm';
import { describeEvent } from '@shared/types/audit-words';
import type { SignedInUser } from '../auth/session-user';
import type { Database } from '../db/client';
import { inLabDays } from '../db/lab-zone';
import { auditEvents } from '../db/schema';
import { findStudy } from '../studies/studies.repository';
import type { AuditQuery, HistoryEvent, HistoryPage, Person } from '@shared/schemas';
import { scopeOf } from '../db/lab-scope';
import { labEventPage, labEvents, labPeopleRows } from './audit.repository';

const view = (e: typeof auditEvents.$inferSelect): HistoryEvent => ({
  id: e.id, at: e.at.toISOString(), userId: e.userId, userName: e.userName, studyId: e.studyId, action: e.action, entity: e.entity, ...describeEvent(e),
});

export async function studyHistory(db: Database, me: SignedInUser, studyId: number): Promise<HistoryEvent[]> {
  await findStudy(db, scopeOf(me), studyId);
  return (await labEvents(db, scopeOf(me), eq(auditEvents.studyId, studyId))).map(view);
}

/** The laboratory-wide history, filtered by user, action, study and the laboratory's days, newest first. */
export async function labHistory(db: Database, me: SignedInUser, q: AuditQuery): Promise<HistoryPage> {
  const where: SQL[] = [];
  if (q.userId) where.push(eq(auditEvents.userId, q.userId));
  if (q.studyId) where.push(eq(auditEvents.studyId, q.studyId));
  if (q.action) where.push(like(auditEvents.action, `${q.action.replace(/[\\%_]/g, '')}%`));
  const days = await inLabDays(db, scopeOf(me), auditEvents.at, q);
  if (days) where.push(days);
  const { rows, total } = await labEventPage(db, scopeOf(me), where, q.pageSize, (q.page - 1) * q.pageSize);
  return { items: rows.map(view), total };
}

/** The laboratory's people by name, for the history and archive filters. */
export async function labPeople(db: Database, me: SignedInUser): Promise<Person[]> {
  return labPeopleRows(db, scopeOf(me));
}
