import { and, eq } from 'drizzle-orm';
import { kindMeta } from '@shared/kinds/kinds';
import {
  CHANGE_TYPE_LABELS, keyFrom, type CreateReleaseBody, type LinkStudyBody, type Release, type Requirement, type StudyKind, type UpdateReleaseBody, type WaiverBody,
} from '@shared/schemas';
import { recordAudit } from '../audit/audit';
import { actorOf, type SignedInUser } from '../auth/session-user';
import type { Database, Tx } from '../db/client';
import { dueItems, releaseStudies, releaseWaivers, releases } from '../db/schema';
import { AppError, invalid } from '../http/app-error';
import { findLabAnalyte, findLabInstrument, findStudy, type StudyRow } from '../studies/studies.repository';
import { createStudyIn } from '../studies/studies.service';
import { findRelease, releaseView, type ReleaseRow } from './release-board';
import { templateOf } from './templates';
import { scopeOf } from '../db/lab-scope';
import { labDueItemForUpdate } from './releases.repository';

/** Keys for a custom change's requirements: a given key is kept, else one is made from the label (as the client makes it). */
function keyed(list: (Omit<Requirement, 'key'> & { key?: string })[]): Requirement[] {
  const used = new Set(list.flatMap((r) => (r.key ? [r.key] : [])));
  return list.map((r) => {
    const key = r.key ?? keyFrom(r.label, used, 'requirement');
    used.add(key);
    return { ...r, key, rule: r.rule ?? '' };
  });
}

function directorPicks(me: SignedInUser): void {
  if (!me.roles.includes('director')) throw new AppError('forbidden', 'Only a director picks the requirements of a custom change');
}

/** Refuses a change to a release that is no longer open, in words. */
function assertOpen(release: ReleaseRow, what: string, alsoNeedsReview = false): void {
  if (release.state === 'open' || (alsoNeedsReview && release.state === 'needs-review')) return;
  throw new AppError('conflict', `This release is ${release.state === 'needs-review' ? 'waiting for review' : 'signed'}; ${what} only while it is open`);
}

/**
 * Creates a release for an analyte and instrument with the requirements and re-verification rules of its change
 * type (the laboratory's template; a custom change's requirements are picked by a director). Started from a due
 * item, it marks that item as started.
 */
export function createRelease(db: Database, me: SignedInUser, body: CreateReleaseBody): Promise<Release> {
  return db.transaction(async (tx) => {
    if (!(await findLabAnalyte(tx, scopeOf(me), body.analyteId))) throw invalid('analyteId', 'Choose an analyte from the catalog');
    for (const field of ['instrumentId', 'comparativeInstrumentId'] as const) {
      const id = body[field];
      if (id && !(await findLabInstrument(tx, scopeOf(me), id))) throw invalid(field, 'Choose an instrument from the catalog');
    }
    const template = await templateOf(tx, scopeOf(me), body.changeType);
    let requirements = template.requirements;
    if (body.requirements) {
      if (body.changeType !== 'custom') throw invalid('requirements', `A ${CHANGE_TYPE_LABELS[body.changeType].toLowerCase()} takes its requirements from the laboratory's template; choose "custom" to pick them`);
      directorPicks(me);
      requirements = keyed(body.requirements);
    }
    let due: typeof dueItems.$inferSelect | undefined;
    if (body.dueItemId) {
      due = await labDueItemForUpdate(tx, scopeOf(me), body.dueItemId);
      if (!due) throw invalid('dueItemId', 'There is no such due item in this laboratory');
      if (due.state !== 'open') throw invalid('dueItemId', 'Something was already started from this due item');
    }
    const [row] = await tx.insert(releases).values(scopeOf(me).values({
      changeType: body.changeType, title: body.title, analyteId: body.analyteId, instrumentId: body.instrumentId,
      comparativeInstrumentId: body.comparativeInstrumentId ?? null, reagentLot: body.reagentLot, note: body.note, requirements,
      dueRules: template.dueRules, createdBy: me.id,
    })).returning();
    await recordAudit(tx, actorOf(me), {
      action: 'release.created', entity: 'release', entityId: row.id,
      after: { title: row.title, changeType: row.changeType, analyteId: row.analyteId, instrumentId: row.instrumentId, reagentLot: row.reagentLot, requirements: requirements.map((r) => r.label), fromDueItem: due?.id ?? null },
    });
    if (due) {
      await tx.update(dueItems).set({ state: 'started', startedReleaseId: row.id, version: due.version + 1, updatedAt: new Date() }).where(eq(dueItems.id, due.id));
      await recordAudit(tx, actorOf(me), { action: 'due.started', entity: 'release', entityId: due.releaseId, before: { state: due.state }, after: { dueItem: due.id, label: due.label, release: row.id } });
    }
    return releaseView(tx, me, row);
  });
}

