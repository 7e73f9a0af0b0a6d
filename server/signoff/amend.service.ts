import { eq } from 'drizzle-orm';
import type { PlanApprovalBody, Study } from '@shared/schemas';
import { recordAudit } from '../audit/audit';
import { actorOf, SignedInUser } from '../auth/session-user';
import type { AppContext } from '../context';
import { signatures, specimens, studies } from '../db/schema';
import { AppError } from '../http/app-error';
import { loadRows, storeInputHash } from '../specimens/input-hash';
import { findStudy, type StudyRow } from '../studies/studies.repository';
import { planFieldsOf } from '../studies/study-settings';
import { studyView } from '../studies/study-view';
import { amendedComponent } from '../releases/releases.service';
import { contentHashOf, verificationCode } from './content-hash';
import { currentPlanRun, hasSamplePlan } from '../plans/plans.service';
import { planResultsHash } from '../plans/plan-input';
import { confirmPassword, step, studyAttempt } from './signoff.service';
import { scopeOf } from '../db/lab-scope';

/** Copies a signed study into a new draft that records what it supersedes. */
export function amendStudy(ctx: AppContext, me: SignedInUser, id: number, reason: string): Promise<Study> {
  return step(ctx, async (tx) => {
    const old = await findStudy(tx, scopeOf(me), id, true);
    if (old.state !== 'signed') throw new AppError('conflict', 'Only a signed study can be amended; a draft can simply be edited');
    if (old.supersededById) throw new AppError('conflict', `This study is already superseded by study ${old.supersededById}`);
    const pending = await tx.select({ id: studies.id }).from(studies).where(eq(studies.supersedesId, id));
    if (pending.length) throw new AppError('conflict', `An amendment of this study already exists (study ${pending[0].id})`);
    const { id: _id, createdAt: _c, updatedAt: _u, submittedAt: _s, signedAt: _g, returnedAt: _r, returnComment: _rc, submissionNote: _sn, submittedBy: _sby, planApprovedAt: _p, supersededById: _sb, ...copy } = old;
    const [row] = await tx.insert(studies).values({ ...copy, title: `${old.title} (amendment)`, state: 'draft', version: 1, supersedesId: id, createdBy: me.id }).returning();
    const rows = await loadRows(tx, id);
    if (rows.length) {
      // The rows keep who entered them: copying is not entering, so segregation of duties still sees the author.
      await tx.insert(specimens).values(rows.map(({ id: _rid, studyId: _sid, ...r }) => ({ ...r, studyId: row.id })));
    }
    await storeInputHash(tx, row.id);
    await recordAudit(tx, actorOf(me), { action: 'study.amended', entity: 'study', entityId: row.id, studyId: row.id, reason, after: { supersedes: id, rows: rows.length } });
    await recordAudit(tx, actorOf(me), { action: 'study.amendment-started', entity: 'study', entityId: id, studyId: id, reason, after: { amendment: row.id } });
    // A component of a release: the amendment joins its requirement, and a released method needs review.
    await amendedComponent(tx, me, old, row, reason);
    return studyView(tx, row, me);
  });
}

function draftForPlan(study: StudyRow): StudyRow {
  if (study.state !== 'draft') throw new AppError('conflict', 'The plan can only be approved while the study is a draft');
  return study;
}

/** The director approves the plan before data: an electronic signature of its own. */
export async function approvePlan(ctx: AppContext, me: SignedInUser, id: number, body: PlanApprovalBody, address: string): Promise<Study> {
  draftForPlan(await findStudy(ctx.db, scopeOf(me), id));
  await confirmPassword(ctx, me, body.password, address, studyAttempt(id, 'plan-approved'));
  return step(ctx, async (tx) => {
    const study = draftForPlan(await findStudy(tx, scopeOf(me), id, true));
    const plan: Record<string, unknown> = Object.fromEntries(planFieldsOf(study.kind).map((f) => [f, (study.settings as Record<string, unknown>)[f]]));
    // A plan by simulation is approved with its figures: the run made from the plan as it is set now.
    if (hasSamplePlan(study)) {
      const run = await currentPlanRun(tx, study);
      if (!run) throw new AppError('conflict', 'Run the plan (Setup › Plan) before approving it: its figures are approved with it', [{ path: 'settings.samplePlan', message: 'no finished run of the plan as it is set' }]);
      plan.planRun = { analysisId: run.id, inputHash: run.inputHash, resultsHash: planResultsHash(run.results), recommendedN: (run.results as { recommendedN?: number | null }).recommendedN ?? null };
    }
    const contentHash = contentHashOf({ studyId: id, kind: study.kind, analyteId: study.analyteId, plan });
    const signedAt = new Date();
    const [sig] = await tx.insert(signatures).values({
      studyId: id, meaning: 'plan-approved', signerId: me.id, signerName: me.name, comment: body.comment, signedAt, contentHash, verificationCode: verificationCode(contentHash),
    }).returning({ id: signatures.id });
    const [row] = await tx.update(studies).set({ planApprovedAt: signedAt, version: study.version + 1, updatedAt: signedAt }).where(eq(studies.id, id)).returning();
    await recordAudit(tx, actorOf(me), { action: 'plan.approved', entity: 'signature', entityId: sig.id, studyId: id, after: { plan, contentHash, comment: body.comment } });
    return studyView(tx, row, me);
  });
}
