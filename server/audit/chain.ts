import { asc, eq, isNull } from 'drizzle-orm';
import type { Executor } from '../db/client';
import { auditChainHeads, auditCheckpoints, auditEvents } from '../db/schema';
import { auditKey } from './audit-key';
import { chainOfScope, eventHash, GENESIS_HASH, headMac } from './audit';
import type { LabScope } from '../db/lab-scope';
import { labTimeZone } from '../db/lab-zone';
import { laboratoryTime } from '@shared/types/lab-time';
import { plural } from '@shared/types/plural';

export interface ChainReport {
  chain: string;
  events: number;
  /** What is wrong, in words; empty when the chain is intact. */
  problems: string[];
  /** Each event's hash by its position (1-based) in the chain, for checking anchors such as signatures. */
  hashAt: (position: number) => string | undefined;
}


/**
 * Walks one history chain in order and says what is wrong with it, in words:
 * - each event must hold the hash of the one before (a removed or inserted event breaks this);
 * - each event's keyed hash must match its content (a changed event breaks this, and without the
 *   server's key nobody can make a matching hash again; an event re-hashed without the key after the
 *   chain was keyed is named as rewritten);
 * - the chain's signed head must name its newest event and its length (removing the newest events,
 *   which leaves the rest of the chain intact, breaks this);
 * - every signed checkpoint must still find its event, with its hash, at its position.
 */
export async function verifyChain(db: Executor, scope: LabScope | null): Promise<ChainReport> {
  const chain = chainOfScope(scope);
  const key = auditKey();
  const events = await db.select().from(auditEvents)
    .where(scope === null ? isNull(auditEvents.laboratoryId) : scope.where(auditEvents))
    .orderBy(asc(auditEvents.id));
  // Times in the problems are the laboratory's (the chain of events outside any laboratory reads UTC).
  const zone = scope === null ? 'UTC' : await labTimeZone(db, scope);
  const when = (d: Date) => laboratoryTime(d, zone);
  const problems: string[] = [];
  let previous = GENESIS_HASH;
  let keyed = false;
  for (const e of events) {
    const { id, hash, ...content } = e;
    const what = `event ${id} (${e.action}, ${when(e.at)})`;
    if (e.previousHash !== previous) problems.push(`${what} does not follow the event before it: an event was removed or inserted`);
    if (e.keyId === null && keyed) problems.push(`${what} carries a hash made without the server key, although the events before it are keyed: it was rewritten outside Parallax`);
    else if (e.keyId !== null && e.keyId !== key.id) problems.push(`${what} was chained with another key (${e.keyId}); this server holds key ${key.id}, so it cannot vouch for it`);
    else if (eventHash(content) !== hash) problems.push(`${what} no longer matches its hash: it was changed after it was written`);
    keyed ||= e.keyId !== null;
    previous = hash;
  }
  if (keyed) problems.push(...(await headProblems(db, chain, events)));
  problems.push(...(await checkpointProblems(db, chain, events, when)));
  return { chain, events: events.length, problems, hashAt: (p) => events[p - 1]?.hash };
}

type EventRow = typeof auditEvents.$inferSelect;

async function headProblems(db: Executor, chain: string, events: EventRow[]): Promise<string[]> {
  const [head] = await db.select().from(auditChainHeads).where(eq(auditChainHeads.chain, chain));
  if (!head) return ['the signed record of the chain\'s newest event is missing: it was removed outside Parallax'];
  if (head.keyId !== auditKey().id || head.mac !== headMac(head)) return ['the signed record of the chain\'s newest event was altered outside Parallax'];
  const last = events[events.length - 1];
  if (head.length > events.length) {
    const missing = plural(head.length - events.length, 'event was', 'events were');
    return [events.some((e) => e.id === head.headId)
      ? `${missing} removed from the chain: it holds ${events.length}, its signed record counts ${head.length}`
      : `the newest ${missing} removed: the chain ends at event ${last?.id ?? '(none)'}, but its signed record says ${plural(head.length, 'event')} ending at event ${head.headId}`];
  }
  if (head.length < events.length) return [`${plural(events.length - head.length, 'event was', 'events were')} added after the chain's newest signed event ${head.headId} outside Parallax`];
  if (last.id !== head.headId || last.hash !== head.headHash) return [`the chain's newest event ${last.id} is not the one its signed record names (event ${head.headId})`];
  return [];
}

async function checkpointProblems(db: Executor, chain: string, events: EventRow[], when: (d: Date) => string): Promise<string[]> {
  const out: string[] = [];
  for (const cp of await db.select().from(auditCheckpoints).where(eq(auditCheckpoints.chain, chain)).orderBy(asc(auditCheckpoints.id))) {
    const at = events[cp.length - 1];
    if (cp.keyId !== auditKey().id || cp.mac !== headMac(cp)) out.push(`the checkpoint of ${when(cp.at)} was altered outside Parallax`);
    else if (!at) out.push(`the checkpoint of ${when(cp.at)} (${cp.reason}) counted ${plural(cp.length, 'event')}, but the chain now has ${events.length}: events were removed`);
    else if (at.id !== cp.headId || at.hash !== cp.headHash) out.push(`the chain no longer matches the checkpoint of ${when(cp.at)} (${cp.reason}) at event ${cp.headId}`);
  }
  return out;
}
