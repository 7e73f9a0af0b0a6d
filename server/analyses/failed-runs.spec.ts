import path from 'node:path';
import { and, eq } from 'drizzle-orm';
import { analyses, analytes, auditEvents, instruments } from '../db/schema';
import { precisionRuns } from '../kinds/precision/demo';
import { createComparison, inventedPairs, waitForAnalysis } from '../test/fixtures';
import { apiPost, apiPut, Harness, signedIn, startHarness, type Session } from '../test/harness';
import { AnalysisJobs, jobTiming } from './analysis-jobs';

/**
 * Runs that fail: the engine throws (an injected failure, and the engine's own refusal of data it cannot analyse),
 * and the worker thread running an analysis dies in the middle of it. The run is marked failed with the reason,
 * the history says so, nothing is left running, and the study keeps the findings it had.
 * The failures are injected with test-only task files (server/analyses/testing/) handed to a worker of this test;
 * the app and the API never name a task file.
 */
let h: Harness;
const workers: AnalysisJobs[] = [];
beforeAll(async () => { h = await startHarness({}, { jobs: 'send-only' }); });
// Workers are notified of a job at once: one left from an earlier test would take the next test's jobs.
afterEach(async () => {
  while (workers.length) await workers.pop()!.stop();
});
afterAll(() => h.close());

const THROWS = path.join(__dirname, 'testing/throwing-task.js');
const DIES = path.join(__dirname, 'testing/dying-task.js');

/** A worker of this process with one thread, running the engine or a test task in its place. */
async function working(taskFile?: string): Promise<AnalysisJobs> {
  const jobs = new AnalysisJobs(h.database.db, process.env.DATABASE_URL!, jobTiming(30, 1));
  workers.push(jobs);
  await jobs.start({ work: true, taskFile });
  return jobs;
}
const stopWorkers = async () => { while (workers.length) await workers.pop()!.stop(); };

const queue = async (s: Session, studyId: number): Promise<number> => (await apiPost(s, `/studies/${studyId}/analyses`).expect(202)).body.id;
const studyOf = async (s: Session, id: number) => (await s.agent.get(`/api/v1/studies/${id}`).expect(200)).body;
const headlines = async (s: Session, id: number) => ((await s.agent.get(`/api/v1/studies/${id}/history`).expect(200)).body as { headline: string }[]).map((e) => e.headline);
const failedEvent = async (analysisId: number) =>
  (await h.database.db.select().from(auditEvents).where(and(eq(auditEvents.action, 'analysis.failed'), eq(auditEvents.entityId, String(analysisId)))))[0];

async function comparisonWithFindings(s: Session, title: string) {
  const study = await createComparison(h, s, title);
  await apiPut(s, `/studies/${study.id}/specimens`, { version: study.version, rows: inventedPairs(20) }).expect(200);
  await working();
  const first = await queue(s, study.id);
  expect(await waitForAnalysis(s, first)).toMatchObject({ state: 'done', error: null });
  await stopWorkers();
  expect(await studyOf(s, study.id)).toMatchObject({ findings: 'current', currentAnalysisId: first, latestAnalysisId: first });
  return { id: study.id, first };
}

it('marks a run whose engine throws as failed with the error, says so in the history, and keeps the findings the study had', async () => {
  const tech = await signedIn(h, 'tech@valeharbor.example');
  const study = await comparisonWithFindings(tech, 'Engine throws on a re-run');
  await working(THROWS);
  const second = await queue(tech, study.id);
  const failed = await waitForAnalysis(tech, second);
  expect(failed).toMatchObject({ state: 'failed', error: 'The engine stopped: a failure injected by the test', results: null });
  expect(failed.finishedAt).not.toBeNull();
  // The same rows and settings as the first run: its findings stay current, the failed run is the latest.
  expect(await studyOf(tech, study.id)).toMatchObject({ findings: 'current', currentAnalysisId: study.first, latestAnalysisId: second });
  const kept = (await tech.agent.get(`/api/v1/analyses/${study.first}`).expect(200)).body;
  expect(kept).toMatchObject({ state: 'done', current: true, error: null });
  expect(kept.results.n).toBe(20);
  expect(await headlines(tech, study.id)).toContain('Analysis failed: The engine stopped: a failure injected by the test');
  expect(await failedEvent(second)).toMatchObject({ userId: null, userName: 'analysis worker', studyId: study.id });
});

