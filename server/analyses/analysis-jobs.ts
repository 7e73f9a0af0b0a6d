import { and, eq, isNull, lt, or, sql } from 'drizzle-orm';
import PgBoss from 'pg-boss';
import { recordAudit } from '../audit/audit';
import type { Database, Tx } from '../db/client';
import { analyses, studies } from '../db/schema';
import { logFailure } from '../log';
import type { AnalysisInput } from '../specimens/input-hash';
import { isPlanInput, type PlanInput } from '../plans/plan-input';
import { runPlanOnThreads } from '../plans/plan-threads';
import { AnalysisEvents, announceChange, announceJob } from './analysis-events';
import { runAnalysis } from './run-analysis';
import { AnalysisPool } from './worker-pool';

export const QUEUE = 'analysis';

/** A plan's run says so in its history events (a findings run says nothing, as before plans existed). */
const purposeOf = (run: { purpose: string }) => (run.purpose === 'plan' ? { purpose: 'plan' } : {});
/** A run whose process died is queued once more; a second death fails it in words. */
export const MAX_ATTEMPTS = 2;
/** Workers learn of a job at once by NOTIFY; this polling is only the fallback when notifications are lost. */
export const FALLBACK_POLL_SECONDS = 2;
/** Progress is pushed to the pages following an analysis at most this often. */
const PROGRESS_PUSH_MS = 150;

export interface JobTiming {
  /** How often a running analysis writes its progress and heartbeat. */
  heartbeatMs: number;
  /** A running analysis whose heartbeat is older than this lost its process. */
  staleMs: number;
  /** How often the sweeper looks for lost runs and lost jobs. */
  sweepMs: number;
  /** Worker threads, i.e. analyses run at once by this process (default: one per core but one). */
  threads?: number;
}
/** The timing for a given stale limit: a heartbeat every second, a sweep twice per limit. */
export const jobTiming = (staleSeconds = 30, threads?: number): JobTiming =>
  ({ heartbeatMs: 1000, staleMs: staleSeconds * 1000, sweepMs: Math.max(1000, (staleSeconds * 1000) / 2), threads });

/**
 * The analysis queue lives in PostgreSQL (pg-boss), so any process with `work` on can take a job:
 * the API process by default, and extra `npm run worker` processes on other machines. A process runs
 * as many analyses at once as its worker pool has threads. While an analysis runs, its process writes
 * the progress and a heartbeat every second; a sweeper in every working process re-queues a run whose
 * heartbeat stopped (its process died) once, then fails it with the reason, and re-sends a queued
 * analysis whose job was lost. The database going away stops none of this for good: the queue and the
 * pool reconnect by themselves, and each failed step is retried at the next beat or sweep.
 * Nothing waits for a poll when notifications flow: a queued job is announced on a PostgreSQL channel that
 * wakes the workers of every process, and each change of state or progress is announced on another that
 * the API process relays to the pages following the analysis (server-sent events, analysis-stream.ts).
 */
export class AnalysisJobs {
  private boss: PgBoss | null = null;
  private pool: AnalysisPool | null = null;
  private sweeper: NodeJS.Timeout | null = null;
  private sweeping: Promise<void> | null = null;
  private workerIds: string[] = [];
  /** Notifications of queued jobs and of analyses' progress, for this process. */
  readonly events: AnalysisEvents;

  constructor(private readonly db: Database, private readonly url: string, private readonly timing: JobTiming = jobTiming()) {
    this.events = new AnalysisEvents(url);
  }

  /** `taskFile`: for tests only, a task in place of the engine's (AnalysisPool); nothing in the app or the API sets it. */
  async start(options: { work: boolean; taskFile?: string } = { work: true }): Promise<void> {
    if (this.boss) return;
    const boss = new PgBoss({ connectionString: this.url, max: 4, schema: 'pgboss', application_name: 'parallax-queue', connectionTimeoutMillis: 2000 } as never);
    boss.on('error', (err) => logFailure('the job queue', err));
    await boss.start();
    await boss.createQueue(QUEUE);
    this.boss = boss;
    await this.events.start();
    if (options.work) {
      this.pool = new AnalysisPool(this.timing.threads, options.taskFile);
      void this.pool.warmUp().catch((err) => logFailure('warming up the analysis threads', err));
      this.workerIds = [];
      for (let i = 0; i < this.pool.threads; i++) {
        this.workerIds.push(await boss.work<{ analysisId: number }>(QUEUE, { batchSize: 1, pollingIntervalSeconds: FALLBACK_POLL_SECONDS }, async ([job]) => this.execute(job.data.analysisId)));
      }
      this.events.on('job', this.wake);
      this.sweeper = setInterval(() => void this.sweep(), this.timing.sweepMs);
      this.sweeper.unref();
      await this.sweep();
    }
  }

