import { and, eq, sql } from 'drizzle-orm';
import { analyses } from '../db/schema';
import { startChild, type ChildApp } from '../test/app-process';
import { createComparison, inventedPairs, waitForAnalysis } from '../test/fixtures';
import { Harness, signedIn, startHarness } from '../test/harness';
import { AnalysisJobs, jobTiming } from './analysis-jobs';

/**
 * Analyses whose process dies must not stay "running" for ever: a real worker process (`npm run
 * worker`) is killed with SIGKILL in the middle of an analysis, and another process's sweeper
 * queues it again and runs it to the end.
 */
let h: Harness;
const extra: AnalysisJobs[] = [];
let worker: ChildApp | null = null;
const STALE = 3;

beforeAll(async () => { h = await startHarness({ ANALYSIS_STALE_SECONDS: String(STALE) }, { jobs: 'send-only' }); });
// Workers are notified of a job at once: one left from an earlier test would take the next test's jobs.
afterEach(async () => {
  while (extra.length) await extra.pop()!.stop();
});
afterAll(async () => {
  await worker?.stop();
  await h.close();
});

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
type Session = Awaited<ReturnType<typeof signedIn>>;

/**
 * A study whose analysis takes several seconds, long enough to be seen running and killed: Passing–Bablok
 * on 1,200 pairs with 60,000 regression resamples (about 9 s on the project's machine; with 3,000 resamples
 * it now ends in under a second, before a test can catch it running).
 */
async function heavyStudy(tech: Session, title: string) {
  const study = await createComparison(h, tech, title, { resamples: 10000, regressionResamples: 60000, regression: 'passing-bablok' });
  await tech.agent.put(`/api/v1/studies/${study.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: study.version, rows: inventedPairs(1200) }).expect(200);
  return study;
}

async function queue(tech: Session, studyId: number): Promise<number> {
  return (await tech.agent.post(`/api/v1/studies/${studyId}/analyses`).set('X-XSRF-TOKEN', tech.xsrf).expect(202)).body.id;
}

function working(threads?: number): Promise<AnalysisJobs> {
  const jobs = new AnalysisJobs(h.database.db, process.env.DATABASE_URL!, jobTiming(STALE, threads));
  extra.push(jobs);
  return jobs.start({ work: true }).then(() => jobs);
}

async function until<T>(what: string, seconds: number, probe: () => Promise<T | null | undefined | false>): Promise<T> {
  const end = Date.now() + seconds * 1000;
  while (Date.now() < end) {
    const v = await probe();
    if (v) return v;
    await sleep(100);
  }
  throw new Error(`timed out waiting for ${what}`);
}

it('writes progress while running; a run whose worker process is killed is queued again once and finishes, in words in the history', async () => {
  const tech = await signedIn(h, 'tech@valeharbor.example');
  const study = await heavyStudy(tech, 'Killed worker');
  worker = await startChild('server/dev/bootstrap.js', { DATABASE_URL: process.env.DATABASE_URL, ANALYSIS_STALE_SECONDS: String(STALE), ANALYSIS_THREADS: '1' }, /taking jobs/, ['worker']);
  const id = await queue(tech, study.id);
  const running = await until('progress of the running analysis', 60, async () => {
    const a = (await tech.agent.get(`/api/v1/analyses/${id}`)).body;
    return a.state === 'running' && a.progress > 0 ? a : null;
  });
  expect(running.progress).toBeLessThan(1);
  worker.child.kill('SIGKILL');
  await until('the worker to die', 10, async () => !worker!.alive());
  worker = null;
  const killedAt = Date.now();

  await working();
  const done = await waitForAnalysis(tech, id);
  console.log(`[lost runs] a killed run was finished ${Date.now() - killedAt} ms after its worker died (stale limit ${STALE} s)`);
  expect(done).toMatchObject({ state: 'done', error: null });
  expect(done.results.n).toBe(1200);
  const [row] = await h.database.db.select().from(analyses).where(eq(analyses.id, id));
  expect(row.attempt).toBe(2);
  const history = (await tech.agent.get(`/api/v1/studies/${study.id}/history`).expect(200)).body as { headline: string }[];
  expect(history.map((e) => e.headline)).toContain(`Analysis queued again (attempt 2): the process running it stopped (no sign of life for ${STALE} s)`);
}, 180_000);

it('fails a run whose process died a second time, with the reason in words', async () => {
  const tech = await signedIn(h, 'tech@valeharbor.example');
  const study = await createComparison(h, tech, 'Died twice');
  await tech.agent.put(`/api/v1/studies/${study.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: study.version, rows: inventedPairs(20) }).expect(200);
  const id = await queue(tech, study.id);
  // As if a second worker had claimed it and died: running, attempt 2, no heartbeat for a minute.
  await h.database.db.update(analyses).set({ state: 'running', attempt: 2, startedAt: sql`now() - interval '1 minute'`, heartbeatAt: sql`now() - interval '1 minute'` })
    .where(and(eq(analyses.id, id), eq(analyses.state, 'queued')));
  const jobs = await working();
  await jobs.sweep();
  const failed = (await tech.agent.get(`/api/v1/analyses/${id}`).expect(200)).body;
  expect(failed.state).toBe('failed');
  expect(failed.error).toBe(`The analysis stopped twice because the process running it stopped (no sign of life for ${STALE} s); run it again, and tell the administrator if it keeps happening`);
});

it('re-sends a queued analysis whose job was lost, exactly once however often the sweeper runs', async () => {
  const tech = await signedIn(h, 'tech@valeharbor.example');
  const study = await createComparison(h, tech, 'Lost job');
  await tech.agent.put(`/api/v1/studies/${study.id}/specimens`).set('X-XSRF-TOKEN', tech.xsrf).send({ version: study.version, rows: inventedPairs(20) }).expect(200);
  const id = await queue(tech, study.id);
  // The job is lost (as in a crash between commit and send) and the analysis has waited a minute.
  await h.database.db.execute(sql`DELETE FROM pgboss.job WHERE name = 'analysis' AND (data->>'analysisId')::int = ${id}`);
  await h.database.db.update(analyses).set({ queuedAt: sql`now() - interval '1 minute'` }).where(eq(analyses.id, id));
  const sender = h.ctx.jobs;
  for (let i = 0; i < 3; i++) await (sender as unknown as { resendLostJobs: () => Promise<void> }).resendLostJobs();
  const { rows } = await h.database.db.execute<{ n: number }>(sql`SELECT count(*)::int AS n FROM pgboss.job WHERE name = 'analysis' AND (data->>'analysisId')::int = ${id}`);
  expect(rows[0].n).toBe(1);
  await working();
  expect((await waitForAnalysis(tech, id)).state).toBe('done');
});

it('runs as many analyses at once as the worker pool has threads', async () => {
  const tech = await signedIn(h, 'tech@valeharbor.example');
  const ids: number[] = [];
  for (const t of ['Parallel one', 'Parallel two']) ids.push(await queue(tech, (await heavyStudy(tech, t)).id));
  const jobs = await working(2);
  expect(jobs.concurrency).toBe(2);
  await until('both analyses running at once', 60, async () => {
    const states = await Promise.all(ids.map(async (id) => (await tech.agent.get(`/api/v1/analyses/${id}`)).body.state));
    return states.every((s) => s === 'running');
  });
  for (const id of ids) expect((await waitForAnalysis(tech, id)).state).toBe('done');
}, 180_000);
