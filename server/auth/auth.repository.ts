import { and, eq } from 'drizzle-orm';
import type { Executor } from '../db/client';
import { laboratories, users } from '../db/schema';

export const findUserByEmail = async (db: Executor, email: string) =>
  (await db.select().from(users).where(eq(users.email, email)).limit(1))[0];

export const findUserById = async (db: Executor, id: number) =>
  (await db.select().from(users).where(eq(users.id, id)).limit(1))[0];

export const findUserInLab = async (db: Executor, laboratoryId: number, id: number) =>
  (await db.select().from(users).where(and(eq(users.id, id), eq(users.laboratoryId, laboratoryId))).limit(1))[0];

export const findLaboratory = async (db: Executor, id: number) =>
  (await db.select().from(laboratories).where(eq(laboratories.id, id)).limit(1))[0];

export async function updateUser(db: Executor, id: number, values: Partial<typeof users.$inferInsert>) {
  const [row] = await db.update(users).set(values).where(eq(users.id, id)).returning();
  return row;
}
