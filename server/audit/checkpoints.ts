import { desc, eq } from 'drizzle-orm';
import type { Database, Executor } from '../db/client';
import { auditChainHeads, auditCheckpoints } from '../db/schema';
import { logFailure } from '../log';
import { headMac } from './audit';

export interface ChainPosition { length: number; headHash: string }

/**
 * Writes a signed checkpoint of a chain as it stands (in the caller's transaction) and returns its
 * length and newest hash; null for a chain that has no signed head yet. Checkpoints are append-only
 * (the database refuses to change them) and signed, so a later re-check finds events that were
 * removed or rewritten since.
 */
export async function writeCheckpoint(tx: Executor, chain: string, reason: string): Promise<ChainPosition | null> {
  const [head] = await tx.select().from(auditChainHeads).where(eq(auditChainHeads.chain, chain));
  if (!head) return null;
  const mark = { chain, laboratoryId: head.laboratoryId, length: head.length, headId: head.headId, headHash: head.headHash, at: new Date(), reason, keyId: head.keyId };
  await tx.insert(auditCheckpoints).values({ ...mark, mac: headMac(mark) });
  return { length: head.length, headHash: head.headHash };
}

/** A checkpoint of every chain that moved since its last one (run daily by the API process). */
export async function checkpointAll(db: Database): Promise<number> {
  let written = 0;
  for (const head of await db.select().from(auditChainHeads)) {
    const [last] = await db.select({ length: auditCheckpoints.length }).from(auditCheckpoints)
      .where(eq(auditCheckpoints.chain, head.chain)).orderBy(desc(auditCheckpoints.id)).limit(1);
    if (last?.length === head.length) continue;
    await db.transaction((tx) => writeCheckpoint(tx, head.chain, 'daily checkpoint'));
    written++;
  }
  return written;
}

/** Checkpoints now and then every `everyMs` (a day by default); failures (the database away) are logged and retried next time. */
export function scheduleCheckpoints(db: Database, everyMs = 24 * 3600_000): () => void {
  const run = () => void checkpointAll(db).catch((err) => logFailure('writing history checkpoints', err));
  run();
  const timer = setInterval(run, everyMs);
  timer.unref();
  return () => clearInterval(timer);
}