/** Title, lot, note and (custom changes, directors) requirements of an open release, with its version. */
export function updateRelease(db: Database, me: SignedInUser, id: number, body: UpdateReleaseBody): Promise<Release> {
  return db.transaction(async (tx) => {
    const release = await findRelease(tx, scopeOf(me), id, true);
    assertOpen(release, 'it can be changed');
    if (release.version !== body.version) {
      throw new AppError('conflict', 'Someone else changed this release since you loaded it; reload to see their change', [
        { path: 'version', message: `You have version ${body.version}; the release is at version ${release.version}` },
      ]);
    }
    const values: Partial<typeof releases.$inferInsert> = {};
    if (body.title !== undefined) values.title = body.title;
    if (body.reagentLot !== undefined) values.reagentLot = body.reagentLot;
    if (body.note !== undefined) values.note = body.note;
    if (body.requirements) {
      if (release.changeType !== 'custom') throw invalid('requirements', 'Only a custom change has requirements picked by hand');
      directorPicks(me);
      const next = keyed(body.requirements);
      const links = await tx.select().from(releaseStudies).where(eq(releaseStudies.releaseId, id));
      const orphan = links.find((l) => !next.some((r) => r.key === l.requirementKey));
      if (orphan) throw invalid('requirements', `Study ${orphan.studyId} is linked to the requirement "${orphan.requirementKey}"; unlink it before removing the requirement`);
      values.requirements = next;
    }
    const before = Object.fromEntries(Object.keys(values).map((k) => [k, (release as Record<string, unknown>)[k]]));
    const [row] = await tx.update(releases).set({ ...values, version: release.version + 1, updatedAt: new Date() }).where(eq(releases.id, id)).returning();
    await recordAudit(tx, actorOf(me), { action: 'release.updated', entity: 'release', entityId: id, before, after: values });
    return releaseView(tx, me, row);
  });
}

function requirementOf(release: ReleaseRow, key: string): Requirement {
  const req = (release.requirements as Requirement[]).find((r) => r.key === key);
  if (!req) throw invalid('requirement', `This release has no requirement "${key}"`);
  return req;
}

/**
 * A new draft study pre-filled from a release (analyte, instrument(s), lots), for one of its requirements or for
 * a re-verification it set due. `path` names the refused field when the kind needs a comparative instrument the
 * release does not name.
 */
export async function startStudyFor(
  tx: Tx, me: SignedInUser, release: ReleaseRow, kind: StudyKind, words: { title: string; purpose: string }, path: string,
): Promise<number> {
  const pair = kindMeta(kind).instruments === 'pair';
  const lotChange = release.changeType === 'reagent-lot';
  const comparative = release.comparativeInstrumentId ?? (lotChange ? release.instrumentId : null);
  if (pair && !comparative) throw invalid(path, `A ${kindMeta(kind).label.toLowerCase()} needs a comparative instrument, and release ${release.id} names none; start it from the Studies page and link it`);
  const study = await createStudyIn(tx, me, {
    kind, ...words,
    analyteId: release.analyteId,
    ...(pair ? { comparativeInstrumentId: comparative!, candidateInstrumentId: release.instrumentId } : { instrumentId: release.instrumentId }),
    settings: lotChange
      ? { comparativeLot: 'current lot', candidateLot: release.reagentLot || 'new lot' }
      : release.reagentLot ? { candidateLot: release.reagentLot } : {},
  });
  return study.id;
}

/** Links a study to a requirement in the caller's transaction (the study must fit and belong to no release). */
export async function linkIn(tx: Tx, me: SignedInUser, release: ReleaseRow, key: string, study: StudyRow): Promise<void> {
  const req = requirementOf(release, key);
  if (!req.kinds.includes(study.kind as never)) {
    throw invalid('studyId', `Study ${study.id} is a ${kindMeta(study.kind).label.toLowerCase()}; "${req.label}" needs ${req.kinds.map((k) => kindMeta(k).label.toLowerCase()).join(' or ')}`);
  }
  if (study.analyteId !== release.analyteId) throw invalid('studyId', `Study ${study.id} is of another analyte than this release`);
  const [taken] = await tx.select().from(releaseStudies).where(eq(releaseStudies.studyId, study.id));
  if (taken) throw invalid('studyId', taken.releaseId === release.id ? `Study ${study.id} is already linked to this release` : `Study ${study.id} already belongs to release ${taken.releaseId}`);
  await tx.insert(releaseStudies).values(scopeOf(me).values({ releaseId: release.id, studyId: study.id, requirementKey: key, linkedBy: me.id }));
  await recordAudit(tx, actorOf(me), {
    action: 'release.study-linked', entity: 'release', entityId: release.id, studyId: study.id,
    after: { requirement: req.label, study: study.id, title: study.title },
  });
}

