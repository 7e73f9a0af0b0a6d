import { and, eq, lt, sql } from 'drizzle-orm';
import PgBoss from 'pg-boss';
import { recordAudit } from '../audit/audit';
import type { Database } from '../db/client';
import { analyses, studies } from '../db/schema';
import type { AnalysisInput } from '../specimens/input-hash';
import { runAnalysis } from './run-analysis';
import { AnalysisPool } from './worker-pool';

export const QUEUE = 'analysis';

/**
 * The analysis queue lives in PostgreSQL (pg-boss), so any process with `work` on can take a job:
 * the API process by default, and extra `npm run worker` processes on other machines.
 */
export class AnalysisJobs {
  private boss: PgBoss | null = null;
  private pool: AnalysisPool | null = null;
  private sweeper: NodeJS.Timeout | null = null;

  constructor(private readonly db: Database, private readonly url: string) {}

  async start(options: { work: boolean } = { work: true }): Promise<void> {
    if (this.boss) return;
    const boss = new PgBoss({ connectionString: this.url, max: 4, schema: 'pgboss' });
    boss.on('error', (err) => console.error('[parallax] job queue:', err.message));
    await boss.start();
    await boss.createQueue(QUEUE);
    this.boss = boss;
    if (options.work) {
      this.pool = new AnalysisPool();
      await boss.work<{ analysisId: number }>(QUEUE, { batchSize: 1, pollingIntervalSeconds: 0.5 }, async ([job]) => this.execute(job.data.analysisId));
      this.sweeper = setInterval(() => void this.requeueStale(), 60_000);
      this.sweeper.unref();
      await this.requeueStale();
    }
  }

  /** Called after the transaction that inserted the queued analysis has committed. */
  async enqueue(analysisId: number): Promise<void> {
    if (!this.boss) throw new Error('the job queue is not started');
    await this.boss.send(QUEUE, { analysisId }, { singletonKey: String(analysisId), retryLimit: 0, expireInMinutes: 30 });
  }

  /** Runs one analysis: queued → running → done (results) or failed (the error in words). */
  async execute(analysisId: number, options: { inThread?: boolean } = {}): Promise<void> {
    const [claimed] = await this.db.update(analyses).set({ state: 'running', startedAt: new Date(), progress: 0 })
      .where(and(eq(analyses.id, analysisId), eq(analyses.state, 'queued'))).returning();
    if (!claimed) return;
    const started = Date.now();
    try {
      const progress = (f: number) => {
        void this.db.update(analyses).set({ progress: f }).where(and(eq(analyses.id, analysisId), eq(analyses.state, 'running')));
      };
      const input = claimed.input as AnalysisInput;
      const results = options.inThread ? runAnalysis(input) : await this.pool!.run(input, progress);
      await this.finish(claimed.studyId, analysisId, { state: 'done', results, progress: 1, durationMs: Date.now() - started });
    } catch (err) {
      await this.finish(claimed.studyId, analysisId, { state: 'failed', error: (err as Error).message, durationMs: Date.now() - started });
    }
  }

  private async finish(studyId: number, analysisId: number, values: Partial<typeof analyses.$inferInsert>): Promise<void> {
    await this.db.transaction(async (tx) => {
      await tx.update(analyses).set({ ...values, finishedAt: new Date() }).where(eq(analyses.id, analysisId));
      const [study] = await tx.select({ lab: studies.laboratoryId }).from(studies).where(eq(studies.id, studyId));
      await recordAudit(tx, { id: null, name: 'analysis worker', laboratoryId: study.lab }, {
        action: `analysis.${values.state}`, entity: 'analysis', entityId: analysisId, studyId,
        after: { durationMs: values.durationMs, error: values.error ?? undefined },
      });
    });
  }

  /** A queued analysis whose job was lost (a crash between commit and send) is sent again. */
  private async requeueStale(): Promise<void> {
    const stale = await this.db.select({ id: analyses.id }).from(analyses)
      .where(and(eq(analyses.state, 'queued'), lt(analyses.queuedAt, sql`now() - interval '30 seconds'`)));
    for (const s of stale) await this.enqueue(s.id).catch(() => undefined);
  }

  async stop(): Promise<void> {
    if (this.sweeper) clearInterval(this.sweeper);
    await this.boss?.stop({ graceful: true, wait: true, timeout: 10_000 });
    await this.pool?.close();
    this.boss = null;
    this.pool = null;
  }
}
