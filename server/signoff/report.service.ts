import { asc, eq } from 'drizzle-orm';
import type { Signature } from '@shared/schemas';
import { sha256Hex } from '../audit/canonical-json';
import type { SignedInUser } from '../auth/session-user';
import type { Database } from '../db/client';
import { signatures } from '../db/schema';
import { findStudy } from '../studies/studies.repository';
import { findingsOf } from '../studies/study-view';
import { contentHashOf, signedContent, verificationCode } from './content-hash';
import { renderStudyPdf } from './study-pdf';
import { scopeOf } from '../db/lab-scope';

const WORDS: Record<string, string> = {
  'plan-approved': 'Plan approved', accepted: 'Accepted for patient testing', 'not-accepted': 'Not accepted for patient testing',
};

export async function listSignatures(db: Database, me: SignedInUser, id: number): Promise<Signature[]> {
  await findStudy(db, scopeOf(me), id);
  const rows = await db.select().from(signatures).where(eq(signatures.studyId, id)).orderBy(asc(signatures.id));
  return rows.map((s) => ({
    id: s.id, meaning: s.meaning as Signature['meaning'], meaningWords: WORDS[s.meaning] ?? s.meaning, signerName: s.signerName, comment: s.comment,
    signedAt: s.signedAt.toISOString(), contentHash: s.contentHash, verificationCode: s.verificationCode, pdfSha256: s.pdfSha256, analysisId: s.analysisId,
  }));
}

/** A signed study answers the bytes stored at signing; any other a fresh preview marked DRAFT. */
export async function studyReport(db: Database, me: SignedInUser, id: number): Promise<{ bytes: Buffer; sha256: string; fileName: string }> {
  const study = await findStudy(db, scopeOf(me), id);
  const base = `parallax-study-${id}`;
  if (study.state === 'signed') {
    const [sig] = (await db.select().from(signatures).where(eq(signatures.studyId, id))).filter((s) => s.meaning !== 'plan-approved');
    return { bytes: sig.pdf!, sha256: sig.pdfSha256!, fileName: `${base}-signed.pdf` };
  }
  const findings = await findingsOf(db, study);
  const analysisId = findings.currentId ?? null;
  const contentHash = analysisId ? contentHashOf(await signedContent(db, study, analysisId)) : '0'.repeat(64);
  const bytes = await renderStudyPdf(db, study, analysisId, { draft: true, contentHash, verificationCode: verificationCode(contentHash) });
  return { bytes, sha256: sha256Hex(bytes), fileName: `${base}-draft.pdf` };
}
