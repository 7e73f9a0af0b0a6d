import { and, desc, eq, inArray, ne } from 'drizzle-orm';
import { kindMeta } from '@shared/kinds/kinds';
import { serverKind } from '../kinds';
import {
  CHANGE_TYPE_LABELS, RELEASE_CAUTION, RELEASE_MEANING_WORDS, REQUIREMENT_STATUS_LABELS, type ChangeType, type CheckResult, type Release, type ReleaseIntegrityReport,
  type ReleaseSignBody,
} from '@shared/schemas';
import { addMonths } from '@shared/types/due-dates';
import { plural } from '@shared/types/plural';
import { chainOfScope, recordAudit } from '../audit/audit';
import { sha256Hex } from '../audit/canonical-json';
import { verifyChain } from '../audit/chain';
import { writeCheckpoint } from '../audit/checkpoints';
import { problemWords, studyChecks } from '../audit/integrity.service';
import { actorOf, type SignedInUser } from '../auth/session-user';
import type { AppContext } from '../context';
import type { Database, Executor, Tx } from '../db/client';
import { analyses, analytes, auditEvents, dueItems, instruments, laboratories, releaseSignatures, releases, signatures, users } from '../db/schema';
import { AppError, invalid } from '../http/app-error';
import { queueMail } from '../mail/outbox';
import { contentHashOf, verificationCode } from '../signoff/content-hash';
import { confirmPassword, step } from '../signoff/signoff.service';
import { boardOf, findRelease, mayISignRelease, releaseView, type Board, type ReleaseRow } from './release-board';
import { renderReleaseReport } from './release-pdf';
import type { ReleaseDecision, ReleaseReport, ReleaseReportRequirement } from './release-report-model';
import { scopeOf, type LabScope } from '../db/lab-scope';

/** The decision as signed (part of the content hash). */
interface SignedDecision { meaning: 'released' | 'not-released'; goLiveDate: string | null; comment: string; signerId: number; signerName: string; signedAt: string }

/** A component as the release signature binds it: the study's own signature, by its content hash. */
interface SignedComponent { requirement: string; studyId: number; meaning: string; contentHash: string; verificationCode: string }

/**
 * What a release signature binds, as canonical JSON: the release (its change, analyte, instrument, lot and
 * requirements), each component study's signature content hash, the waivers with reasons, and the decision.
 * Re-checking a release re-derives it from the stored records and re-checks each component study.
 */
export function releaseContent(release: ReleaseRow, components: SignedComponent[], waivers: Board['waivers'], decision: SignedDecision) {
  return {
    release: {
      id: release.id, laboratoryId: release.laboratoryId, changeType: release.changeType, title: release.title, analyteId: release.analyteId,
      instrumentId: release.instrumentId, comparativeInstrumentId: release.comparativeInstrumentId, reagentLot: release.reagentLot,
      requirements: release.requirements,
    },
    components,
    waivers: waivers.map((w) => ({ requirement: w.requirement, reason: w.reason, by: w.by.id, at: w.at })),
    decision,
  };
}

const componentsOf = (board: Board): SignedComponent[] => board.requirements.flatMap((r) => (r.study?.state === 'signed'
  ? [{ requirement: r.key, studyId: r.study.id, meaning: r.study.meaning!, contentHash: r.study.contentHash!, verificationCode: r.study.verificationCode! }]
  : []));

/** The due dates a "released" signature sets, from the go-live date and the release's rules. */
const dueFrom = (release: ReleaseRow, goLive: string) => (release.dueRules as { key: string; label: string; rule: string; months: number }[])
  .map((r) => ({ ...r, dueDate: addMonths(goLive, r.months) }));

