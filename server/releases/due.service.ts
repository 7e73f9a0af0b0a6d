import { and, eq, inArray, sql } from 'drizzle-orm';
import { kindMeta } from '@shared/kinds/kinds';
import type { DueItem, DueQuery, StartFromDueBody, UpdateDueBody } from '@shared/schemas';
import { addDays, DUE_SOON_DAYS } from '@shared/types/due-dates';
import { recordAudit } from '../audit/audit';
import { actorOf, type SignedInUser } from '../auth/session-user';
import type { Database, Tx } from '../db/client';
import { dueItems, dueReminders, laboratories, releases, users } from '../db/schema';
import { AppError, invalid } from '../http/app-error';
import { logFailure } from '../log';
import { queueMail } from '../mail/outbox';
import { startStudyFor } from './releases.service';
import { dueView, labToday } from './due-view';
import { scopeOf, systemScope } from '../db/lab-scope';
import { dueItemsDoneByStudy, findDueItem } from './releases.repository';

/** The laboratory's due items: pending (open or started), overdue only, or all. */
export async function listDue(db: Database, me: SignedInUser, q: DueQuery): Promise<DueItem[]> {
  const parts = [q.status === 'all' ? sql`TRUE` : inArray(dueItems.state, ['open', 'started'])];
  if (q.status === 'overdue') parts.push(sql`${dueItems.dueDate} < ${await labToday(db, scopeOf(me))}`);
  if (q.releaseId) parts.push(eq(dueItems.releaseId, q.releaseId));
  return dueView(db, scopeOf(me), and(...parts)!);
}

const findDue = (tx: Tx, me: SignedInUser, id: number) => findDueItem(tx, scopeOf(me), id);

const one = async (tx: Tx, me: SignedInUser, id: number): Promise<DueItem> => (await dueView(tx, scopeOf(me), eq(dueItems.id, id)))[0];

/** A director moves a due date, with the reason (the history keeps the old date). */
export function updateDue(db: Database, me: SignedInUser, id: number, body: UpdateDueBody): Promise<DueItem> {
  return db.transaction(async (tx) => {
    const item = await findDue(tx, me, id);
    if (item.version !== body.version) throw new AppError('conflict', 'Someone else changed this due item since you loaded it; reload to see their change', [{ path: 'version', message: `You have version ${body.version}; it is at version ${item.version}` }]);
    if (item.state === 'done') throw new AppError('conflict', 'This re-verification is done; its date no longer moves');
    await tx.update(dueItems).set({ dueDate: body.dueDate, version: item.version + 1, updatedAt: new Date() }).where(eq(dueItems.id, id));
    await recordAudit(tx, actorOf(me), {
      action: 'due.moved', entity: 'release', entityId: item.releaseId, reason: body.reason,
      before: { dueItem: id, label: item.label, dueDate: item.dueDate }, after: { dueItem: id, label: item.label, dueDate: body.dueDate },
    });
    return one(tx, me, id);
  });
}

/**
 * Starts a draft study from a due item (its analyte and instrument; a comparison compares with the release's
 * comparative instrument), and links them: the item is "started" until that study is signed.
 */
export function startFromDue(db: Database, me: SignedInUser, id: number, body: StartFromDueBody): Promise<DueItem> {
  return db.transaction(async (tx) => {
    const item = await findDue(tx, me, id);
    if (item.state !== 'open') throw new AppError('conflict', 'Something was already started from this due item');
    const [release] = await tx.select().from(releases).where(eq(releases.id, item.releaseId));
    const kinds = ((release.dueRules as { key: string; kinds?: string[] }[]).find((d) => d.key === item.ruleKey)?.kinds) ?? [];
    if (kinds.length && !kinds.includes(body.kind)) throw invalid('kind', `"${item.label}" is re-verified by ${kinds.map((k) => kindMeta(k).label.toLowerCase()).join(' or ')}`);
    const studyId = await startStudyFor(tx, me, release, body.kind, {
      title: body.title ?? `${item.label}: ${release.title}`, purpose: `Re-verification due ${item.dueDate} (${item.rule || item.label}), set by release ${release.id}`,
    }, 'kind');
    await tx.update(dueItems).set({ state: 'started', startedStudyId: studyId, version: item.version + 1, updatedAt: new Date() }).where(eq(dueItems.id, id));
    await recordAudit(tx, actorOf(me), { action: 'due.started', entity: 'release', entityId: item.releaseId, studyId, before: { state: item.state }, after: { dueItem: id, label: item.label, study: studyId } });
    return one(tx, me, id);
  });
}

