import { and, asc, desc, eq, inArray, ne, sql } from 'drizzle-orm';
import { kindMeta, KIND_METAS } from '@shared/kinds/kinds';
import {
  RELEASE_CAUTION, RELEASE_MEANING_WORDS, type BoardRequirement, type ComponentStudy, type MayISign, type Release, type ReleaseMeaning,
  type ReleaseSignature, type Requirement, type RequirementStatus, type StudyKind, type StudyState, type Waiver,
} from '@shared/schemas';
import { judgedStudies } from '../audit/archive.service';
import type { SignedInUser } from '../auth/session-user';
import type { Executor } from '../db/client';
import { analytes, dueItems, instruments, laboratories, releaseSignatures, releaseStudies, releaseWaivers, signatures, specimens, users } from '../db/schema';
import { dueView } from './due-view';
import { scopeOf } from '../db/lab-scope';

import type { ReleaseRow } from './releases.repository';
export { findRelease, type ReleaseRow } from './releases.repository';

const VERDICT_BY_KEY = new Map(KIND_METAS.flatMap((m) => m.verdicts.map((v) => [v.key, v] as const)));

/** The studies linked to a release, as the board shows them, by requirement key (newest first). */
async function linkedStudies(db: Executor, release: ReleaseRow): Promise<Map<string, ComponentStudy[]>> {
  const links = await db.select().from(releaseStudies).where(eq(releaseStudies.releaseId, release.id)).orderBy(desc(releaseStudies.studyId));
  const judged = new Map((await judgedStudies(db, release.laboratoryId, links.map((l) => l.studyId))).map((j) => [j.id, j]));
  const sigs = links.length
    ? await db.select().from(signatures).where(and(inArray(signatures.studyId, links.map((l) => l.studyId)), ne(signatures.meaning, 'plan-approved'))).orderBy(desc(signatures.id))
    : [];
  const out = new Map<string, ComponentStudy[]>();
  for (const link of links) {
    const j = judged.get(link.studyId);
    if (!j) continue;
    const sig = sigs.find((s) => s.studyId === link.studyId);
    const verdict = j.verdict ? VERDICT_BY_KEY.get(j.verdict) : undefined;
    const view: ComponentStudy = {
      id: j.id, kind: j.kind as StudyKind, title: j.title, state: j.state as StudyState, superseded: j.superseded,
      verdict: j.verdict, verdictWord: verdict?.word ?? null, verdictSentence: verdict?.sentence ?? null, n: j.n,
      signerName: sig?.signerName ?? null, signedAt: sig?.signedAt.toISOString() ?? null, meaning: sig?.meaning ?? null,
      verificationCode: sig?.verificationCode ?? null, contentHash: sig?.contentHash ?? null,
    };
    out.set(link.requirementKey, [...(out.get(link.requirementKey) ?? []), view]);
  }
  return out;
}

/** Where a requirement stands, from the study now meeting it and any waiver. */
export function requirementStatus(study: ComponentStudy | null, waived: boolean): RequirementStatus {
  if (study?.state === 'signed' && study.meaning === 'accepted') return 'met';
  if (waived) return 'waived';
  if (study?.state === 'signed') return 'not-met';
  return study ? 'in-progress' : 'missing';
}

export interface Board {
  requirements: BoardRequirement[];
  waivers: Waiver[];
  blockers: string[];
}

/** The board of a release: each requirement with its current study (newest linked, not superseded), waiver and status. */
export async function boardOf(db: Executor, release: ReleaseRow): Promise<Board> {
  const linked = await linkedStudies(db, release);
  const waiverRows = await db.select().from(releaseWaivers).where(eq(releaseWaivers.releaseId, release.id)).orderBy(asc(releaseWaivers.id));
  const waivers: Waiver[] = waiverRows.map((w) => ({ requirement: w.requirementKey, reason: w.reason, by: { id: w.waivedBy, name: w.waivedByName }, at: w.waivedAt.toISOString() }));
  const requirements = (release.requirements as Requirement[]).map((r): BoardRequirement => {
    const list = linked.get(r.key) ?? [];
    const study = list.find((s) => !s.superseded) ?? null;
    const waiver = waivers.find((w) => w.requirement === r.key) ?? null;
    return { ...r, status: requirementStatus(study, waiver !== null), study, linked: list, waiver };
  });
  const blockers = requirements.length ? requirements.flatMap((r) => blockerOf(r)) : ['This release has no requirements yet: a director picks them'];
  return { requirements, waivers, blockers };
}

function blockerOf(r: BoardRequirement): string[] {
  if (r.status === 'missing') return [`${r.label}: no study linked yet, and not waived`];
  if (r.status === 'in-progress') {
    const state = r.study!.state === 'awaiting-signoff' ? 'awaits sign-off' : 'is a draft';
    return [`${r.label}: study ${r.study!.id} ${state}`];
  }
  return [];
}

/**
 * The answer for one person: whether they may sign now, why in words, whether they entered rows of a component
 * (allowed only by the laboratory's setting, and audited), and, when not, whether the refusal is of the person
 * (403) or of the release's state (409).
 */
export interface SigningRight extends MayISign { enteredRows: boolean; refusal?: 'forbidden' | 'conflict' }

