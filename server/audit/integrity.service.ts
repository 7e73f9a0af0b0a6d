import { and, desc, eq, ne } from 'drizzle-orm';
import type { CheckResult, IntegrityReport } from '../../shared/schemas';
import { actorOf, SignedInUser } from '../auth/session-user';
import type { Database } from '../db/client';
import { analyses, auditEvents, signatures } from '../db/schema';
import { AppError } from '../http/app-error';
import { analysedFields, analysedSettings, inputHash, loadRows } from '../specimens/input-hash';
import { findStudy } from '../studies/studies.repository';
import { contentHashOf, signedContent } from '../signoff/content-hash';
import { recordAudit } from './audit';
import { sha256Hex } from './canonical-json';
import { verifyLabChain } from './chain';

/**
 * Re-checks a signed study from what is stored: the content hash over rows, settings and results
 * against the signature, the PDF bytes against their hash, the analysis input against the rows,
 * and the laboratory's audit chain. Each check is reported in words.
 */
export async function checkIntegrity(db: Database, me: SignedInUser, studyId: number): Promise<IntegrityReport> {
  const study = await findStudy(db, me.laboratoryId, studyId);
  const [sig] = await db.select().from(signatures).where(and(eq(signatures.studyId, studyId), ne(signatures.meaning, 'plan-approved'))).orderBy(desc(signatures.id)).limit(1);
  if (!sig || study.state !== 'signed') throw new AppError('conflict', 'Only a signed study can be re-checked; this one has no signature yet');
  const checks: CheckResult[] = [];
  const recomputed = contentHashOf(await signedContent(db, study, sig.analysisId!));
  checks.push({
    name: 'Content hash', passed: recomputed === sig.contentHash,
    detail: recomputed === sig.contentHash ? `The rows, settings and results still hash to ${sig.contentHash}, as signed.`
      : `The stored rows, settings or results now hash to ${recomputed}, not to the signed ${sig.contentHash}: the record was changed after signing.`,
  });
  const pdfHash = sig.pdf ? sha256Hex(sig.pdf) : '';
  checks.push({
    name: 'Signed PDF', passed: pdfHash === sig.pdfSha256,
    detail: pdfHash === sig.pdfSha256 ? `The PDF's bytes still hash to ${sig.pdfSha256}.` : `The PDF's bytes hash to ${pdfHash || '(missing)'}, not to the recorded ${sig.pdfSha256}.`,
  });
  const [analysis] = await db.select().from(analyses).where(eq(analyses.id, sig.analysisId!));
  const now = inputHash({ kind: study.kind, settings: analysedSettings(study.settings), rows: (await loadRows(db, studyId)).map(analysedFields) });
  checks.push({
    name: 'Analysis input', passed: now === analysis.inputHash,
    detail: now === analysis.inputHash ? 'The signed analysis was made from exactly the rows and settings stored now.' : 'The stored rows or settings differ from those the signed analysis used.',
  });
  const chain = await verifyLabChain(db, me.laboratoryId);
  const signedEvent = (await db.select().from(auditEvents).where(and(eq(auditEvents.studyId, studyId), eq(auditEvents.action, 'study.signed'))))[0];
  const eventMatches = (signedEvent?.after as { contentHash?: string } | null)?.contentHash === sig.contentHash;
  checks.push({
    name: 'History chain', passed: chain.broken.length === 0 && eventMatches,
    detail: chain.broken.length
      ? `The laboratory's history chain is broken at ${chain.broken.length} event(s): event ${chain.broken[0].id} ${chain.broken[0].why}.`
      : eventMatches ? `All ${chain.events} events of the laboratory's history are intact and chained; the signing event holds the same content hash.`
        : 'The history has no signing event with this content hash.',
  });
  const passed = checks.every((c) => c.passed);
  await db.transaction((tx) => recordAudit(tx, actorOf(me), {
    action: 'integrity.checked', entity: 'study', entityId: studyId, studyId, after: { passed, failed: checks.filter((c) => !c.passed).map((c) => c.name) },
  }));
  return { studyId, passed, checks, checkedAt: new Date().toISOString() };
}
