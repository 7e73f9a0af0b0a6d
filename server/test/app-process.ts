import { ChildProcess, spawn } from 'node:child_process';
import path from 'node:path';
import request from 'supertest';
import { migrateDatabase, openDatabase } from '../db/client';
import { seedDemo } from '../db/seed';
import { DEMO_PASSWORD } from '../db/seed-data';
import { createDatabase, createPrivateCluster, type PrivateCluster } from '../dev/postgres';

const root = path.resolve(__dirname, '../..');

export interface ChildApp { url: string; child: ChildProcess; output: () => string; alive: () => boolean; stop: () => Promise<void> }

/**
 * Runs a server command (`server/main.ts`, the worker process) as a real child process, so a test can
 * see it survive (or kill it) the way an operator would. Resolves once it printed `ready`.
 */
export function startChild(script: string, env: NodeJS.ProcessEnv, ready: RegExp, args: string[] = []): Promise<ChildApp> {
  // node itself with tsx's CommonJS hook (not the tsx command, which would run the script in a grandchild
  // that a kill of the child leaves running).
  const child = spawn(process.execPath, ['--require', 'tsx/cjs', path.join(root, script), ...args], { cwd: root, env: { ...process.env, ...env }, stdio: ['ignore', 'pipe', 'pipe'] });
  let out = '';
  let exited = false;
  child.on('exit', () => { exited = true; });
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`${script} did not start in 60 s:\n${out}`)), 60_000);
    const read = (chunk: Buffer) => {
      out += chunk.toString();
      const m = out.match(ready);
      if (m) {
        clearTimeout(timer);
        resolve({
          url: m[1] ?? '', child, output: () => out, alive: () => !exited,
          stop: () => new Promise<void>((r) => {
            if (exited) return r();
            const hard = setTimeout(() => child.kill('SIGKILL'), 10_000);
            child.once('exit', () => { clearTimeout(hard); r(); });
            child.kill('SIGTERM');
          }),
        });
      }
    };
    child.stdout!.on('data', read);
    child.stderr!.on('data', read);
    child.on('exit', (code) => { clearTimeout(timer); if (!out.match(ready)) reject(new Error(`${script} exited (${code}) before it was ready:\n${out}`)); });
  });
}

/** A private PostgreSQL cluster with a migrated, seeded database, and the app serving it in a child process. */
export async function appOnPrivateCluster(name: string, env: NodeJS.ProcessEnv = {}): Promise<{ cluster: PrivateCluster; databaseUrl: string; app: ChildApp }> {
  const cluster = await createPrivateCluster(name);
  await createDatabase(cluster.url('postgres'), 'parallax');
  const databaseUrl = cluster.url('parallax');
  await migrateDatabase(databaseUrl);
  const seed = openDatabase(databaseUrl, 2);
  await seedDemo(seed.db);
  await seed.close();
  const app = await startChild('server/main.ts', {
    DATABASE_URL: databaseUrl, PORT: '0', HOST: '127.0.0.1', SMTP_URL: '', SIGN_IN_RATE_LIMIT: '1000', CLIENT_DIR: '/nonexistent', ...env,
  }, /serving (http:\/\/\S+)/);
  return { cluster, databaseUrl, app };
}

/** A signed-in supertest agent against a URL (a child process's app). */
export async function signInAt(url: string, email: string, password = DEMO_PASSWORD) {
  const agent = request.agent(url);
  const first = await agent.get('/api/v1/session');
  const cookie = ([] as string[]).concat(first.headers['set-cookie'] ?? []).find((c) => c.startsWith('XSRF-TOKEN='))!;
  const xsrf = decodeURIComponent(cookie.split(';')[0].slice('XSRF-TOKEN='.length));
  const res = await agent.post('/api/v1/session').set('X-XSRF-TOKEN', xsrf).send({ email, password });
  if (res.status !== 200) throw new Error(`sign-in of ${email} answered ${res.status}`);
  return { agent, xsrf };
}
