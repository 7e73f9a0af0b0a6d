import { asc, eq, isNull } from 'drizzle-orm';
import type { Executor } from '../db/client';
import { auditEvents } from '../db/schema';
import { eventHashContent, GENESIS_HASH } from './audit';

export interface ChainReport { events: number; broken: { id: number; why: string }[] }

/**
 * Walks a laboratory's whole chain in order: each event's hash must match its content, and each
 * must hold the hash of the event before it. One changed, removed or inserted event breaks it.
 */
export async function verifyLabChain(db: Executor, laboratoryId: number | null): Promise<ChainReport> {
  const events = await db.select().from(auditEvents)
    .where(laboratoryId === null ? isNull(auditEvents.laboratoryId) : eq(auditEvents.laboratoryId, laboratoryId))
    .orderBy(asc(auditEvents.id));
  const broken: ChainReport['broken'] = [];
  let previous = GENESIS_HASH;
  for (const e of events) {
    const { id, hash, ...content } = e;
    if (e.previousHash !== previous) broken.push({ id, why: 'does not follow the event before it (an event was removed or inserted)' });
    if (eventHashContent(content) !== hash) broken.push({ id, why: 'its content no longer matches its hash (it was changed)' });
    previous = hash;
  }
  return { events: events.length, broken };
}
