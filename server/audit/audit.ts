import { desc, eq, isNull, sql } from 'drizzle-orm';
import type { Executor } from '../db/client';
import { auditEvents } from '../db/schema';
import { canonicalJson, sha256Hex } from './canonical-json';

export const GENESIS_HASH = '0'.repeat(64);

export interface Actor { id: number | null; name: string | null; laboratoryId: number | null }

export interface AuditInput {
  action: string;
  entity: string;
  entityId?: string | number | null;
  studyId?: number | null;
  before?: unknown;
  after?: unknown;
  reason?: string | null;
}

/** The fields an event's hash covers, in one canonical form (also used to verify the chain). */
export function eventHashContent(e: {
  laboratoryId: number | null; at: Date; userId: number | null; userName: string | null; studyId: number | null;
  action: string; entity: string; entityId: string | null; before: unknown; after: unknown; reason: string | null; previousHash: string;
}): string {
  return sha256Hex(canonicalJson({ ...e, at: e.at.toISOString() }));
}

/**
 * Appends one audit event inside the caller's transaction. Events of one laboratory form a chain:
 * each holds the hash of the one before. A transaction-scoped advisory lock per laboratory keeps
 * concurrent writers from forking the chain.
 */
export async function recordAudit(tx: Executor, actor: Actor, input: AuditInput): Promise<void> {
  const lab = actor.laboratoryId;
  await tx.execute(sql`SELECT pg_advisory_xact_lock(7001, ${lab ?? 0})`);
  const [last] = await tx
    .select({ hash: auditEvents.hash })
    .from(auditEvents)
    .where(lab === null ? isNull(auditEvents.laboratoryId) : eq(auditEvents.laboratoryId, lab))
    .orderBy(desc(auditEvents.id))
    .limit(1);
  const row = {
    laboratoryId: lab,
    at: new Date(),
    userId: actor.id,
    userName: actor.name,
    studyId: input.studyId ?? null,
    action: input.action,
    entity: input.entity,
    entityId: input.entityId === undefined || input.entityId === null ? null : String(input.entityId),
    before: normalise(input.before),
    after: normalise(input.after),
    reason: input.reason ?? null,
    previousHash: last?.hash ?? GENESIS_HASH,
  };
  await tx.insert(auditEvents).values({ ...row, hash: eventHashContent(row) });
}

/** Round-trips through JSON so the hashed value equals what jsonb gives back. */
const normalise = (v: unknown): unknown => (v === undefined ? null : JSON.parse(JSON.stringify(v)));
