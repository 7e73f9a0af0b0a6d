import { and, desc, eq, ne } from 'drizzle-orm';
import type { ReproduceReport } from '@shared/schemas';
import { ENGINE_VERSION } from '@shared/stats/engine';
import { runAnalysis } from '../analyses/run-analysis';
import { actorOf, SignedInUser } from '../auth/session-user';
import type { Database } from '../db/client';
import { analyses, signatures } from '../db/schema';
import { AppError } from '../http/app-error';
import type { AnalysisInput } from '../specimens/input-hash';
import { findStudy } from '../studies/studies.repository';
import { recordAudit } from './audit';
import { diffJson } from './json-diff';
import { scopeOf } from '../db/lab-scope';

/** Re-runs the signed analysis (before signing: the latest finished one) from its stored input, seed and resamples and compares every field. */
export async function reproduceStudy(db: Database, me: SignedInUser, studyId: number): Promise<ReproduceReport> {
  const study = await findStudy(db, scopeOf(me), studyId);
  const [sig] = await db.select().from(signatures).where(and(eq(signatures.studyId, studyId), ne(signatures.meaning, 'plan-approved'))).orderBy(desc(signatures.id)).limit(1);
  const latest = sig ? null : (await db.select({ id: analyses.id }).from(analyses).where(and(eq(analyses.studyId, studyId), eq(analyses.purpose, 'findings'), eq(analyses.state, 'done'))).orderBy(desc(analyses.id)).limit(1))[0];
  const analysisId = sig?.analysisId ?? latest?.id ?? null;
  if (!analysisId) throw new AppError('conflict', 'This study has no finished analysis to reproduce');
  const [analysis] = await db.select().from(analyses).where(eq(analyses.id, analysisId));
  const recomputed = JSON.parse(JSON.stringify(runAnalysis(analysis.input as AnalysisInput)));
  const { differences, leaves } = diffJson(analysis.results, recomputed);
  const sameEngine = analysis.engineVersion === ENGINE_VERSION;
  const identical = differences.length === 0;
  const summary = identical
    ? `All ${leaves} result fields are identical when re-run with seed ${analysis.seed} and ${analysis.resamples.toLocaleString('en-US')} resamples${sameEngine ? '' : `, although the engine is now ${ENGINE_VERSION} (signed with ${analysis.engineVersion})`}.`
    : `${differences.length} of ${leaves} result fields differ${sameEngine ? ' with the same engine version: investigate' : `: the engine changed from ${analysis.engineVersion} to ${ENGINE_VERSION}`}.`;
  await db.transaction((tx) => recordAudit(tx, actorOf(me), {
    action: 'reproduce.checked', entity: 'study', entityId: studyId, studyId, after: { identical, differences: differences.length, engine: ENGINE_VERSION },
  }));
  return { studyId, analysisId, identical, storedEngine: analysis.engineVersion, currentEngine: ENGINE_VERSION, sameEngine, fieldsCompared: leaves, differences: differences.slice(0, 200), summary };
}
