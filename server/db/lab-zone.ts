import { and, sql, SQL } from 'drizzle-orm';
import type { PgColumn } from 'drizzle-orm/pg-core';
import { labDayRange } from '@shared/types/lab-time';
import type { Executor } from './client';
import type { LabScope } from './lab-scope';
import { laboratories } from './schema';

/** The laboratory's time zone: it governs every time Parallax shows, prints, mails or exports (see shared/types/lab-time). */
export async function labTimeZone(db: Executor, scope: LabScope): Promise<string> {
  const [lab] = await db.select({ timeZone: laboratories.timeZone }).from(laboratories).where(scope.owns(laboratories.id));
  return lab?.timeZone ?? 'UTC';
}

/**
 * A from/to date filter on a time column in the laboratory's days: from its midnight on `from` up to,
 * not including, its midnight after `to` (summer time included). Nothing when neither end is given.
 */
export function labDaysFilter(column: PgColumn | SQL, range: { from?: string; to?: string }, timeZone: string): SQL | undefined {
  if (!range.from && !range.to) return undefined;
  const { start, end } = labDayRange(range, timeZone);
  return and(
    start ? sql`${column} >= ${start.toISOString()}::timestamptz` : undefined,
    end ? sql`${column} < ${end.toISOString()}::timestamptz` : undefined,
  );
}

/** `labDaysFilter` in the zone of the caller's laboratory (read only when a date is given). */
export async function inLabDays(db: Executor, scope: LabScope, column: PgColumn | SQL, range: { from?: string; to?: string }): Promise<SQL | undefined> {
  if (!range.from && !range.to) return undefined;
  return labDaysFilter(column, range, await labTimeZone(db, scope));
}

/** The searches' "signed between" and "created between" filters, in the laboratory's days (its zone read only when a date is given). */
export async function signedAndCreatedDays(
  db: Executor, scope: LabScope, q: { signedFrom?: string; signedTo?: string; createdFrom?: string; createdTo?: string }, signedAt: SQL, createdAt: SQL,
): Promise<SQL[]> {
  if (!q.signedFrom && !q.signedTo && !q.createdFrom && !q.createdTo) return [];
  const zone = await labTimeZone(db, scope);
  return [labDaysFilter(signedAt, { from: q.signedFrom, to: q.signedTo }, zone), labDaysFilter(createdAt, { from: q.createdFrom, to: q.createdTo }, zone)]
    .filter((f): f is SQL => f !== undefined);
}
