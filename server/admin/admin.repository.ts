import { asc, desc, eq, sql } from 'drizzle-orm';
import type { Executor } from '../db/client';
import type { LabScope } from '../db/lab-scope';
import { analytes, instruments, mailMessages, users } from '../db/schema';

export const listUsers = (db: Executor, scope: LabScope) =>
  db.select().from(users).where(scope.where(users)).orderBy(asc(users.name));

/** Messages received by the local mail store that went to at least one user of this laboratory. */
export const listMail = (db: Executor, scope: LabScope, limit = 200) =>
  db
    .select()
    .from(mailMessages)
    .where(sql`EXISTS (SELECT 1 FROM ${users} u WHERE ${scope.owns(sql`u.laboratory_id`)} AND u.email = ANY(${mailMessages.to}))`)
    .orderBy(desc(mailMessages.id))
    .limit(limit);

/** A catalog table: the laboratory's analytes or instruments. */
export type CatalogTable = typeof analytes | typeof instruments;

/** The laboratory's rows of a catalog table, by name. */
export const catalogRows = <T extends CatalogTable>(db: Executor, scope: LabScope, table: T): Promise<T['$inferSelect'][]> =>
  db.select().from(table as CatalogTable).where(scope.where(table)).orderBy(table.name) as Promise<T['$inferSelect'][]>;

/** One row of a catalog table in the laboratory, or undefined (another laboratory's, or none). */
export const findCatalogRow = async <T extends CatalogTable>(db: Executor, scope: LabScope, table: T, id: number): Promise<T['$inferSelect'] | undefined> =>
  (await db.select().from(table as CatalogTable).where(scope.where(table, eq(table.id, id))))[0] as T['$inferSelect'] | undefined;
