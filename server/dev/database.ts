import { createDatabase, dropDatabase, startLocalPostgres } from './postgres';

export interface PreparedDatabase { url: string; drop: () => Promise<void>; stopServer: () => void }

/**
 * With DATABASE_URL: that server, as it is (for tests, a throwaway database beside it).
 * Without: the project-local cluster in .data/postgres, started on 127.0.0.1.
 */
export async function prepareDatabase(name: string | null, throwaway: boolean): Promise<PreparedDatabase> {
  const given = process.env.DATABASE_URL;
  if (given && !throwaway) return { url: given, drop: async () => {}, stopServer: () => {} };
  let serverUrl: (db: string) => string;
  let stopServer = () => {};
  if (given) {
    serverUrl = (db) => Object.assign(new URL(given), { pathname: `/${db}` }).toString();
  } else {
    const local = await startLocalPostgres({ allowOtherPort: throwaway });
    serverUrl = local.serverUrl;
    stopServer = local.stop;
  }
  const dbName = name ?? `parallax_test_${Date.now().toString(36)}_${process.pid}`;
  await createDatabase(serverUrl('postgres'), dbName);
  return {
    url: serverUrl(dbName),
    drop: () => (throwaway ? dropDatabase(serverUrl('postgres'), dbName) : Promise.resolve()),
    stopServer,
  };
}