  /** How many analyses this process runs at once (0 when it only sends jobs). */
  get concurrency(): number {
    return this.pool?.threads ?? 0;
  }

  /** Called after the transaction that inserted the queued analysis has committed. */
  async enqueue(analysisId: number): Promise<void> {
    if (!this.boss) throw new Error('the job queue is not started');
    await this.boss.send(QUEUE, { analysisId }, { retryLimit: 0, expireInMinutes: 30 });
    this.wake();
    await announceJob(this.db).catch((err) => logFailure('announcing a queued analysis', err));
  }

  /** Asks this process's workers to fetch a job now rather than at their next poll. */
  private readonly wake = (): void => {
    for (const id of this.workerIds) this.boss?.notifyWorker(id);
  };

  /** True when the queue's tables answer (for the health check). */
  async healthy(): Promise<boolean> {
    if (!this.boss) return false;
    await this.boss.getQueue(QUEUE);
    return true;
  }

  /** Runs one analysis: queued → running → done (results) or failed (the error in words). */
  async execute(analysisId: number, options: { inThread?: boolean } = {}): Promise<void> {
    const [claimed] = await this.db.update(analyses).set({ state: 'running', startedAt: new Date(), heartbeatAt: new Date(), progress: 0 })
      .where(and(eq(analyses.id, analysisId), eq(analyses.state, 'queued'))).returning();
    if (!claimed) return;
    const started = Date.now();
    const thisRun = and(eq(analyses.id, analysisId), eq(analyses.state, 'running'), eq(analyses.attempt, claimed.attempt));
    let progress = 0;
    let pushed = 0;
    const change = (state: string, p: number) => ({ id: analysisId, studyId: claimed.studyId, state, progress: p });
    await announceChange(this.db, change('running', 0)).catch((err) => logFailure('announcing an analysis', err));
    const onProgress = (f: number) => {
      progress = f;
      const now = Date.now();
      if (now - pushed < PROGRESS_PUSH_MS) return;
      pushed = now;
      announceChange(this.db, change('running', f)).catch((err) => logFailure('announcing progress', err));
    };
    const beat = setInterval(() => {
      this.db.update(analyses).set({ progress, heartbeatAt: new Date() }).where(thisRun)
        .catch((err) => logFailure('writing an analysis heartbeat', err));
    }, this.timing.heartbeatMs);
    try {
      const input = claimed.input as AnalysisInput | PlanInput;
      const results = options.inThread ? runAnalysis(input)
        : isPlanInput(input) ? await runPlanOnThreads(this.pool!, input, onProgress) : await this.pool!.run(input, onProgress);
      clearInterval(beat);
      await this.finish(claimed, { state: 'done', results, progress: 1, durationMs: Date.now() - started });
    } catch (err) {
      clearInterval(beat);
      await this.finish(claimed, { state: 'failed', error: failureWords(err), durationMs: Date.now() - started });
    }
  }

  /** Ends this run; a run that was meanwhile re-queued (its heartbeat went stale) is left alone. */
  private async finish(run: typeof analyses.$inferSelect, values: Partial<typeof analyses.$inferInsert>): Promise<void> {
    const { studyId, id: analysisId, attempt } = run;
    await this.db.transaction(async (tx) => {
      const updated = await tx.update(analyses).set({ ...values, finishedAt: new Date() })
        .where(and(eq(analyses.id, analysisId), eq(analyses.state, 'running'), eq(analyses.attempt, attempt))).returning({ id: analyses.id });
      if (!updated.length) return;
      await announceChange(tx, { id: analysisId, studyId, state: values.state!, progress: values.progress ?? 0 });
      await recordAudit(tx, await workerActor(tx, studyId), {
        action: `analysis.${values.state}`, entity: 'analysis', entityId: analysisId, studyId,
        after: { durationMs: values.durationMs, error: values.error ?? undefined, ...purposeOf(run) },
      });
    });
  }

  /** One sweep at a time per process; errors (the database away) are logged and the next sweep tries again. */
  sweep(): Promise<void> {
    this.sweeping ??= this.sweepOnce().catch((err) => logFailure('the analysis sweeper', err)).finally(() => (this.sweeping = null));
    return this.sweeping;
  }

