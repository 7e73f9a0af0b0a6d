import { methodComparisonMeta } from '@shared/kinds/method-comparison/meta';
import { planOptionPath, planOptionsFor, type SamplePlan } from '@shared/kinds/method-comparison/sample-plan';
import { parseKindSettings } from '@shared/kinds/settings';
import type { ImprecisionSuggestion, StudyPlan } from '@shared/schemas';
import { ENGINE_VERSION } from '@shared/stats/engine';
import { OptionError } from '@shared/stats/options';
import { resolveComparisonPlan } from '@shared/stats/plan-comparison';
import type { PrecisionResult } from '@shared/stats/precision-types';
import { analysisView } from '../analyses/analyses.service';
import type { AnalysisJobs } from '../analyses/analysis-jobs';
import { recordAudit } from '../audit/audit';
import { actorOf, type SignedInUser } from '../auth/session-user';
import type { Database, Executor, Tx } from '../db/client';
import { analyses } from '../db/schema';
import { AppError } from '../http/app-error';
import { findStudy, type StudyRow } from '../studies/studies.repository';
import { assertEditable } from '../studies/study-rules';
import { planInputHash, type PlanInput } from './plan-input';
import { ownerScope, scopeOf, type LabScope } from '../db/lab-scope';
import { includedComparativeValues, labStudyKind, latestSignedPrecision, planRuns, sameAnalyteStudies } from './plans.repository';

type Problem = { path: string; message: string };

/** Only a method comparison is planned by simulation (reference intervals plan in closed form on Setup). */
const PLANNED_KIND = methodComparisonMeta.kind;

/**
 * The plan's input as the study's settings give it now, or the problems (each naming its Setup field) that keep it
 * from running. An earlier study's comparative values are read here, so the run's input holds the values drawn.
 */
export async function planInputOf(db: Executor, study: StudyRow): Promise<{ input: PlanInput | null; problems: Problem[] }> {
  if (study.kind !== PLANNED_KIND) return { input: null, problems: [{ path: 'kind', message: 'Only a method comparison is planned by simulation' }] };
  const settings = parseKindSettings(study.kind, study.settings) as ReturnType<typeof parseKindSettings> & { samplePlan: SamplePlan | null };
  const plan = settings.samplePlan;
  if (!plan) return { input: null, problems: [{ path: 'settings.samplePlan', message: 'Set the plan: the imprecision of each method, the range and the numbers of specimens to try' }] };
  let values: number[] | null = null;
  if (plan.shape === 'earlier-study') {
    values = await comparativeValuesOf(db, ownerScope(study), plan.earlierStudyId!, study.id);
    if (!values) return { input: null, problems: [{ path: 'settings.samplePlan.earlierStudyId', message: `settings.samplePlan.earlierStudyId: study ${plan.earlierStudyId} is not a method comparison of this laboratory with at least 10 comparative values` }] };
  }
  const options = planOptionsFor(settings, values)!;
  try {
    resolveComparisonPlan(options);
  } catch (error) {
    if (!(error instanceof OptionError)) throw error;
    const path = planOptionPath(error.option);
    return { input: null, problems: [{ path, message: `${path}: ${error.message.replace(/^option \S+ /, '')}` }] };
  }
  return { input: { kind: 'plan-comparison', plan: options }, problems: [] };
}

/** The included comparative values of another method comparison of the laboratory (at least 10), or null. */
async function comparativeValuesOf(db: Executor, scope: LabScope, id: number, self: number): Promise<number[] | null> {
  if (id === self) return null;
  if (await labStudyKind(db, scope, id) !== PLANNED_KIND) return null;
  const values = await includedComparativeValues(db, id);
  return values.length >= 10 ? values : null;
}

/** The finished run of the plan as it is set now (what plan approval and the report cover), or null. */
export async function currentPlanRun(db: Executor, study: StudyRow): Promise<typeof analyses.$inferSelect | null> {
  if (study.kind !== PLANNED_KIND) return null;
  const { input } = await planInputOf(db, study);
  return input ? (await planRuns(db, study, planInputHash(input))).current : null;
}

/** Whether the study has a plan set (then approval needs its current run). */
export const hasSamplePlan = (study: StudyRow): boolean =>
  study.kind === PLANNED_KIND && (study.settings as { samplePlan?: unknown }).samplePlan != null;