/** The report the PDF prints, from the database (the board as it stands, the decision when signed). */
async function reportOf(db: Executor, release: ReleaseRow, board: Board, decision: ReleaseDecision | null, hash: string, code: string, due: { label: string; rule: string; dueDate: string }[], generatedAt: Date): Promise<ReleaseReport> {
  const [lab] = await db.select().from(laboratories).where(eq(laboratories.id, release.laboratoryId));
  const [analyte] = await db.select().from(analytes).where(eq(analytes.id, release.analyteId));
  const instrument = async (id: number | null) => {
    if (id === null) return null;
    const [i] = await db.select().from(instruments).where(eq(instruments.id, id));
    return { name: i.name, model: i.model, serial: i.serial };
  };
  const [creator] = await db.select({ name: users.name }).from(users).where(eq(users.id, release.createdBy));
  const studyIds = board.requirements.flatMap((r) => (r.study ? [r.study.id] : []));
  const sigs = studyIds.length ? await db.select({ studyId: signatures.studyId, analysisId: signatures.analysisId }).from(signatures)
    .where(and(inArray(signatures.studyId, studyIds), ne(signatures.meaning, 'plan-approved'))).orderBy(desc(signatures.id)) : [];
  const requirements: ReleaseReportRequirement[] = [];
  for (const r of board.requirements) {
    const s = r.study?.state === 'signed' ? r.study : null;
    let keyFigures: string[] = [];
    if (s) {
      const analysisId = sigs.find((g) => g.studyId === s.id)?.analysisId;
      const [analysis] = analysisId ? await db.select({ results: analyses.results, engineVersion: analyses.engineVersion }).from(analyses).where(eq(analyses.id, analysisId)) : [];
      keyFigures = keyFiguresOf(s.kind, analysis?.results, analyte.unit, analyte.decimals, analysis?.engineVersion);
    }
    requirements.push({
      label: r.label, rule: r.rule, kinds: r.kinds.map((k) => kindMeta(k).label), status: r.status, statusLabel: REQUIREMENT_STATUS_LABELS[r.status],
      study: s ? {
        id: s.id, title: s.title, kindLabel: kindMeta(s.kind).label, verdictWord: s.verdictWord, verdictSentence: s.verdictSentence, n: s.n, keyFigures,
        signerName: s.signerName!, signedAt: new Date(s.signedAt!), meaningWords: s.meaning === 'accepted' ? 'Accepted for patient testing' : 'Not accepted for patient testing',
        verificationCode: s.verificationCode!, contentHash: s.contentHash!,
      } : null,
      waiver: r.waiver ? { reason: r.waiver.reason, by: r.waiver.by.name, at: new Date(r.waiver.at) } : null,
    });
  }
  return {
    laboratory: { name: lab.name, timeZone: lab.timeZone },
    release: {
      id: release.id, title: release.title, changeTypeLabel: CHANGE_TYPE_LABELS[release.changeType as ChangeType],
      analyte: { name: analyte.name, unit: analyte.unit }, instrument: (await instrument(release.instrumentId))!, comparativeInstrument: await instrument(release.comparativeInstrumentId),
      reagentLot: release.reagentLot, note: release.note, createdBy: creator?.name ?? '', createdAt: release.createdAt,
    },
    decision, requirements, due, contentHash: hash, verificationCode: code, draft: decision === null, generatedAt,
  };
}

/** A few lines of a component's signed findings (its kind's key figures) and the engine that made them. */
function keyFiguresOf(kind: string, results: unknown, unit: string, decimals: number, engine: string | undefined): string[] {
  const own = results ? serverKind(kind).keyFigures(results, unit, decimals) : [];
  return [...own, ...(engine ? [`Analysed by ${engine}`] : [])];
}

/**
 * The director's release signature: password again, every requirement met or waived, segregation of duties as
 * for studies, a content hash over the release and each component signature's content hash, the PDF made and
 * stored with its own hash, and (released) the re-verification it sets due from the go-live date.
 */
