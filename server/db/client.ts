import { drizzle, NodePgDatabase } from 'drizzle-orm/node-postgres';
import { migrate } from 'drizzle-orm/node-postgres/migrator';
import path from 'node:path';
import { Pool } from 'pg';
import { logFailure } from '../log';
import * as schema from './schema';

export type Database = NodePgDatabase<typeof schema>;
/** A transaction handle; services pass it to repositories so one transaction holds a change and its audit event. */
export type Tx = Parameters<Parameters<Database['transaction']>[0]>[0];
export type Executor = Database | Tx;

export interface Db { db: Database; pool: Pool; close: () => Promise<void> }

/**
 * A pool that survives the database going away: a connection the server drops (a restart,
 * pg_terminate_backend) is logged and discarded instead of crashing the process with an unhandled
 * 'error' event, and a new connection gives up after 2 s, so a request answers 503 at once rather
 * than hanging. Connections come back by themselves when the server does.
 */
export function openDatabase(url: string, max = 10, applicationName = 'parallax'): Db {
  const pool = new Pool({ connectionString: url, max, connectionTimeoutMillis: 2000, application_name: applicationName });
  pool.on('error', (err) => logFailure('an idle database connection', err));
  pool.on('connect', (client) => client.on('error', (err) => logFailure('a database connection in use', err)));
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
