import { drizzle, NodePgDatabase } from 'drizzle-orm/node-postgres';
import { migrate } from 'drizzle-orm/node-postgres/migrator';
import path from 'node:path';
import { Pool } from 'pg';
import * as schema from './schema';

export type Database = NodePgDatabase<typeof schema>;
/** A transaction handle; services pass it to repositories so one transaction holds a change and its audit event. */
export type Tx = Parameters<Parameters<Database['transaction']>[0]>[0];
export type Executor = Database | Tx;

export interface Db { db: Database; pool: Pool; close: () => Promise<void> }

export function openDatabase(url: string, max = 10): Db {
  const pool = new Pool({ connectionString: url, max });
  const db = drizzle(pool, { schema });
  return { db, pool, close: () => pool.end() };
}

export const MIGRATIONS_DIR = path.resolve(__dirname, '../../migrations');

export async function migrateDatabase(url: string): Promise<void> {
  const { db, close } = openDatabase(url, 1);
  try {
    await migrate(db, { migrationsFolder: MIGRATIONS_DIR });
  } finally {
    await close();
  }
}
