import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readdirSync, readFileSync } from 'node:fs';
import { createServer } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { Client } from 'pg';
import { isRoot, log, runSync } from './run';

const root = path.resolve(__dirname, '../..');

export interface LocalDatabase { serverUrl: (db: string) => string; stop: () => void }

/** Finds Debian's PostgreSQL binaries, installing the package when absent and allowed. */
function binDir(): string {
  const find = () => {
    const base = '/usr/lib/postgresql';
    if (!existsSync(base)) return null;
    const versions = readdirSync(base).filter((v) => existsSync(path.join(base, v, 'bin', 'initdb')));
    versions.sort((a, b) => Number(b) - Number(a));
    return versions.length ? path.join(base, versions[0], 'bin') : null;
  };
  let dir = find();
  if (!dir && isRoot()) {
    log('PostgreSQL is not installed: installing Debian\'s postgresql package ...');
    runSync('apt-get', ['update'], { stdio: 'inherit' });
    runSync('apt-get', ['install', '-y', 'postgresql'], { stdio: 'inherit', env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } });
    dir = find();
  }
  if (!dir) {
    throw new Error('PostgreSQL server is not installed. Install it with `sudo apt-get install postgresql` (Debian/Ubuntu), or set DATABASE_URL to a server you have.');
  }
  return dir;
}

/** As root, the server runs as the `postgres` OS user; it must be able to reach the data folder. */
function dataBase(): string {
  const local = path.join(root, '.data');
  if (!isRoot()) return local;
  const probe = spawnable(local);
  if (probe) return local;
  const fallback = path.join('/var/tmp', `parallax-${createHash('sha256').update(root).digest('hex').slice(0, 12)}`);
  log(`${root} is not reachable by the postgres user; keeping the database in ${fallback}`);
  return fallback;
}

function spawnable(dir: string): boolean {
  mkdirSync(dir, { recursive: true });
  try {
    runSync('runuser', ['-u', 'postgres', '--', 'test', '-x', dir]);
    return true;
  } catch {
    return false;
  }
}

const asServerUser = (cmd: string, args: string[]): [string, string[]] =>
  isRoot() ? ['runuser', ['-u', 'postgres', '--', cmd, ...args]] : [cmd, args];

export function portFree(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const s = createServer();
    s.once('error', () => resolve(false));
    s.listen(port, '127.0.0.1', () => s.close(() => resolve(true)));
  });
}

export async function choosePort(preferred: number, allowOther: boolean): Promise<number> {
  if (await portFree(preferred)) return preferred;
  if (!allowOther) throw new Error(`port ${preferred} on 127.0.0.1 is taken; set PGPORT to a free port`);
  for (let p = preferred + 1; p < preferred + 200; p++) if (await portFree(p)) return p;
  throw new Error('no free port for PostgreSQL near ' + preferred);
}

/**
 * Makes sure the project-local cluster exists and runs on 127.0.0.1, and returns how to reach it.
 * A cluster that is already running (another `npm start`) is reused and left running.
 */
