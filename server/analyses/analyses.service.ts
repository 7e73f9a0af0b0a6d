import { eq } from 'drizzle-orm';
import { ENGINE_VERSION } from '@shared/stats/engine';
import { recordAudit } from '../audit/audit';
import { actorOf, SignedInUser } from '../auth/session-user';
import type { Database, Executor, Tx } from '../db/client';
import { analyses, studies } from '../db/schema';
import { AppError, notFound } from '../http/app-error';
import { analysisInput, inputHash, knownInputHash } from '../specimens/input-hash';
import { findStudy } from '../studies/studies.repository';
import { assertEditable } from '../studies/study-rules';
import { StudySettings, type Analysis } from '@shared/schemas';
import { missingResults } from './run-analysis';
import { withRecordedWords } from './recorded-words';
import type { AnalysisJobs } from './analysis-jobs';
import { scopeOf } from '../db/lab-scope';
import { findLabAnalysis } from './analyses.repository';

type AnalysisRow = Omit<typeof analyses.$inferSelect, 'input'>;

export async function analysisView(db: Executor, a: AnalysisRow, hash?: string): Promise<Analysis> {
  const current = a.inputHash === (hash ?? (await knownInputHash(db, (await db.select().from(studies).where(eq(studies.id, a.studyId)))[0])));
  return {
    id: a.id, studyId: a.studyId, state: a.state as Analysis['state'], progress: a.progress, engineVersion: a.engineVersion, seed: a.seed,
    resamples: a.resamples, inputHash: a.inputHash, current, results: a.results ?? null, error: a.error,
    queuedAt: a.queuedAt.toISOString(), startedAt: a.startedAt?.toISOString() ?? null, finishedAt: a.finishedAt?.toISOString() ?? null, durationMs: a.durationMs,
  };
}

/** Inserts a queued analysis of the study's current rows and settings (in the caller's transaction). */
async function insertQueued(tx: Tx, me: SignedInUser, studyId: number) {
  const study = await findStudy(tx, scopeOf(me), studyId, true);
  assertEditable(study);
  const input = await analysisInput(tx, study);
  const included = input.rows.filter((r) => !r.excluded).length;
  if (included < 3) throw new AppError('invalid_request', `An analysis needs at least 3 included rows; the study has ${included}`, [{ path: 'rows', message: 'too few rows' }]);
  const missing = missingResults(input);
  if (missing.length) throw new AppError('invalid_request', missing[0], missing.map((m) => ({ path: 'rows', message: m })));
  const settings = StudySettings.parse(study.settings);
  const hash = inputHash(input);
  const [row] = await tx.insert(analyses).values({
    studyId, state: 'queued', inputHash: hash, input, engineVersion: ENGINE_VERSION, seed: settings.seed, resamples: settings.resamples, requestedBy: me.id,
  }).returning();
  await recordAudit(tx, actorOf(me), { action: 'analysis.queued', entity: 'analysis', entityId: row.id, studyId, after: { inputHash: hash, seed: settings.seed, resamples: settings.resamples, engineVersion: ENGINE_VERSION } });
  return { row, hash };
}

/** Queues an analysis; the job runs after commit in a worker. */
export async function queueAnalysis(db: Database, jobs: AnalysisJobs, me: SignedInUser, studyId: number): Promise<Analysis> {
  const queued = await db.transaction(async (tx) => {
    const { row, hash } = await insertQueued(tx, me, studyId);
    return analysisView(tx, row, hash);
  });
  await jobs.enqueue(queued.id);
  return queued;
}

/** Runs an analysis in this thread and waits for it (demo seeding and command-line use). */
export async function analyseNow(db: Database, jobs: AnalysisJobs, me: SignedInUser, studyId: number): Promise<void> {
  const { row } = await db.transaction((tx) => insertQueued(tx, me, studyId));
  await jobs.execute(row.id, { inThread: true });
}

export async function getAnalysis(db: Database, me: SignedInUser, id: number): Promise<Analysis> {
  const row = await findLabAnalysis(db, scopeOf(me), id);
  if (!row) throw notFound('Analysis');
  const view = await analysisView(db, row.a, row.studyHash ?? undefined);
  return { ...view, results: withRecordedWords(view.results, row.settings) };
}
