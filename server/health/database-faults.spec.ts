import { Client } from 'pg';
import { openDatabase, type Db } from '../db/client';
import { appOnPrivateCluster, signInAt, type ChildApp } from '../test/app-process';
import { createComparison, inventedPairs, waitForAnalysis } from '../test/fixtures';
import type { PrivateCluster } from '../dev/postgres';

/**
 * The app as an operator runs it (a real process) on a PostgreSQL cluster of its own, which the
 * tests restart under it: the process must survive, answer 503 with Retry-After in words while the
 * database is away, and serve again by itself, job queue included, once it is back.
 */
let cluster: PrivateCluster;
let app: ChildApp;
let databaseUrl: string;
let reader: Db;

beforeAll(async () => {
  ({ cluster, app, databaseUrl } = await appOnPrivateCluster('faults'));
  reader = openDatabase(databaseUrl, 1, 'parallax-test-reader');
}, 180_000);

afterAll(async () => {
  await reader?.close().catch(() => undefined);
  await app?.stop();
  cluster?.remove();
});

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function timed<T>(f: () => Promise<T>): Promise<{ value: T; ms: number }> {
  const t = Date.now();
  const value = await f();
  return { value, ms: Date.now() - t };
}

/** Ends every connection the app and its queue hold, as an administrator (or a failover) would. */
async function terminateAppConnections(): Promise<number> {
  const c = new Client({ connectionString: cluster.url('postgres') });
  await c.connect();
  try {
    const r = await c.query(`SELECT pg_terminate_backend(pid) FROM pg_stat_activity WHERE datname = 'parallax' AND application_name IN ('parallax', 'parallax-queue')`);
    return r.rowCount ?? 0;
  } finally {
    await c.end();
  }
}

it('answers the health check without a session: database and queue reachable, never cached', async () => {
  const res = await (await import('supertest')).default(app.url).get('/api/v1/health').expect(200);
  expect(res.body).toMatchObject({ status: 'ok', database: 'ok', queue: 'ok' });
  expect(res.headers['cache-control']).toBe('no-store');
  expect(([] as string[]).concat(res.headers['set-cookie'] ?? []).some((c) => c.startsWith('parallax.sid'))).toBe(false);
});

it('survives the server ending all its connections and reads and writes again at once', async () => {
  const tech = await signInAt(app.url, 'tech@valeharbor.example');
  await tech.agent.get('/api/v1/studies').expect(200);
  expect(await terminateAppConnections()).toBeGreaterThanOrEqual(2);
  await sleep(300);
  expect(app.alive()).toBe(true);
  await tech.agent.get('/api/v1/studies').expect(200);
  await createComparison({ database: reader }, tech, 'After the connections were ended');
  expect(app.alive()).toBe(true);
}, 60_000);

it('answers 503 with Retry-After in words while the database is stopped, then serves again by itself, job queue included', async () => {
  const tech = await signInAt(app.url, 'tech@valeharbor.example');
  const study = await createComparison({ database: reader }, tech, 'Across a database restart');
  const saved = await tech.agent.put(`/api/v1/studies/${study.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: study.version, rows: inventedPairs(30) }).expect(200);

  await reader.close();
  cluster.stop();

  const read = await timed(() => tech.agent.get('/api/v1/studies'));
  expect(read.value.status).toBe(503);
  expect(read.value.headers['retry-after']).toBe('5');
  expect(read.value.body.error).toMatch(/^The database is not answering at the moment; try again in a few seconds$/);
  expect(read.ms).toBeLessThan(2000);
  const write = await timed(() => tech.agent.post(`/api/v1/studies/${study.id}/analyses`).set('X-XSRF-TOKEN', tech.xsrf));
  expect(write.value.status).toBe(503);
  expect(write.value.body.error).toMatch(/so nothing was saved/);
  expect(write.ms).toBeLessThan(2000);
  const health = await timed(() => tech.agent.get('/api/v1/health'));
  expect(health.value.status).toBe(503);
  expect(health.value.body).toMatchObject({ status: 'unavailable', database: 'not answering' });
  expect(health.ms).toBeLessThan(2000);
  await sleep(3000); // the queue's pollers and the sweeper fail meanwhile; the process must outlive them
  expect(app.alive()).toBe(true);

  cluster.start();
  const back = Date.now();
  let recoveredMs = -1;
  while (Date.now() - back < 30_000) {
    const res = await tech.agent.get('/api/v1/health');
    if (res.status === 200) { recoveredMs = Date.now() - back; break; }
    await sleep(100);
  }
  expect(recoveredMs).toBeGreaterThanOrEqual(0);
  console.log(`[faults] the API answered the health check ${recoveredMs} ms after PostgreSQL was started again`);

  await tech.agent.get(`/api/v1/studies/${study.id}`).expect(200);
  const queued = await tech.agent.post(`/api/v1/studies/${study.id}/analyses`).set('X-XSRF-TOKEN', tech.xsrf).expect(202);
  const done = await waitForAnalysis(tech, queued.body.id);
  expect(done).toMatchObject({ state: 'done', error: null });
  expect(done.results.n).toBe(30);
  expect(saved.body.rows).toHaveLength(30);
  expect(app.alive()).toBe(true);
}, 120_000);
