import { desc, eq, isNull, sql } from 'drizzle-orm';
import type { Executor } from '../db/client';
import { auditChainHeads, auditEvents } from '../db/schema';
import { auditKey, keyedHash } from './audit-key';
import { canonicalJson, sha256Hex } from './canonical-json';
import { labIdOf, type LabScope } from '../db/lab-scope';

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

/** What an event's hash covers. */
export interface EventContent {
  laboratoryId: number | null; at: Date; userId: number | null; userName: string | null; studyId: number | null;
  action: string; entity: string; entityId: string | null; before: unknown; after: unknown; reason: string | null; previousHash: string;
  keyId: string | null;
}

/**
 * An event's hash: HMAC-SHA-256 with the server key over its canonical content (key id included).
 * Events written before the chain was keyed (keyId null) keep their plain SHA-256; the chain check
 * accepts them only before the first keyed event.
 */
export function eventHash(e: EventContent): string {
  const { keyId, ...content } = e;
  const text = canonicalJson({ ...content, at: e.at.toISOString() });
  return keyId === null ? sha256Hex(text) : keyedHash(canonicalJson({ ...content, at: e.at.toISOString(), keyId }));
}

/** The name of an event's chain: each laboratory's, and one for events with no laboratory (failed sign-ins of unknown e-mails). */
export const chainOf = (laboratoryId: number | null): string => (laboratoryId === null ? 'system' : `lab:${laboratoryId}`);

/** The chain of a scope's laboratory; null: the chain of events that belong to no laboratory. */
export const chainOfScope = (scope: LabScope | null): string => chainOf(scope === null ? null : labIdOf(scope));

/** The signed text of a chain head or checkpoint. */
export const headMac = (h: { chain: string; length: number; headId: number; headHash: string }): string =>
  keyedHash(canonicalJson({ chain: h.chain, length: h.length, headId: h.headId, headHash: h.headHash }));

/**
 * Appends one audit event inside the caller's transaction. Events of one laboratory form a chain:
 * each holds the hash of the one before, keyed with the server's secret, and the chain's signed head
 * (length, newest event, its hash) is moved forward in the same transaction. A transaction-scoped
 * advisory lock per chain keeps concurrent writers from forking it.
 */
export async function recordAudit(tx: Executor, actor: Actor, input: AuditInput): Promise<void> {
  const lab = actor.laboratoryId;
  const chain = chainOf(lab);
  await tx.execute(sql`SELECT pg_advisory_xact_lock(7001, ${lab ?? 0})`);
  const [last] = await tx.select({ hash: auditEvents.hash }).from(auditEvents)
    .where(lab === null ? isNull(auditEvents.laboratoryId) : eq(auditEvents.laboratoryId, lab))
    .orderBy(desc(auditEvents.id)).limit(1);
  const content: EventContent = {
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
    keyId: auditKey().id,
  };
  const hash = eventHash(content);
  const [event] = await tx.insert(auditEvents).values({ ...content, hash }).returning({ id: auditEvents.id });
  const length = await chainLengthBefore(tx, chain, lab) + 1;
  const head = { chain, laboratoryId: lab, length, headId: event.id, headHash: hash, keyId: auditKey().id, updatedAt: new Date() };
  await tx.insert(auditChainHeads).values({ ...head, mac: headMac(head) })
    .onConflictDoUpdate({ target: auditChainHeads.chain, set: { length, headId: event.id, headHash: hash, keyId: head.keyId, mac: headMac(head), updatedAt: head.updatedAt } });
}

/** The chain's length from its signed head, or counted once for a chain that has none yet (written before heads existed). */
async function chainLengthBefore(tx: Executor, chain: string, lab: number | null): Promise<number> {
  const [head] = await tx.select({ length: auditChainHeads.length }).from(auditChainHeads).where(eq(auditChainHeads.chain, chain));
  if (head) return head.length;
  const [{ n }] = await tx.select({ n: sql<number>`count(*)::int - 1` }).from(auditEvents)
    .where(lab === null ? isNull(auditEvents.laboratoryId) : eq(auditEvents.laboratoryId, lab));
  return n;
}

/** Round-trips through JSON so the hashed value equals what jsonb gives back. */
const normalise = (v: unknown): unknown => (v === undefined ? null : JSON.parse(JSON.stringify(v)));
