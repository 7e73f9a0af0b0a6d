import { and, eq } from 'drizzle-orm';
import { analyses, auditEvents } from '../db/schema';
import { startChild, type ChildApp } from '../test/app-process';
import { createComparison, inventedPairs, waitForAnalysis } from '../test/fixtures';
import { apiPost, apiPut, Harness, signedIn, startHarness } from '../test/harness';

/**
 * The separate worker process (`npm run worker`, server/analyses/worker-process.ts) as an operator runs it: the
 * API process only sends jobs, the worker started as a child process against the same database takes a queued
 * analysis, finishes it and the findings appear; SIGTERM stops it cleanly (exit code 0, nothing left running).
 */
let h: Harness;
let worker: ChildApp | null = null;
beforeAll(async () => { h = await startHarness({}, { jobs: 'send-only' }); });
afterAll(async () => {
  await worker?.stop();
  await h.close();
});

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

it('takes an analysis the API process queued, finishes it so the findings appear, and stops cleanly on SIGTERM', async () => {
  expect(h.ctx.jobs.concurrency).toBe(0);
  const tech = await signedIn(h, 'tech@valeharbor.example');
  const study = await createComparison(h, tech, `Worker process ${Date.now()}`);
  await apiPut(tech, `/studies/${study.id}/specimens`, { version: study.version, rows: inventedPairs(30) }).expect(200);
  const id = (await apiPost(tech, `/studies/${study.id}/analyses`).expect(202)).body.id as number;
  // Nobody takes it while only the API process runs.
  await sleep(1500);
  expect((await tech.agent.get(`/api/v1/analyses/${id}`).expect(200)).body.state).toBe('queued');
  expect((await tech.agent.get(`/api/v1/studies/${study.id}`).expect(200)).body.findings).toBe('queued');

  worker = await startChild('server/dev/bootstrap.js', { DATABASE_URL: process.env.DATABASE_URL, ANALYSIS_THREADS: '1' }, /taking jobs/, ['worker']);
  const done = await waitForAnalysis(tech, id);
  expect(done).toMatchObject({ state: 'done', error: null, current: true });
  expect(done.results.n).toBe(30);
  expect((await tech.agent.get(`/api/v1/studies/${study.id}`).expect(200)).body).toMatchObject({ findings: 'current', currentAnalysisId: id });
  const [finished] = await h.database.db.select().from(auditEvents).where(and(eq(auditEvents.action, 'analysis.done'), eq(auditEvents.entityId, String(id))));
  expect(finished).toMatchObject({ userName: 'analysis worker', studyId: study.id });

  const exited = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((resolve) => worker!.child.once('exit', (code, signal) => resolve({ code, signal })));
  worker.child.kill('SIGTERM');
  expect(await exited).toEqual({ code: 0, signal: null });
  expect(worker.alive()).toBe(false);
  expect(worker.output()).not.toMatch(/error|failed/i);
  worker = null;

  // Stopped: a new analysis waits for a worker again.
  const next = (await apiPost(tech, `/studies/${study.id}/analyses`).expect(202)).body.id as number;
  await sleep(1500);
  const [row] = await h.database.db.select().from(analyses).where(eq(analyses.id, next));
  expect(row.state).toBe('queued');
}, 180_000);