/** A study started from a due item was signed: the item is done (in the signature's transaction). */
export async function dueStudySigned(tx: Tx, me: SignedInUser, studyId: number): Promise<void> {
  const done = await dueItemsDoneByStudy(tx, scopeOf(me), studyId);
  for (const d of done) await recordAudit(tx, actorOf(me), { action: 'due.done', entity: 'release', entityId: d.releaseId, studyId, after: { dueItem: d.id, label: d.label, by: `study ${studyId}` } });
}

/**
 * The daily check: for each laboratory, once per its calendar day, one e-mail to its directors and quality
 * officers listing pending re-verification that is overdue or due within 30 days. `now` is the clock (a test
 * drives it); the day's row in due_reminders makes a second run that day (or another process) send nothing.
 * Returns how many laboratories were reminded.
 */
export async function sendDueReminders(db: Database, now: Date = new Date(), publicUrl = ''): Promise<number> {
  let sent = 0;
  for (const lab of await db.select().from(laboratories)) {
    const scope = systemScope(lab.id, 'the daily re-verification reminder of every laboratory');
    const day = await labToday(db, scope, now);
    const horizon = addDays(day, DUE_SOON_DAYS);
    const items = (await dueView(db, scope, and(inArray(dueItems.state, ['open', 'started']), sql`${dueItems.dueDate} <= ${horizon}`)!, now));
    if (!items.length) continue;
    const wrote = await db.transaction(async (tx) => {
      const [claimed] = await tx.insert(dueReminders).values({ laboratoryId: lab.id, day, items: items.length }).onConflictDoNothing().returning();
      if (!claimed) return false;
      const people = await tx.select().from(users).where(and(eq(users.laboratoryId, lab.id), eq(users.active, true), sql`${users.roles} && ARRAY['director','quality']::text[]`));
      if (!people.length) return false;
      const overdue = items.filter((i) => i.daysLeft < 0);
      await queueMail(tx, {
        laboratoryId: lab.id, to: people.map((p) => p.email),
        subject: `Re-verification: ${overdue.length ? `${overdue.length} overdue, ` : ''}${items.length - overdue.length} due within ${DUE_SOON_DAYS} days`,
        text: [`Re-verification due at ${lab.name} as of ${day}:`, '',
          ...items.map((i) => `- ${i.label}, ${i.analyte.name} on ${i.instrument.name}: due ${i.dueDate} (${i.dueWords})${i.state === 'started' ? ', started' : ''}. Release: ${publicUrl}/releases/${i.releaseId}`),
          '', `The Worklist lists them: ${publicUrl}/`].join('\n'),
      });
      await recordAudit(tx, { id: null, name: 'Parallax (daily check)', laboratoryId: lab.id }, { action: 'due.reminded', entity: 'due', after: { day, items: items.map((i) => i.id), to: people.map((p) => p.email) } });
      return true;
    });
    if (wrote) sent++;
  }
  return sent;
}


/** Runs the daily check every hour (once per laboratory day is kept by due_reminders); returns the stopper. */
export function scheduleDueReminders(db: Database, publicUrl: string, kick: () => void, everyMs = 60 * 60 * 1000): () => void {
  const run = () => void sendDueReminders(db, new Date(), publicUrl).then((n) => { if (n) kick(); }).catch((err) => logFailure('sending due reminders', err));
  const first = setTimeout(run, 5_000);
  const timer = setInterval(run, everyMs);
  first.unref?.();
  timer.unref?.();
  return () => { clearTimeout(first); clearInterval(timer); };
}
