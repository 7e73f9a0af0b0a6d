import { asc, eq, sql } from 'drizzle-orm';
import type { Executor } from '../db/client';
import type { LabScope } from '../db/lab-scope';
import { laboratories, users } from '../db/schema';

/**
 * The account of an e-mail: the one with a password (at most one, a unique index says so); failing
 * that, an invitation not yet taken up. Invitations to one e-mail may exist in several laboratories.
 */
export const findUserByEmail = async (db: Executor, email: string) =>
  (await db.select().from(users).where(eq(users.email, email)).orderBy(sql`${users.passwordHash} IS NULL`, asc(users.id)).limit(1))[0];

export const findUserInLabByEmail = async (db: Executor, scope: LabScope, email: string) =>
  (await db.select().from(users).where(scope.where(users, eq(users.email, email))).limit(1))[0];

/** Ends a user's sessions in the session store, all but `keepSid` if given; answers how many ended. */
export async function endSessions(db: Executor, userId: number, keepSid?: string): Promise<number> {
  const result = await db.execute(sql`DELETE FROM session WHERE (sess->'passport'->>'user')::int = ${userId}${keepSid ? sql` AND sid <> ${keepSid}` : sql``}`);
  return result.rowCount ?? 0;
}

export const findUserById = async (db: Executor, id: number) =>
  (await db.select().from(users).where(eq(users.id, id)).limit(1))[0];

export const findUserInLab = async (db: Executor, scope: LabScope, id: number) =>
  (await db.select().from(users).where(scope.where(users, eq(users.id, id))).limit(1))[0];

/** The scope's own laboratory row. */
export const findLaboratory = async (db: Executor, scope: LabScope) =>
  (await db.select().from(laboratories).where(scope.owns(laboratories.id)).limit(1))[0];

export async function updateUser(db: Executor, id: number, values: Partial<typeof users.$inferInsert>) {
  const [row] = await db.update(users).set(values).where(eq(users.id, id)).returning();
  return row;
}