export async function getPlan(db: Database, me: SignedInUser, id: number): Promise<StudyPlan> {
  const study = await findStudy(db, scopeOf(me), id);
  if (study.kind !== PLANNED_KIND) throw new AppError('invalid_request', 'Only a method comparison is planned by simulation; reference intervals show their plan on Setup', [{ path: 'kind', message: 'not a method comparison' }]);
  const { input, problems } = await planInputOf(db, study);
  const hash = input ? planInputHash(input) : null;
  const { latest, current } = await planRuns(db, study, hash);
  const shown = latest && latest.state !== 'done' ? latest : (current ?? latest);
  return {
    problems,
    // `current` of the run: made from the plan as it is set now (not from the rows, which a plan never reads).
    latest: shown ? await analysisView(db, shown, hash ?? '') : null,
    current: !!current && shown?.id === current.id,
    imprecision: {
      comparative: await imprecisionFrom(db, study, study.comparativeInstrumentId),
      candidate: await imprecisionFrom(db, study, study.candidateInstrumentId),
    },
    earlierStudies: await earlierStudies(db, study),
  };
}

/** Queues a simulation of the plan as it is set; the job runs after commit in a worker, as an analysis does. */
export async function queuePlan(db: Database, jobs: AnalysisJobs, me: SignedInUser, id: number): Promise<StudyPlan> {
  await jobs.enqueue(await db.transaction((tx) => insertPlanRun(tx, me, id)));
  return getPlan(db, me, id);
}

/** Runs the plan in this thread and waits for it (demo seeding). */
export async function planNow(db: Database, jobs: AnalysisJobs, me: SignedInUser, id: number): Promise<void> {
  await jobs.execute(await db.transaction((tx) => insertPlanRun(tx, me, id)), { inThread: true });
}

/** Inserts a queued plan run of the plan as it is set, with its audit event (in the caller's transaction). */
async function insertPlanRun(tx: Tx, me: SignedInUser, id: number): Promise<number> {
  const study = await findStudy(tx, scopeOf(me), id, true);
  assertEditable(study);
  const { input, problems } = await planInputOf(tx, study);
  if (!input) throw new AppError('invalid_request', problems[0].message, problems);
  const resolved = resolveComparisonPlan(input.plan);
  const hash = planInputHash(input);
  const [row] = await tx.insert(analyses).values({
    studyId: id, purpose: 'plan', state: 'queued', inputHash: hash, input, engineVersion: ENGINE_VERSION, seed: resolved.seed, resamples: resolved.resamples, requestedBy: me.id,
  }).returning();
  await recordAudit(tx, actorOf(me), {
    action: 'plan.queued', entity: 'analysis', entityId: row.id, studyId: id,
    after: { inputHash: hash, seed: resolved.seed, simulations: resolved.simulations, n: resolved.n, resamples: resolved.resamples, regression: resolved.regression, engineVersion: ENGINE_VERSION },
  });
  return row.id;
}

/**
 * The imprecision a signed precision study of the same analyte on this instrument found (the latest signed and
 * not superseded), per material, and what the panel fills in: the largest within-laboratory CV and SD.
 */
async function imprecisionFrom(db: Executor, study: StudyRow, instrumentId: number | null): Promise<ImprecisionSuggestion | null> {
  if (instrumentId === null) return null;
  const found = await latestSignedPrecision(db, ownerScope(study), study.analyteId, instrumentId);
  const materials = (found?.results as PrecisionResult | null)?.materials
    ?.filter((m) => Number.isFinite(m.withinLab?.sd) && Number.isFinite(m.withinLab?.cv))
    .map((m) => ({ name: m.name, mean: m.mean, sd: m.withinLab.sd, cv: m.withinLab.cv }));
  if (!found || !materials?.length) return null;
  return {
    studyId: found.id, title: found.title, instrument: found.instrument, signedAt: found.signedAt!.toISOString(), materials,
    cv: Math.max(...materials.map((m) => m.cv)), sd: Math.max(...materials.map((m) => m.sd)),
  };
}

/** Method comparisons of the same analyte with at least 10 included comparative values, newest first. */
async function earlierStudies(db: Executor, study: StudyRow): Promise<StudyPlan['earlierStudies']> {
  const rows = await sameAnalyteStudies(db, ownerScope(study), study, PLANNED_KIND);
  return rows.filter((r) => r.n >= 10);
}