/**
 * Whether this person may sign the release now, and why in words: a director, the release open or needing review,
 * every requirement closed, and segregation of duties as for studies (not a director who entered rows of a
 * component study, unless the laboratory allows one-person sign-off).
 */
export async function mayISignRelease(db: Executor, me: SignedInUser, release: ReleaseRow, board: Board): Promise<SigningRight> {
  if (!['open', 'needs-review'].includes(release.state)) {
    return { allowed: false, enteredRows: false, refusal: 'conflict', why: 'This release is signed; a new change needs a new release (an amended component makes it need review).' };
  }
  if (board.blockers.length) return { allowed: false, enteredRows: false, refusal: 'conflict', why: `It can be signed once every requirement is met by a signed study or waived: ${board.blockers.join('; ')}.` };
  const ids = board.requirements.flatMap((r) => (r.study ? [r.study.id] : []));
  const [lab] = await db.select({ allowSelfSign: laboratories.allowSelfSign }).from(laboratories).where(eq(laboratories.id, release.laboratoryId));
  const entered = ids.length
    ? (await db.select({ n: sql<number>`count(*)::int` }).from(specimens).where(and(inArray(specimens.studyId, ids), eq(specimens.enteredBy, me.id))))[0].n > 0
    : false;
  if (!me.roles.includes('director')) return { allowed: false, enteredRows: entered, refusal: 'forbidden', why: 'A director signs the release.' };
  if (entered && !lab.allowSelfSign) return { allowed: false, enteredRows: true, refusal: 'forbidden', why: 'You entered rows of a study in this release; another director signs it (segregation of duties).' };
  return {
    allowed: true, enteredRows: entered,
    why: entered ? 'You entered rows of a study in this release; this laboratory allows one-person sign-off, so you may sign it, and the history records that you did.' : 'You may sign it: every requirement is met or waived.',
  };
}

export const releaseSignatureView = (s: typeof releaseSignatures.$inferSelect): ReleaseSignature => ({
  id: s.id, meaning: s.meaning as ReleaseMeaning, meaningWords: RELEASE_MEANING_WORDS[s.meaning as ReleaseMeaning], signerName: s.signerName,
  signedAt: s.signedAt.toISOString(), goLiveDate: s.goLiveDate, comment: s.comment, contentHash: s.contentHash, verificationCode: s.verificationCode, pdfSha256: s.pdfSha256,
});

const ref = async (db: Executor, table: typeof analytes | typeof instruments, id: number | null) => {
  if (id === null) return null;
  const [row] = await db.select({ id: table.id, name: table.name }).from(table).where(eq(table.id, id));
  return row ?? null;
};

/** The whole release as the board page reads it. */
export async function releaseView(db: Executor, me: SignedInUser, release: ReleaseRow): Promise<Release> {
  const board = await boardOf(db, release);
  const sigRows = await db.select().from(releaseSignatures).where(eq(releaseSignatures.releaseId, release.id)).orderBy(desc(releaseSignatures.id));
  const latest = sigRows[0];
  const [creator] = await db.select({ id: users.id, name: users.name }).from(users).where(eq(users.id, release.createdBy));
  const due = await dueView(db, scopeOf(me), eq(dueItems.releaseId, release.id));
  // The due item this release answers: the one it was started from (the item keeps the link).
  const [from] = await db.select({ id: dueItems.id, label: dueItems.label }).from(dueItems).where(eq(dueItems.startedReleaseId, release.id));
  const right = await mayISignRelease(db, me, release, board);
  return {
    id: release.id, changeType: release.changeType as Release['changeType'], title: release.title, analyte: (await ref(db, analytes, release.analyteId))!,
    instrument: (await ref(db, instruments, release.instrumentId))!, comparativeInstrument: await ref(db, instruments, release.comparativeInstrumentId),
    reagentLot: release.reagentLot, note: release.note, state: release.state as Release['state'], version: release.version,
    met: board.requirements.filter((r) => r.status === 'met' || r.status === 'waived').length, required: board.requirements.length,
    signerName: latest?.signerName ?? null, signedAt: latest?.signedAt.toISOString() ?? null, goLiveDate: latest?.goLiveDate ?? null,
    verificationCode: latest?.verificationCode ?? null, createdBy: creator, createdAt: release.createdAt.toISOString(), updatedAt: release.updatedAt.toISOString(),
    requirements: board.requirements, waivers: board.waivers, ready: board.blockers.length === 0, blockers: board.blockers,
    signatures: sigRows.map(releaseSignatureView), due,
    reviewReasons: release.state === 'needs-review' ? reviewReasons(board) : [],
    fromDueItem: from ?? null, mayISign: { allowed: right.allowed, why: right.why }, caution: RELEASE_CAUTION,
  };
}

/** Why a release needs review: the components amended since it was signed. */
function reviewReasons(board: Board): string[] {
  return board.requirements.flatMap((r) => (r.linked.length > 1
    ? [`${r.label}: study ${r.linked.at(-1)!.id} was amended after the release (now study ${r.linked[0].id}, ${r.linked[0].state === 'signed' ? 'signed' : 'not yet signed'})`]
    : []));
}