export async function signRelease(ctx: AppContext, me: SignedInUser, id: number, body: ReleaseSignBody, address: string): Promise<Release> {
  const first = await findRelease(ctx.db, scopeOf(me), id);
  const right = await mayISignRelease(ctx.db, me, first, await boardOf(ctx.db, first));
  if (!right.allowed) throw new AppError(right.refusal ?? 'conflict', right.why);
  if (body.meaning === 'released' && !body.goLiveDate) throw invalid('goLiveDate', 'Give the go-live date: the day patient testing starts');
  await confirmPassword(ctx, me, body.password, address, { entity: 'release', entityId: id, studyId: null, meaning: body.meaning });
  return step(ctx, async (tx) => {
    const release = await findRelease(tx, scopeOf(me), id, true);
    const board = await boardOf(tx, release);
    const now = await mayISignRelease(tx, me, release, board);
    if (!now.allowed) throw new AppError(now.refusal ?? 'conflict', now.why);
    const notMet = board.requirements.filter((r) => r.status === 'not-met');
    if (body.meaning === 'released' && notMet.length) {
      throw new AppError('conflict', `It cannot be released while ${notMet.map((r) => `"${r.label}"`).join(' and ')} ${notMet.length === 1 ? 'was' : 'were'} not accepted; sign it "not released", or waive ${notMet.length === 1 ? 'it' : 'them'} with a reason`);
    }
    const goLiveDate = body.meaning === 'released' ? body.goLiveDate : null;
    const signedAt = new Date();
    const decision: SignedDecision = { meaning: body.meaning, goLiveDate, comment: body.comment, signerId: me.id, signerName: me.name, signedAt: signedAt.toISOString() };
    const content = releaseContent(release, componentsOf(board), board.waivers, decision);
    const contentHash = contentHashOf(content);
    const code = verificationCode(contentHash);
    const due = goLiveDate ? dueFrom(release, goLiveDate) : [];
    const report = await reportOf(tx, release, board, { meaning: body.meaning, meaningWords: RELEASE_MEANING_WORDS[body.meaning], signerName: me.name, signedAt, goLiveDate, comment: body.comment }, contentHash, code, due, signedAt);
    const pdf = await renderReleaseReport(report);
    const pdfSha256 = sha256Hex(pdf);
    const anchor = await writeCheckpoint(tx, chainOfScope(scopeOf(me)), `before the signature of release ${id}`);
    const [sig] = await tx.insert(releaseSignatures).values(scopeOf(me).values({
      releaseId: id, meaning: body.meaning, signerId: me.id, signerName: me.name, goLiveDate, comment: body.comment, signedAt,
      content, contentHash, verificationCode: code, pdf, pdfSha256, chainLength: anchor?.length ?? null, chainHeadHash: anchor?.headHash ?? null,
    })).returning({ id: releaseSignatures.id });
    const [row] = await tx.update(releases).set({ state: body.meaning, signedAt, version: release.version + 1, updatedAt: signedAt }).where(eq(releases.id, id)).returning();
    if (now.enteredRows) await recordAudit(tx, actorOf(me), { action: 'signature.self-sign-allowed', entity: 'release', entityId: id, reason: 'laboratory setting allows a director to sign rows they entered' });
    await recordAudit(tx, actorOf(me), {
      action: 'release.signed', entity: 'release', entityId: id,
      before: { state: release.state }, after: { state: body.meaning, meaning: body.meaning, goLiveDate, contentHash, pdfSha256, signature: sig.id, comment: body.comment, components: content.components.length },
    });
    if (goLiveDate) await setDue(tx, me, row, due);
    await notifyReleased(tx, row, me.name, body.meaning, goLiveDate, ctx.config.publicUrl);
    return releaseView(tx, me, row);
  });
}

