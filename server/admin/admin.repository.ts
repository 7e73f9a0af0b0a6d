import { asc, desc, eq, sql } from 'drizzle-orm';
import type { Executor } from '../db/client';
import { mailMessages, users } from '../db/schema';

export const listUsers = (db: Executor, lab: number) =>
  db.select().from(users).where(eq(users.laboratoryId, lab)).orderBy(asc(users.name));

/** Messages received by the local mail store that went to at least one user of this laboratory. */
export const listMail = (db: Executor, lab: number, limit = 200) =>
  db
    .select()
    .from(mailMessages)
    .where(sql`EXISTS (SELECT 1 FROM ${users} u WHERE u.laboratory_id = ${lab} AND u.email = ANY(${mailMessages.to}))`)
    .orderBy(desc(mailMessages.id))
    .limit(limit);