it('fails a run the engine refuses with the engine\'s words; the study shows the failure until its rows are put back, when its earlier findings are current again', async () => {
  const tech = await signedIn(h, 'tech@valeharbor.example');
  const line = (await h.database.db.select().from(instruments)).find((i) => i.name === 'Chemistry line 2')!;
  const glucose = (await h.database.db.select().from(analytes)).find((a) => a.laboratoryId === line.laboratoryId && a.name === 'Glucose')!;
  const created = (await apiPost(tech, '/studies', {
    kind: 'precision', title: `Precision, one day ${Date.now()}`, analyteId: glucose.id, instrumentId: line.id,
    settings: { decimals: 2, materials: [{ name: 'Low', claimRepeatability: 0.08, claimWithinLab: 0.12, claimAs: 'sd' }] },
  }).expect(201)).body;
  const good = precisionRuns('fr-prec', 'Low', ['1', '2', '3', '4', '5'], 5, 5.42, 0.06, 0.03, 2);
  let version = (await apiPut(tech, `/studies/${created.id}/specimens`, { version: created.version, rows: good }).expect(200)).body.version;
  await working();
  const first = await queue(tech, created.id);
  expect((await waitForAnalysis(tech, first)).state).toBe('done');
  // Every result on day 1: between-day variation cannot be separated from repeatability.
  const oneDay = good.map((r) => ({ ...r, day: '1' }));
  version = (await apiPut(tech, `/studies/${created.id}/specimens`, { version, rows: oneDay }).expect(200)).body.version;
  const second = await queue(tech, created.id);
  const failed = await waitForAnalysis(tech, second);
  expect(failed).toMatchObject({ state: 'failed', results: null });
  expect(failed.error).toBe('option materials "Low" has results on 1 day only: at least 2 days (5 planned) are needed to separate between-day from repeatability');
  expect(await studyOf(tech, created.id)).toMatchObject({ findings: 'failed', currentAnalysisId: null, latestAnalysisId: second });
  expect(await headlines(tech, created.id)).toContain(`Analysis failed: ${failed.error}`);
  await apiPut(tech, `/studies/${created.id}/specimens`, { version, rows: good }).expect(200);
  expect(await studyOf(tech, created.id)).toMatchObject({ findings: 'current', currentAnalysisId: first, latestAnalysisId: second });
});

it('marks a run whose worker thread dies in the middle as failed, not running, and the pool takes the next job', async () => {
  const tech = await signedIn(h, 'tech@valeharbor.example');
  const study = await comparisonWithFindings(tech, 'Thread dies on a re-run');
  await working(DIES);
  const second = await queue(tech, study.id);
  const failed = await waitForAnalysis(tech, second);
  expect(failed).toMatchObject({ state: 'failed', results: null });
  expect(failed.error).toBe('The analysis worker stopped unexpectedly (exit code 70) before finishing; run the analysis again, and tell the administrator if it keeps happening');
  const [row] = await h.database.db.select().from(analyses).where(eq(analyses.id, second));
  expect(row).toMatchObject({ state: 'failed', attempt: 1 });
  expect(row.finishedAt).not.toBeNull();
  expect(await headlines(tech, study.id)).toContain(`Analysis failed: ${failed.error}`);
  expect(await studyOf(tech, study.id)).toMatchObject({ findings: 'current', currentAnalysisId: study.first, latestAnalysisId: second });
  // The dead thread was replaced: the same worker takes the next run (and its thread dies again).
  const third = await queue(tech, study.id);
  expect(await waitForAnalysis(tech, third)).toMatchObject({ state: 'failed', error: failed.error });
  await stopWorkers();
  await working();
  const fourth = await queue(tech, study.id);
  expect(await waitForAnalysis(tech, fourth)).toMatchObject({ state: 'done', error: null });
  expect(await studyOf(tech, study.id)).toMatchObject({ findings: 'current', currentAnalysisId: fourth, latestAnalysisId: fourth });
});