/** The re-verification a released method sets due (a rule already set by an earlier signature of it is kept), and the due item it answered is done. */
async function setDue(tx: Tx, me: SignedInUser, release: ReleaseRow, due: { key: string; label: string; rule: string; dueDate: string }[]): Promise<void> {
  const existing = await tx.select({ ruleKey: dueItems.ruleKey }).from(dueItems).where(eq(dueItems.releaseId, release.id));
  const fresh = due.filter((d) => !existing.some((e) => e.ruleKey === d.key));
  if (fresh.length) {
    await tx.insert(dueItems).values(fresh.map((d) => ({
      laboratoryId: release.laboratoryId, releaseId: release.id, analyteId: release.analyteId, instrumentId: release.instrumentId, ruleKey: d.key, label: d.label, rule: d.rule, dueDate: d.dueDate,
    })));
    await recordAudit(tx, actorOf(me), { action: 'due.set', entity: 'release', entityId: release.id, after: { items: fresh.map((d) => `${d.label} by ${d.dueDate}`) } });
  }
  const answered = await tx.update(dueItems).set({ state: 'done', updatedAt: new Date() })
    .where(and(eq(dueItems.laboratoryId, release.laboratoryId), eq(dueItems.startedReleaseId, release.id), ne(dueItems.state, 'done'))).returning();
  for (const d of answered) await recordAudit(tx, actorOf(me), { action: 'due.done', entity: 'release', entityId: d.releaseId, after: { dueItem: d.id, label: d.label, by: `release ${release.id}` } });
}

/** Tells the release's author and the laboratory's quality officers what the director decided. */
async function notifyReleased(tx: Tx, release: ReleaseRow, by: string, meaning: 'released' | 'not-released', goLive: string | null, publicUrl: string): Promise<void> {
  const people = await tx.select().from(users).where(and(eq(users.laboratoryId, release.laboratoryId), eq(users.active, true)));
  const to = people.filter((u) => u.id === release.createdBy || u.roles.includes('quality')).map((u) => u.email);
  if (!to.length) return;
  await queueMail(tx, {
    laboratoryId: release.laboratoryId, to,
    subject: `${RELEASE_MEANING_WORDS[meaning]}: ${release.title}`,
    text: [`${by} signed the release "${release.title}": ${RELEASE_MEANING_WORDS[meaning].toLowerCase()}.`, ...(goLive ? [`Go-live date: ${goLive}`] : []), '',
      `Open the release: ${publicUrl}/releases/${release.id}`, '',
      RELEASE_CAUTION].join('\n'),
  });
}

/** The release PDF: the one stored at signing, or a DRAFT preview of the dossier as it stands. */
export async function releasePdf(db: Database, me: SignedInUser, id: number): Promise<{ bytes: Buffer; sha256: string; fileName: string }> {
  const release = await findRelease(db, scopeOf(me), id);
  const [sig] = await db.select().from(releaseSignatures).where(eq(releaseSignatures.releaseId, id)).orderBy(desc(releaseSignatures.id)).limit(1);
  if (sig?.pdf && release.state !== 'needs-review') return { bytes: sig.pdf, sha256: sig.pdfSha256 ?? sha256Hex(sig.pdf), fileName: `parallax-release-${id}-signed.pdf` };
  const board = await boardOf(db, release);
  const preview = contentHashOf({ release: release.id, version: release.version, components: componentsOf(board) });
  const bytes = await renderReleaseReport(await reportOf(db, release, board, null, preview, verificationCode(preview), [], release.updatedAt));
  return { bytes, sha256: sha256Hex(bytes), fileName: `parallax-release-${id}-draft.pdf` };
}

/**
 * Re-checks a signed release from what is stored: its content hash re-derived from the release, the component
 * studies' signatures and the waivers; its PDF bytes; the history chain and its signing event; and each component
 * study's own re-check (rows, settings, results, PDF, analysis input). Recorded as an event; changes nothing else.
 */
