import { eq } from 'drizzle-orm';
import type { SignBody, Study } from '@shared/schemas';
import { scopeOf } from '../db/lab-scope';
import { chainOfScope, recordAudit } from '../audit/audit';
import { writeCheckpoint } from '../audit/checkpoints';
import { sha256Hex } from '../audit/canonical-json';
import { actorOf, SignedInUser } from '../auth/session-user';
import type { AppContext } from '../context';
import type { Executor } from '../db/client';
import { signatures, studies } from '../db/schema';
import { AppError } from '../http/app-error';
import type { StudyRow } from '../studies/studies.repository';
import { findingsOf, studyView } from '../studies/study-view';
import { contentHashOf, signedContent, verificationCode } from './content-hash';
import { dueStudySigned } from '../releases/due.service';
import { notifyAuthor } from './notifications';
import { awaiting, confirmPassword, step, studyAttempt } from './signoff.service';
import { renderStudyPdf } from './study-pdf';
import { mayISign, type SigningRight } from './who-may-sign';

/** The sign-off rule (`who-may-sign.ts`) as a refusal: 403 with the reason in words. */
async function mayISignNow(db: Executor, me: SignedInUser, study: StudyRow): Promise<SigningRight> {
  const right = await mayISign(db, me, study);
  if (!right.allowed) throw new AppError('forbidden', right.why);
  return right;
}

export const MEANING_WORDS = { accepted: 'Accepted for patient testing', 'not-accepted': 'Not accepted for patient testing' } as const;

/**
 * The director's electronic signature: password again, segregation of duties, a content hash over
 * rows, settings, results and engine version, the PDF made and stored with its own hash, and the
 * study locked for good (the database refuses later changes too).
 */
export async function signStudy(ctx: AppContext, me: SignedInUser, id: number, body: SignBody, address: string): Promise<Study> {
  // Who may sign is settled before the password is asked for (and again under the lock, below).
  await mayISignNow(ctx.db, me, await awaiting(ctx.db, me, id));
  await confirmPassword(ctx, me, body.password, address, studyAttempt(id, body.meaning));
  return step(ctx, async (tx) => {
    const study = await awaiting(tx, me, id);
    const right = await mayISignNow(tx, me, study);
    const findings = await findingsOf(tx, study);
    if (!findings.currentId) throw new AppError('conflict', 'The findings are not current; return the study so it can be re-analysed');
    const content = await signedContent(tx, study, findings.currentId);
    const contentHash = contentHashOf(content);
    const signedAt = new Date();
    const signature = {
      studyId: id, analysisId: findings.currentId, meaning: body.meaning, signerId: me.id, signerName: me.name, comment: body.comment,
      signedAt, contentHash, verificationCode: verificationCode(contentHash),
    };
    const pdf = await renderStudyPdf(tx, study, findings.currentId, { ...signature, draft: false });
    const pdfSha256 = sha256Hex(pdf);
    // The laboratory's history as it stood just before this signature: a signed checkpoint, and its length and newest hash kept with the signature.
    const anchor = await writeCheckpoint(tx, chainOfScope(scopeOf(me)), `before the signature of study ${id}`);
    const [sig] = await tx.insert(signatures).values({ ...signature, pdf, pdfSha256, chainLength: anchor?.length ?? null, chainHeadHash: anchor?.headHash ?? null })
      .returning({ id: signatures.id });
    const [row] = await tx.update(studies).set({ state: 'signed', signedAt, version: study.version + 1, updatedAt: signedAt }).where(eq(studies.id, id)).returning();
    if (study.supersedesId) await tx.update(studies).set({ supersededById: id }).where(eq(studies.id, study.supersedesId));
    // A study started from a re-verification due item completes it.
    await dueStudySigned(tx, me, id);
    if (right.enteredRows) await recordAudit(tx, actorOf(me), { action: 'signature.self-sign-allowed', entity: 'study', entityId: id, studyId: id, reason: 'laboratory setting allows a director to sign rows they entered' });
    await recordAudit(tx, actorOf(me), {
      action: 'study.signed', entity: 'signature', entityId: sig.id, studyId: id,
      before: { state: study.state }, after: { state: 'signed', meaning: body.meaning, contentHash, pdfSha256, analysisId: findings.currentId, comment: body.comment },
    });
    await notifyAuthor(tx, row, 'Signed', [`${me.name} signed the study "${row.title}": ${MEANING_WORDS[body.meaning]}.`, body.comment ? `Comment: ${body.comment}` : ''], ctx.config.publicUrl);
    return studyView(tx, row, me);
  });
}