/** Links an existing study to a requirement, or starts a new draft study for it. */
export function linkStudy(db: Database, me: SignedInUser, id: number, body: LinkStudyBody): Promise<Release> {
  return db.transaction(async (tx) => {
    const release = await findRelease(tx, scopeOf(me), id, true);
    assertOpen(release, 'studies are linked', true);
    const req = requirementOf(release, body.requirement);
    let studyId: number;
    if ('start' in body) {
      if (!req.kinds.includes(body.start.kind)) throw invalid('start.kind', `"${req.label}" needs ${req.kinds.map((k) => kindMeta(k).label.toLowerCase()).join(' or ')}`);
      studyId = await startStudyFor(tx, me, release, body.start.kind, {
        title: body.start.title ?? `${release.title}: ${kindMeta(body.start.kind).label}`, purpose: `For release ${release.id}: ${release.title}`,
      }, 'start.kind');
    } else {
      studyId = body.studyId;
    }
    const study = await findStudy(tx, scopeOf(me), studyId, true).catch((err: unknown) => {
      throw err instanceof AppError && err.code === 'not_found' ? invalid('studyId', `There is no study ${studyId} in this laboratory`) : err;
    });
    await linkIn(tx, me, release, body.requirement, study);
    const [row] = await tx.update(releases).set({ version: release.version + 1, updatedAt: new Date() }).where(eq(releases.id, id)).returning();
    return releaseView(tx, me, row);
  });
}

/** Unlinks a study from an open release. */
export function unlinkStudy(db: Database, me: SignedInUser, id: number, studyId: number): Promise<Release> {
  return db.transaction(async (tx) => {
    const release = await findRelease(tx, scopeOf(me), id, true);
    assertOpen(release, 'studies are unlinked');
    const [link] = await tx.select().from(releaseStudies).where(and(eq(releaseStudies.releaseId, id), eq(releaseStudies.studyId, studyId)));
    if (!link) throw new AppError('not_found', `Study ${studyId} is not linked to this release`);
    await tx.delete(releaseStudies).where(eq(releaseStudies.id, link.id));
    await recordAudit(tx, actorOf(me), { action: 'release.study-unlinked', entity: 'release', entityId: id, studyId, before: { requirement: link.requirementKey, study: studyId } });
    const [row] = await tx.update(releases).set({ version: release.version + 1, updatedAt: new Date() }).where(eq(releases.id, id)).returning();
    return releaseView(tx, me, row);
  });
}

/** A director waives a requirement with a reason (permanent; the PDF lists it). */
export function waiveRequirement(db: Database, me: SignedInUser, id: number, body: WaiverBody): Promise<Release> {
  return db.transaction(async (tx) => {
    const release = await findRelease(tx, scopeOf(me), id, true);
    assertOpen(release, 'requirements are waived', true);
    const req = requirementOf(release, body.requirement);
    const [already] = await tx.select().from(releaseWaivers).where(and(eq(releaseWaivers.releaseId, id), eq(releaseWaivers.requirementKey, req.key)));
    if (already) throw new AppError('conflict', `"${req.label}" is already waived`);
    await tx.insert(releaseWaivers).values(scopeOf(me).values({ releaseId: id, requirementKey: req.key, reason: body.reason, waivedBy: me.id, waivedByName: me.name }));
    await recordAudit(tx, actorOf(me), { action: 'release.waived', entity: 'release', entityId: id, reason: body.reason, after: { requirement: req.label } });
    const [row] = await tx.update(releases).set({ version: release.version + 1, updatedAt: new Date() }).where(eq(releases.id, id)).returning();
    return releaseView(tx, me, row);
  });
}

export async function getRelease(db: Database, me: SignedInUser, id: number): Promise<Release> {
  return releaseView(db, me, await findRelease(db, scopeOf(me), id));
}

/**
 * After a signed study was amended: its amendment joins the same requirement, and a release that was signed
 * "released" now needs review (audited with the reason). Runs in the amendment's transaction.
 */
export async function amendedComponent(tx: Tx, me: SignedInUser, old: StudyRow, amendment: StudyRow, reason: string): Promise<void> {
  const [link] = await tx.select().from(releaseStudies).where(eq(releaseStudies.studyId, old.id));
  if (!link) return;
  const release = await findRelease(tx, scopeOf(me), link.releaseId, true);
  if (release.state === 'not-released') return;
  await linkIn(tx, me, release, link.requirementKey, amendment);
  if (release.state === 'released') {
    await tx.update(releases).set({ state: 'needs-review', version: release.version + 1, updatedAt: new Date() }).where(eq(releases.id, release.id));
    await recordAudit(tx, actorOf(me), {
      action: 'release.needs-review', entity: 'release', entityId: release.id, studyId: old.id, reason,
      before: { state: release.state }, after: { state: 'needs-review', amended: old.id, amendment: amendment.id },
    });
  }
}