export async function checkReleaseIntegrity(db: Database, me: SignedInUser, id: number): Promise<ReleaseIntegrityReport> {
  const release = await findRelease(db, scopeOf(me), id);
  const [sig] = await db.select().from(releaseSignatures).where(eq(releaseSignatures.releaseId, id)).orderBy(desc(releaseSignatures.id)).limit(1);
  if (!sig) throw new AppError('conflict', 'Only a signed release can be re-checked; this one has no signature yet');
  const stored = sig.content as ReturnType<typeof releaseContent>;
  const components: ReleaseIntegrityReport['components'] = [];
  const now: SignedComponent[] = [];
  for (const c of stored.components) {
    const [own] = await db.select().from(signatures).where(and(eq(signatures.studyId, c.studyId), ne(signatures.meaning, 'plan-approved'))).orderBy(desc(signatures.id)).limit(1);
    now.push({ ...c, meaning: own?.meaning ?? '(none)', contentHash: own?.contentHash ?? '(missing)', verificationCode: own?.verificationCode ?? '(missing)' });
    const checks = await studyChecks(db, scopeOf(me), c.studyId).catch((err: Error): CheckResult[] => [{ name: 'Study', passed: false, detail: err.message }]);
    components.push({ requirement: c.requirement, studyId: c.studyId, passed: checks.every((x) => x.passed), checks });
  }
  const board = await boardOf(db, release);
  const waivers = board.waivers.filter((w) => stored.waivers.some((s) => s.requirement === w.requirement));
  const recomputed = contentHashOf(releaseContent(release, now, waivers, stored.decision));
  const checks: CheckResult[] = [{
    name: 'Content hash', passed: recomputed === sig.contentHash,
    detail: recomputed === sig.contentHash
      ? `The release, its ${plural(now.length, 'component signature')} and waivers still hash to ${sig.contentHash}, as signed.`
      : `The release, its component signatures or waivers now hash to ${recomputed}, not to the signed ${sig.contentHash}: something was changed after signing.`,
  }];
  const pdfHash = sig.pdf ? sha256Hex(sig.pdf) : '';
  checks.push({
    name: 'Signed PDF', passed: pdfHash === sig.pdfSha256,
    detail: pdfHash === sig.pdfSha256 ? `The PDF's bytes still hash to ${sig.pdfSha256}.` : `The PDF's bytes hash to ${pdfHash || '(missing)'}, not to the recorded ${sig.pdfSha256}.`,
  });
  checks.push(await historyCheck(db, scopeOf(me), id, sig));
  const failedComponents = components.filter((c) => !c.passed);
  checks.push({
    name: 'Component studies', passed: failedComponents.length === 0,
    detail: failedComponents.length === 0 ? `Each of the ${plural(components.length, 'component study', 'component studies')} passes its own re-check.`
      : `${failedComponents.map((c) => `Study ${c.studyId}`).join(', ')} ${failedComponents.length === 1 ? 'fails' : 'fail'} its own re-check.`,
  });
  const passed = checks.every((c) => c.passed);
  await db.transaction((tx) => recordAudit(tx, actorOf(me), {
    action: 'integrity.checked', entity: 'release', entityId: id, after: { passed, failed: checks.filter((c) => !c.passed).map((c) => c.name) },
  }));
  return { releaseId: id, passed, checks, components, checkedAt: new Date().toISOString() };
}

async function historyCheck(db: Executor, scope: LabScope, releaseId: number, sig: typeof releaseSignatures.$inferSelect): Promise<CheckResult> {
  const chain = await verifyChain(db, scope);
  const events = await db.select().from(auditEvents).where(scope.where(auditEvents, eq(auditEvents.entity, 'release'), eq(auditEvents.entityId, String(releaseId)), eq(auditEvents.action, 'release.signed')));
  const eventMatches = events.some((e) => (e.after as { contentHash?: string } | null)?.contentHash === sig.contentHash);
  const anchored = sig.chainLength === null || chain.hashAt(sig.chainLength) === sig.chainHeadHash;
  const name = 'History chain';
  if (chain.problems.length) return { name, passed: false, detail: `The laboratory's history chain is broken: ${problemWords(chain)}.` };
  if (!anchored) return { name, passed: false, detail: `The history no longer holds, as event ${sig.chainLength}, the event this signature was made after: the history before the signature was rewritten.` };
  if (!eventMatches) return { name, passed: false, detail: 'The history has no signing event of this release with this content hash.' };
  return { name, passed: true, detail: `All ${plural(chain.events, 'event')} of the laboratory's history are intact; the release's signing event holds the same content hash.` };
}