export async function startLocalPostgres(options: { allowOtherPort: boolean }): Promise<LocalDatabase> {
  const bin = binDir();
  const base = dataBase();
  const dataDir = path.join(base, 'postgres');
  const sockDir = path.join(base, 'pgsock');
  mkdirSync(dataDir, { recursive: true });
  mkdirSync(sockDir, { recursive: true });
  if (isRoot()) runSync('chown', ['postgres:postgres', dataDir, sockDir]);
  runSync('chmod', ['700', dataDir]);
  if (!existsSync(path.join(dataDir, 'PG_VERSION'))) {
    log(`creating the local PostgreSQL cluster in ${dataDir}`);
    runSync(...asServerUser(path.join(bin, 'initdb'), ['-D', dataDir, '-U', 'postgres', '--auth=trust', '--encoding=UTF8', '--locale=C.UTF-8']));
  }
  const pidFile = path.join(dataDir, 'postmaster.pid');
  const running = existsSync(pidFile) && statusOk(bin, dataDir);
  let port: number;
  if (running) {
    port = Number(readFileSync(pidFile, 'utf8').split('\n')[3]);
    log(`reusing the local PostgreSQL already running on port ${port}`);
  } else {
    port = await choosePort(Number(process.env.PGPORT ?? 54329), options.allowOtherPort);
    const opts = `-p ${port} -k ${sockDir} -c listen_addresses=127.0.0.1`;
    runSync(...asServerUser(path.join(bin, 'pg_ctl'), ['-D', dataDir, '-l', path.join(dataDir, 'server.log'), '-w', '-t', '60', '-o', opts, 'start']));
    log(`PostgreSQL started on 127.0.0.1:${port}`);
  }
  return {
    serverUrl: (db) => `postgres://postgres@127.0.0.1:${port}/${db}`,
    stop: () => {
      if (running) return;
      runSync(...asServerUser(path.join(bin, 'pg_ctl'), ['-D', dataDir, '-m', 'fast', '-w', 'stop']));
      log('PostgreSQL stopped');
    },
  };
}

function statusOk(bin: string, dataDir: string): boolean {
  try {
    runSync(...asServerUser(path.join(bin, 'pg_ctl'), ['-D', dataDir, 'status']));
    return true;
  } catch {
    return false;
  }
}

/** Creates (or with drop: drops) a database on the server that `adminUrl` reaches. */
export async function createDatabase(adminUrl: string, name: string): Promise<void> {
  const c = new Client({ connectionString: adminUrl });
  await c.connect();
  try {
    const exists = await c.query('SELECT 1 FROM pg_database WHERE datname = $1', [name]);
    if (!exists.rowCount) await c.query(`CREATE DATABASE "${name}"`);
  } finally {
    await c.end();
  }
}

export async function dropDatabase(adminUrl: string, name: string): Promise<void> {
  const c = new Client({ connectionString: adminUrl });
  await c.connect();
  try {
    await c.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
  } finally {
    await c.end();
  }
}

export interface PrivateCluster { port: number; url: (db: string) => string; start: () => void; stop: () => void; remove: () => void }

/**
 * A throwaway PostgreSQL cluster of its own, for the tests that stop and start the database under a
 * running app (they must not stop the cluster the other suites use). fsync is off: nothing in it is kept.
 */
export async function createPrivateCluster(name: string): Promise<PrivateCluster> {
  const bin = binDir();
  const base = path.join(isRoot() ? '/var/tmp' : os.tmpdir(), `parallax-${name}-${process.pid}`);
  const dataDir = path.join(base, 'data');
  mkdirSync(dataDir, { recursive: true });
  if (isRoot()) runSync('chown', ['-R', 'postgres:postgres', base]);
  runSync('chmod', ['700', dataDir]);
  runSync(...asServerUser(path.join(bin, 'initdb'), ['-D', dataDir, '-U', 'postgres', '--auth=trust', '--encoding=UTF8', '--locale=C.UTF-8', '--no-sync']));
  const port = await choosePort(55400 + (process.pid % 500), true);
  const opts = `-p ${port} -k ${base} -c listen_addresses=127.0.0.1 -c fsync=off -c full_page_writes=off`;
  const pgCtl = (...args: string[]) => runSync(...asServerUser(path.join(bin, 'pg_ctl'), ['-D', dataDir, ...args]));
  const cluster: PrivateCluster = {
    port,
    url: (db) => `postgres://postgres@127.0.0.1:${port}/${db}`,
    start: () => { pgCtl('-l', path.join(base, 'server.log'), '-w', '-t', '60', '-o', opts, 'start'); },
    stop: () => { pgCtl('-m', 'fast', '-w', 'stop'); },
    remove: () => {
      try { cluster.stop(); } catch { /* already stopped */ }
      runSync('rm', ['-rf', base]);
    },
  };
  cluster.start();
  return cluster;
}
