import { and, desc, eq, ne } from 'drizzle-orm';
import type { ChainCheckReport, CheckResult, IntegrityReport } from '@shared/schemas';
import { actorOf, SignedInUser } from '../auth/session-user';
import type { Database, Executor } from '../db/client';
import { analyses, auditEvents, signatures } from '../db/schema';
import { AppError } from '../http/app-error';
import { analysedFields, analysedSettings, inputHash, loadRows, type AnalysisInput } from '../specimens/input-hash';
import { findStudy } from '../studies/studies.repository';
import { contentHashOf, signedContent } from '../signoff/content-hash';
import { recordAudit } from './audit';
import { sha256Hex } from './canonical-json';
import { verifyChain, type ChainReport } from './chain';
import { plural } from '@shared/types/plural';
import { scopeOf, type LabScope } from '../db/lab-scope';

/**
 * Re-checks a signed study from what is stored: the content hash over rows, settings and results
 * against the signature, the PDF bytes against their hash, the analysis input against the rows,
 * and the laboratory's audit chain. Each check is reported in words.
 */
export async function checkIntegrity(db: Database, me: SignedInUser, studyId: number): Promise<IntegrityReport> {
  const checks = await studyChecks(db, scopeOf(me), studyId);
  const passed = checks.every((c) => c.passed);
  await db.transaction((tx) => recordAudit(tx, actorOf(me), {
    action: 'integrity.checked', entity: 'study', entityId: studyId, studyId, after: { passed, failed: checks.filter((c) => !c.passed).map((c) => c.name) },
  }));
  return { studyId, passed, checks, checkedAt: new Date().toISOString() };
}

/** The re-checks of one signed study, in words (a release's re-check runs them for each component). */
export async function studyChecks(db: Executor, scope: LabScope, studyId: number): Promise<CheckResult[]> {
  const study = await findStudy(db, scope, studyId);
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
  const now = inputHash({ kind: study.kind, settings: analysedSettings(study.settings, study.kind), rows: (await loadRows(db, studyId)).map(analysedFields) });
  // The input kept with the analysis is what the reproducibility re-check re-runs: it must still hash to the recorded hash too.
  const kept = inputHash(analysis.input as AnalysisInput) === analysis.inputHash;
  checks.push({
    name: 'Analysis input', passed: now === analysis.inputHash && kept,
    detail: now !== analysis.inputHash ? 'The stored rows or settings differ from those the signed analysis used.'
      : !kept ? 'The input stored with the signed analysis no longer hashes to its recorded input hash: it was changed after the analysis ran.'
        : 'The signed analysis was made from exactly the rows and settings stored now.',
  });
  checks.push(await historyCheck(db, scope, studyId, sig));
  return checks;
}

/** Up to three problems in words, and how many more. */
export function problemWords(report: ChainReport): string {
  const [first, ...rest] = report.problems;
  const shown = [first, ...rest.slice(0, 2)].join('; ');
  return rest.length > 2 ? `${shown}; and ${rest.length - 2} more problems` : shown;
}

/**
 * The laboratory's history chain is intact (keyed hashes, signed head, checkpoints), it still holds,
 * at the position the signature recorded, the event it was made after, and its signing event carries
 * the signature's content hash.
 */
async function historyCheck(db: Executor, scope: LabScope, studyId: number, sig: typeof signatures.$inferSelect): Promise<CheckResult> {
  const chain = await verifyChain(db, scope);
  const signedEvent = (await db.select().from(auditEvents).where(and(eq(auditEvents.studyId, studyId), eq(auditEvents.action, 'study.signed'))))[0];
  const eventMatches = (signedEvent?.after as { contentHash?: string } | null)?.contentHash === sig.contentHash;
  const anchored = sig.chainLength === null || chain.hashAt(sig.chainLength) === sig.chainHeadHash;
  const name = 'History chain';
  if (chain.problems.length) return { name, passed: false, detail: `The laboratory's history chain is broken: ${problemWords(chain)}.` };
  if (!anchored) return { name, passed: false, detail: `The history no longer holds, as event ${sig.chainLength}, the event this signature was made after: the history before the signature was rewritten.` };
  if (!eventMatches) return { name, passed: false, detail: 'The history has no signing event with this content hash.' };
  return {
    name, passed: true,
    detail: `All ${plural(chain.events, 'event')} of the laboratory's history are intact, keyed and chained up to its signed newest event${sig.chainLength ? `; event ${sig.chainLength}, which the signature was made after, is unchanged` : ''}; the signing event holds the same content hash.`,
  };
}

/**
 * The quality officer's re-check of the history itself: the laboratory's chain, and the chain of events
 * that belong to no laboratory (sign-ins of unknown e-mails, rate limits), which no study re-check covers.
 * Recorded as an event; it changes nothing else.
 */
export async function checkChains(db: Database, me: SignedInUser): Promise<ChainCheckReport> {
  const checks: CheckResult[] = [];
  for (const [name, lab, whose] of [['Laboratory history', scopeOf(me), 'the laboratory\'s history'], ['History without a laboratory', null, 'the history of events that belong to no laboratory (sign-ins of unknown e-mails, rate limits)']] as const) {
    const chain = await verifyChain(db, lab);
    checks.push(chain.problems.length
      ? { name, passed: false, detail: `${chain.problems.length === 1 ? 'One problem' : `${chain.problems.length} problems`} in ${whose}: ${problemWords(chain)}.` }
      : { name, passed: true, detail: `All ${plural(chain.events, 'event')} of ${whose} are intact, keyed and chained up to its signed newest event; every checkpoint still matches.` });
  }
  const passed = checks.every((c) => c.passed);
  await db.transaction((tx) => recordAudit(tx, actorOf(me), { action: 'history.checked', entity: 'audit', after: { passed, failed: checks.filter((c) => !c.passed).map((c) => c.name) } }));
  return { passed, checks, checkedAt: new Date().toISOString() };
}
