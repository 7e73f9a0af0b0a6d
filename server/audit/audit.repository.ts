import { and, asc, desc, sql, type SQL } from 'drizzle-orm';
import type { Executor } from '../db/client';
import type { LabScope } from '../db/lab-scope';
import { auditEvents, users } from '../db/schema';

export type AuditEventRow = typeof auditEvents.$inferSelect;

/** The laboratory's events matching every condition given, oldest first (a study's or a release's history). */
export const labEvents = (db: Executor, scope: LabScope, ...conds: SQL[]): Promise<AuditEventRow[]> =>
  db.select().from(auditEvents).where(scope.where(auditEvents, ...conds)).orderBy(asc(auditEvents.id));

/** A page of the laboratory's events matching `filters`, newest first, and how many match in all. */
export async function labEventPage(db: Executor, scope: LabScope, filters: SQL[], limit: number, offset: number): Promise<{ rows: AuditEventRow[]; total: number }> {
  const where = scope.where(auditEvents, ...filters);
  const rows = await db.select().from(auditEvents).where(where).orderBy(desc(auditEvents.id)).limit(limit).offset(offset);
  const [{ total }] = await db.select({ total: sql<number>`count(*)::int` }).from(auditEvents).where(and(where));
  return { rows, total };
}

/** The laboratory's people (id and name) by name. */
export const labPeopleRows = (db: Executor, scope: LabScope) =>
  db.select({ id: users.id, name: users.name }).from(users).where(scope.where(users)).orderBy(asc(users.name));
