import { eq } from 'drizzle-orm';
import type { Study } from '@shared/schemas';
import { recordAudit, type AuditInput } from '../audit/audit';
import { findUserById, updateUser } from '../auth/auth.repository';
import { registerFailure } from '../auth/auth.service';
import { isLocked } from '../auth/lockout';
import { checkPassword } from '../auth/passwords';
import { actorOf, SignedInUser } from '../auth/session-user';
import type { AppContext } from '../context';
import type { Executor, Tx } from '../db/client';
import { AppError } from '../http/app-error';
import { findStudy, StudyRow } from '../studies/studies.repository';
import { studies } from '../db/schema';
import { studyView } from '../studies/study-view';
import { notifyAuthor, notifySubmitted } from './notifications';
import { submissionProblems } from './submission-checks';
import { scopeOf } from '../db/lab-scope';

/** Runs a sign-off step in one transaction, then sends the mail it queued. */
export async function step<T>(ctx: AppContext, work: (tx: Tx) => Promise<T>): Promise<T> {
  const out = await ctx.db.transaction(work);
  ctx.mail.kick();
  return out;
}

/**
 * Submits a draft for sign-off with the technologist's optional note for the director (already trimmed; empty
 * for none): the note is kept on the study until it is returned, carried by the audit event and the directors' e-mail.
 */
export function submitStudy(ctx: AppContext, me: SignedInUser, id: number, note = ''): Promise<Study> {
  return step(ctx, async (tx) => {
    const study = await findStudy(tx, scopeOf(me), id, true);
    if (study.state !== 'draft') throw new AppError('conflict', 'Only a draft can be submitted');
    const problems = await submissionProblems(tx, study);
    if (problems.length) throw new AppError('invalid_request', `The study cannot be submitted yet: ${problems.map((p) => p.message).join('; ')}`, problems);
    const [row] = await tx.update(studies).set({
      state: 'awaiting-signoff', submittedAt: new Date(), submittedBy: me.id, submissionNote: note || null, returnedAt: null, version: study.version + 1, updatedAt: new Date(),
    }).where(eq(studies.id, id)).returning();
    await recordAudit(tx, actorOf(me), { action: 'study.submitted', entity: 'study', entityId: id, studyId: id, before: { state: study.state }, after: { state: row.state, ...(note ? { note } : {}) } });
    await notifySubmitted(tx, row, me.name, ctx.config.publicUrl, note);
    return studyView(tx, row, me);
  });
}

export function returnStudy(ctx: AppContext, me: SignedInUser, id: number, comment: string): Promise<Study> {
  return step(ctx, async (tx) => {
    const study = await awaiting(tx, me, id);
    const [row] = await tx.update(studies).set({ state: 'draft', returnedAt: new Date(), returnComment: comment, submissionNote: null, version: study.version + 1, updatedAt: new Date() })
      .where(eq(studies.id, id)).returning();
    await recordAudit(tx, actorOf(me), { action: 'study.returned', entity: 'study', entityId: id, studyId: id, reason: comment, before: { state: study.state }, after: { state: 'draft' } });
    await notifyAuthor(tx, row, 'Returned to you', [`${me.name} returned the study "${row.title}" to draft with this comment:`, '', comment], ctx.config.publicUrl);
    return studyView(tx, row, me);
  });
}

export async function awaiting(tx: Executor, me: SignedInUser, id: number): Promise<StudyRow> {
  const study = await findStudy(tx, scopeOf(me), id, true);
  if (study.state !== 'awaiting-signoff') throw new AppError('conflict', 'This study is not awaiting sign-off');
  return study;
}

/**
 * The e-signature being attempted, for the record of a refusal: what is signed (a study now; a release or
 * another record later names its own entity) and with which meaning.
 */
export interface SigningAttempt { entity: string; entityId: number; studyId: number | null; meaning: string }

/** The attempt on a study, as the sign step and the plan approval make it. */
export const studyAttempt = (studyId: number, meaning: string): SigningAttempt => ({ entity: 'study', entityId: studyId, studyId, meaning });

/**
 * The password again, checked on the server. A refusal (wrong password, or the account locked) is audited
 * as `signature.refused` on the record being signed, and a wrong password counts toward the lockout, in its
 * own committed transaction; then the request is refused.
 */
export async function confirmPassword(ctx: AppContext, me: SignedInUser, password: string, address: string, attempt: SigningAttempt): Promise<void> {
  const refused = (why: string, failures?: number): AuditInput => ({
    action: 'signature.refused', entity: attempt.entity, entityId: attempt.entityId, studyId: attempt.studyId,
    after: { why, ...(failures === undefined ? {} : { failures }), meaning: attempt.meaning, address },
  });
  const outcome = await ctx.db.transaction(async (tx) => {
    const user = await findUserById(tx, me.id);
    if (isLocked(user.lockedUntil)) {
      await recordAudit(tx, actorOf(me), refused('account locked'));
      return 'locked';
    }
    if (await checkPassword(password, user.passwordHash)) {
      if (user.failedSignIns > 0) await updateUser(tx, user.id, { failedSignIns: 0 });
      return 'ok';
    }
    await registerFailure(tx, user, address, (failures) => refused('wrong password', failures));
    return 'wrong';
  });
  if (outcome === 'locked') throw new AppError('locked', 'Your account is locked after repeated wrong passwords; ask an administrator to unlock it');
  if (outcome === 'wrong') throw new AppError('invalid_request', 'The password is wrong; the signature was not made', [{ path: 'password', message: 'The password is wrong' }]);
}