  private async sweepOnce(): Promise<void> {
    const staleSeconds = Math.round(this.timing.staleMs / 1000);
    const lost = await this.db.select().from(analyses).where(and(eq(analyses.state, 'running'), or(
      lt(analyses.heartbeatAt, sql`now() - make_interval(secs => ${staleSeconds})`),
      and(isNull(analyses.heartbeatAt), lt(analyses.startedAt, sql`now() - make_interval(secs => ${staleSeconds})`)),
    )));
    for (const run of lost) {
      const requeued = await this.db.transaction(async (tx) => {
        const again = run.attempt < MAX_ATTEMPTS;
        const reason = `the process running it stopped (no sign of life for ${staleSeconds} s)`;
        const [changed] = await tx.update(analyses).set(again
          ? { state: 'queued', attempt: run.attempt + 1, progress: 0, startedAt: null, heartbeatAt: null }
          : { state: 'failed', finishedAt: new Date(), error: `The analysis stopped twice because ${reason}; run it again, and tell the administrator if it keeps happening` })
          .where(and(eq(analyses.id, run.id), eq(analyses.state, 'running'), eq(analyses.attempt, run.attempt))).returning();
        if (!changed) return false;
        await announceChange(tx, { id: run.id, studyId: run.studyId, state: changed.state, progress: 0 });
        await recordAudit(tx, await workerActor(tx, run.studyId), again
          ? { action: 'analysis.requeued', entity: 'analysis', entityId: run.id, studyId: run.studyId, after: { attempt: run.attempt + 1, reason, ...purposeOf(run) } }
          : { action: 'analysis.failed', entity: 'analysis', entityId: run.id, studyId: run.studyId, after: { error: changed.error, ...purposeOf(run) } });
        return again;
      });
      if (requeued) await this.enqueue(run.id);
    }
    await this.resendLostJobs();
  }

  /**
   * A queued analysis with no live job (a crash between commit and send, a job that failed before it
   * could claim its analysis) is sent again. One process at a time does this (an advisory lock), so no
   * analysis gets two jobs.
   */
  private async resendLostJobs(): Promise<void> {
    await this.db.transaction(async (tx) => {
      const { rows: [lock] } = await tx.execute<{ got: boolean }>(sql`SELECT pg_try_advisory_xact_lock(7002, 1) AS got`);
      if (!lock.got) return;
      const rows = await tx.select({ id: analyses.id }).from(analyses).where(and(
        eq(analyses.state, 'queued'), lt(analyses.queuedAt, sql`now() - interval '30 seconds'`),
        sql`NOT EXISTS (SELECT 1 FROM pgboss.job j WHERE j.name = ${QUEUE} AND j.state IN ('created', 'retry', 'active')
                        AND (j.data->>'analysisId')::int = ${analyses.id})`,
      ));
      for (const r of rows) await this.enqueue(r.id);
    });
  }

  async stop(): Promise<void> {
    if (this.sweeper) clearInterval(this.sweeper);
    this.events.off('job', this.wake);
    this.workerIds = [];
    await this.sweeping;
    await this.boss?.stop({ graceful: true, wait: true, timeout: 10_000 });
    await this.pool?.close();
    await this.events.stop();
    this.boss = null;
    this.pool = null;
  }
}

/** Events written by the queue name no person; they belong to the study's laboratory. */
async function workerActor(tx: Tx, studyId: number) {
  const [study] = await tx.select({ lab: studies.laboratoryId }).from(studies).where(eq(studies.id, studyId));
  return { id: null, name: 'analysis worker', laboratoryId: study.lab };
}

/**
 * What a failed run says to people: the engine's own words when it refused the data, or, when the worker thread
 * itself died (the thread library says only "worker exited with code: 70"), what happened and what to do.
 */
export function failureWords(err: unknown): string {
  // (an error from a worker thread comes from another realm: read its message, do not test instanceof)
  const message = typeof (err as { message?: unknown } | null)?.message === 'string' ? (err as Error).message : String(err);
  const died = /worker (?:exited|terminated)(?: with code:? *(-?\d+))?/i.exec(message);
  if (!died) return message;
  const code = died[1] !== undefined ? ` (exit code ${died[1]})` : '';
  return `The analysis worker stopped unexpectedly${code} before finishing; run the analysis again, and tell the administrator if it keeps happening`;
}
